// @vitest-environment jsdom
/** The label page on paper names what it is the label of: product, revision, rule set and date. */
import { afterEach, describe, expect, it } from 'vitest';
import { cleanup, render, screen } from '@testing-library/react';
import { LabelPageBody } from '@/components/label/LabelPageBody';
import type { LabelView } from '@/lib/label/schema';

afterEach(cleanup);

const view: LabelView = {
  label: null,
  problem: 'The formula cannot be computed.',
  kept: 'live',
  reference: null,
  subject: { kind: 'formula', id: 'f1', name: 'Apricot spread, reduced sugar', state: 'Revision 4, saved 3 Dec 2026', rules: { ruleSet: 'eu', ruleDate: '2026-12-01' } },
};

describe('the label page’s printed header', () => {
  it('names the product, the revision, the rule set with its date, and when it was printed — on paper only', () => {
    render(<LabelPageBody view={view} apiPath="/api/v1/formulas/f1/label" printedAt="2026-12-04T21:05:00Z" />);
    const header = screen.getByTestId('label-print-header');
    expect(header.className).toContain('hidden');
    expect(header.className).toContain('print:block');
    expect(header.textContent).toContain('Apricot spread, reduced sugar');
    expect(header.textContent).toContain('Revision 4, saved 3 Dec 2026');
    expect(header.textContent).toMatch(/EU .*rules of 1 Dec 2026/);
    expect(header.textContent).toContain('Printed 4 Dec 2026, 21:05 UTC');
  });
});
