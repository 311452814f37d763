// @vitest-environment jsdom
import { afterEach, describe, expect, it } from 'vitest';
import { cleanup, render, screen, within } from '@testing-library/react';
import { BatchTable } from '@/components/production/BatchTable';
import type { BatchView } from '@/lib/production/schema';
import type { QcCheck } from '@/lib/chemistry';

const check = (key: QcCheck['key'], status: QcCheck['status']): QcCheck => ({ key, label: key === 'set' ? 'Set test' : key, value: null, limit: '', status, reason: `${key} ${status}` });

function batch(overrides: Partial<BatchView>): BatchView {
  return {
    id: 'b1', lotCode: 'QMJ-26337-1', batchDate: '2026-12-03', version: 1, versionId: 'v1', batchSizeG: 40_000, brixReading: 65, brixSampleTempC: 20, brix20: 65,
    ph: 3.1, fillTempC: 88, netFillMeanG: 342, netFillMinG: 336, setTestScore: null, jarsFilled: 100, jarsRejected: 0, goodJars: 100, notes: null,
    checks: [check('solids', 'pass'), check('set', 'not_measured')], outcome: 'incomplete', disposition: null, dispositionComment: null, recordedBy: 'Prod',
    status: 'held', latestOutcome: 'incomplete', latestChecks: [check('solids', 'pass'), check('set', 'not_measured')],
    canRetest: true, canRelease: false, canReject: true, staleSinceRework: [], decisions: [], limits: { solidsMin: 64, solidsMax: 66, phMin: 2.9, phMax: 3.3 },
    ...overrides,
  };
}

afterEach(cleanup);

describe('the batch table', () => {
  it('shows the date in the one screen format and a batch missing its set test as on hold and incomplete, not passed', () => {
    render(<BatchTable batches={[batch({})]} units="metric" temperatures="metric" />);
    const row = within(screen.getByTestId('batch-table')).getAllByRole('row')[1];
    expect(row.textContent).toContain('3 Dec 2026');
    expect(row.textContent).not.toContain('2026-12-03');
    expect(row.textContent).toContain('On hold');
    expect(row.textContent).toContain('Incomplete');
    expect(row.textContent).not.toMatch(/\bPass(ed)?\b/);
    expect(row.textContent).toContain('Set test: not measured.');
    expect(within(row).getByRole('link', { name: 'QMJ-26337-1' }).getAttribute('href')).toBe('/production/batches/b1');
  });

  it('shows a released batch as released', () => {
    render(<BatchTable batches={[batch({ status: 'released', latestOutcome: 'pass', latestChecks: [check('solids', 'pass'), check('set', 'pass')] })]} units="metric" temperatures="metric" />);
    expect(screen.getByTestId('batch-table').textContent).toContain('Released');
  });
});
