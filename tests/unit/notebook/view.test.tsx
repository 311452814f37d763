// @vitest-environment jsdom
import { afterEach, describe, expect, it } from 'vitest';
import { cleanup, render, screen } from '@testing-library/react';
import { renderToStaticMarkup } from 'react-dom/server';
import { NotebookView } from '@/components/notebook/NotebookView';

afterEach(cleanup);

const UPLOAD_SRC = '/api/v1/uploads/3f0c8a52-6a1e-4b8e-9d2a-1c5e7b9f0a11';

/** An invented write-up of a trial, using every node type the notebook offers. */
const TRIAL_WRITEUP = {
  type: 'doc',
  content: [
    { type: 'heading', attrs: { level: 2 }, content: [{ type: 'text', text: 'Cook of variant B' }] },
    { type: 'paragraph', content: [{ type: 'text', text: 'Set was ' }, { type: 'text', marks: [{ type: 'bold' }], text: 'firm' }, { type: 'text', text: ' after 24 h.' }] },
    { type: 'bulletList', content: [{ type: 'listItem', content: [{ type: 'paragraph', content: [{ type: 'text', text: 'Less foam' }] }] }] },
    { type: 'orderedList', attrs: { start: 1, type: null }, content: [{ type: 'listItem', content: [{ type: 'paragraph', content: [{ type: 'text', text: 'Weigh fruit' }] }] }] },
    {
      type: 'taskList',
      content: [
        { type: 'taskItem', attrs: { checked: true }, content: [{ type: 'paragraph', content: [{ type: 'text', text: 'Refractometer read' }] }] },
        { type: 'taskItem', attrs: { checked: false }, content: [{ type: 'paragraph', content: [{ type: 'text', text: 'Label jars' }] }] },
      ],
    },
    {
      type: 'table',
      content: [
        { type: 'tableRow', content: [
          { type: 'tableHeader', attrs: { colspan: 1, rowspan: 1, colwidth: null }, content: [{ type: 'paragraph', content: [{ type: 'text', text: 'Jar' }] }] },
          { type: 'tableHeader', attrs: { colspan: 1, rowspan: 1, colwidth: null }, content: [{ type: 'paragraph', content: [{ type: 'text', text: 'Brix' }] }] },
        ] },
        { type: 'tableRow', content: [
          { type: 'tableCell', attrs: { colspan: 1, rowspan: 1, colwidth: null }, content: [{ type: 'paragraph', content: [{ type: 'text', text: '1' }] }] },
          { type: 'tableCell', attrs: { colspan: 1, rowspan: 1, colwidth: null }, content: [{ type: 'paragraph', content: [{ type: 'text', text: '65.2' }] }] },
        ] },
      ],
    },
    { type: 'image', attrs: { src: UPLOAD_SRC, alt: 'jar-b.jpg' } },
    { type: 'paragraph', content: [{ type: 'text', marks: [{ type: 'link', attrs: { href: 'https://example.org/method' } }], text: 'method notes' }] },
  ],
};

describe('NotebookView', () => {
  it('renders headings, lists, task items, a table and an image through the schema', () => {
    const { container } = render(<NotebookView doc={TRIAL_WRITEUP} />);
    expect(screen.getByRole('heading', { level: 2, name: 'Cook of variant B' })).toBeTruthy();
    expect(container.querySelector('strong')?.textContent).toBe('firm');
    expect(container.querySelector('ul li')?.textContent).toBe('Less foam');
    expect(container.querySelector('ol li')?.textContent).toBe('Weigh fruit');
    // Source: The Unicode Standard, Miscellaneous Symbols block — U+2610 BALLOT BOX, U+2611 BALLOT BOX WITH CHECK.
    const tasks = container.querySelectorAll('li[data-checked]');
    expect([...tasks].map((t) => t.textContent)).toEqual(['\u2611Refractometer read', '\u2610Label jars']);
    expect([...container.querySelectorAll('th')].map((c) => c.textContent)).toEqual(['Jar', 'Brix']);
    expect([...container.querySelectorAll('td')].map((c) => c.textContent)).toEqual(['1', '65.2']);
    const img = screen.getByRole('img', { name: 'jar-b.jpg' });
    expect(img.getAttribute('src')).toBe(UPLOAD_SRC);
    expect(img.closest('a')?.getAttribute('href')).toBe(UPLOAD_SRC);
    expect(screen.getByRole('link', { name: 'method notes' }).getAttribute('href')).toBe('https://example.org/method');
  });

  it('shows markup-looking text as text: no <script>, no onerror, even in server-rendered HTML', () => {
    // Source: OWASP Cross Site Scripting Prevention Cheat Sheet — the classic payloads it lists.
    const hostile = {
      type: 'doc',
      content: [
        { type: 'paragraph', content: [{ type: 'text', text: '<script>alert(1)</script>' }] },
        { type: 'paragraph', content: [{ type: 'text', text: '<img src=x onerror=alert(1)>' }] },
        { type: 'script', content: [{ type: 'text', text: 'alert(2)' }] },
        { type: 'image', attrs: { src: UPLOAD_SRC, alt: 'ok', onerror: 'alert(3)' } },
        { type: 'image', attrs: { src: 'javascript:alert(4)', alt: 'bad' } },
        { type: 'paragraph', content: [{ type: 'text', marks: [{ type: 'link', attrs: { href: 'javascript:alert(5)' } }], text: 'click' }] },
      ],
    };
    const { container } = render(<NotebookView doc={hostile} />);
    expect(container.querySelector('script')).toBeNull();
    expect(container.querySelector('[onerror]')).toBeNull();
    expect(container.textContent).toContain('<script>alert(1)</script>');
    expect(container.textContent).toContain('<img src=x onerror=alert(1)>');
    expect(container.querySelectorAll('img')).toHaveLength(1);
    expect(container.querySelector('a[href^="javascript"]')).toBeNull();
    expect(screen.getByText('click').closest('a')).toBeNull();

    const html = renderToStaticMarkup(<NotebookView doc={hostile} />);
    expect(html).not.toMatch(/<script/i);
    expect(html).not.toMatch(/<[a-z][^>]*\sonerror=/i);
    expect(html).not.toMatch(/<[a-z][^>]*\shref="javascript:/i);
    expect(html).toContain('&lt;script&gt;alert(1)&lt;/script&gt;');
  });

  it('says so when the entry is empty', () => {
    render(<NotebookView doc={{ type: 'doc', content: [{ type: 'paragraph' }] }} emptyLabel="No notes for this variant yet." />);
    expect(screen.getByText('No notes for this variant yet.')).toBeTruthy();
  });
});
