// @vitest-environment node
import { describe, expect, it } from 'vitest';
import { renderToStaticMarkup } from 'react-dom/server';
import { NotebookView } from '@/components/notebook/NotebookView';

describe('NotebookView on the server (print views, no DOM)', () => {
  it('renders a stored entry to markup without a browser environment', () => {
    expect(typeof document).toBe('undefined');
    const html = renderToStaticMarkup(
      <NotebookView
        doc={{
          type: 'doc',
          content: [
            { type: 'heading', attrs: { level: 3 }, content: [{ type: 'text', text: 'Filling' }] },
            { type: 'taskList', content: [{ type: 'taskItem', attrs: { checked: true }, content: [{ type: 'paragraph', content: [{ type: 'text', text: 'Jars inverted' }] }] }] },
            { type: 'paragraph', content: [{ type: 'text', text: '<script>alert(1)</script>' }] },
          ],
        }}
      />,
    );
    expect(html).toContain('<h3>Filling</h3>');
    // Source: The Unicode Standard, Miscellaneous Symbols block — U+2611 BALLOT BOX WITH CHECK.
    expect(html).toContain('\u2611');
    expect(html).toContain('Jars inverted');
    expect(html).not.toMatch(/<script/i);
  });
});
