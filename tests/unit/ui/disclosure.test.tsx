// @vitest-environment jsdom
/** A closed disclosure sends none of its contents; opening it draws them, and they stay. */
import { afterEach, describe, expect, it } from 'vitest';
import { act, cleanup, render, screen } from '@testing-library/react';
import { renderToString } from 'react-dom/server';
import { hydrateRoot } from 'react-dom/client';
import { Disclosure } from '@/components/ui/Disclosure';

afterEach(cleanup);

const contents = <table><tbody><tr><td>Residual SS 12.5</td></tr></tbody></table>;

describe('Disclosure', () => {
  it('leaves its contents out of the server HTML while closed, but keeps the summary', () => {
    const html = renderToString(<Disclosure summary="ANOVA table">{contents}</Disclosure>);
    expect(html).toContain('ANOVA table');
    expect(html).not.toContain('Residual SS');
  });

  it('draws the contents when opened, and keeps them when closed again', () => {
    const { container } = render(<Disclosure summary="ANOVA table">{contents}</Disclosure>);
    const details = container.querySelector('details')!;
    expect(screen.queryByText('Residual SS 12.5')).toBeNull();
    act(() => { details.open = true; details.dispatchEvent(new Event('toggle')); });
    expect(screen.getByText('Residual SS 12.5')).toBeTruthy();
    act(() => { details.open = false; details.dispatchEvent(new Event('toggle')); });
    expect(screen.getByText('Residual SS 12.5', { selector: 'td' })).toBeTruthy();
  });

  it('draws the contents when the reader opened it before the script ran', async () => {
    const host = document.createElement('div');
    host.innerHTML = renderToString(<Disclosure summary="ANOVA table">{contents}</Disclosure>);
    document.body.appendChild(host);
    host.querySelector('details')!.open = true;
    await act(async () => { hydrateRoot(host, <Disclosure summary="ANOVA table">{contents}</Disclosure>); });
    expect(host.textContent).toContain('Residual SS 12.5');
    host.remove();
  });
});
