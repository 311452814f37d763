// @vitest-environment jsdom
import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, fireEvent, render, screen } from '@testing-library/react';
import { waitFor } from '@testing-library/dom';
import type { QcSpec } from '@/lib/chemistry';

const { push } = vi.hoisted(() => ({ push: vi.fn() }));
vi.mock('next/navigation', () => ({ useRouter: () => ({ push, refresh: vi.fn() }) }));
const actions = vi.hoisted(() => ({ recordBatchAction: vi.fn() }));
vi.mock('@/lib/production/actions', () => actions);

import { BatchForm } from '@/components/production/BatchForm';

const SPEC: QcSpec = {
  solidsMinBrix: 66, solidsMaxBrix: 68, phMin: 2.9, phMax: 3.3, minFillTempC: 85, netFillG: 340, netFillToleranceG: 10.2,
  setMinScore: 4, setDescription: 'Clean set', shelfLifeMonths: 12, storageNotes: 'Cool and dark',
};

function renderForm(temperatureUnit: 'C' | 'F' = 'C', takenLotCodes: string[] = []) {
  render(<BatchForm versionId="11111111-1111-4111-8111-111111111111" spec={SPEC} productCode="QMJ" takenLotCodes={takenLotCodes} today="2026-12-02" temperatureUnit={temperatureUnit} massUnits="metric" />);
}
const type = (label: string, value: string) => fireEvent.change(screen.getByLabelText(label), { target: { value } });

afterEach(() => {
  cleanup();
  vi.clearAllMocks();
});

describe('the batch form', () => {
  it('suggests the lot code of our scheme for the date and follows the date', () => {
    renderForm();
    // 2 December 2026 is day 336.
    expect((screen.getByLabelText('Lot code') as HTMLInputElement).value).toBe('QMJ-26336-1');
    type('Batch date', '2026-01-05');
    expect((screen.getByLabelText('Lot code') as HTMLInputElement).value).toBe('QMJ-26005-1');
  });

  it('proposes the next free batch of the day, not batch 1 again', () => {
    renderForm('C', ['QMJ-26336-1', 'QMJ-26336-2', 'QMJ-26005-1']);
    expect((screen.getByLabelText('Lot code') as HTMLInputElement).value).toBe('QMJ-26336-3');
    type('Batch date', '2026-01-05');
    expect((screen.getByLabelText('Lot code') as HTMLInputElement).value).toBe('QMJ-26005-2');
    type('Batch date', '2026-01-06');
    expect((screen.getByLabelText('Lot code') as HTMLInputElement).value).toBe('QMJ-26006-1');
  });

  it('checks the readings as they are typed and asks for a disposition when one fails', () => {
    renderForm();
    expect(screen.queryByLabelText('Disposition')).toBeNull();
    type('Refractometer (°Brix, as read)', '67');
    type('pH', '3.1');
    type('Fill temperature (°C)', '88');
    expect(screen.getByTestId('live-checks').textContent).toMatch(/Pass — Fill temperature/);
    expect(screen.queryByLabelText('Disposition')).toBeNull();
    type('Fill temperature (°C)', '84.9');
    expect(screen.getByTestId('live-checks').textContent).toMatch(/Fail — Fill temperature: Filled at 84\.9 °C, below the minimum 85\.0 °C/);
    expect(screen.getByLabelText('Disposition')).toBeTruthy();
  });

  it('says why there are no checks when the sample temperature is outside the correction table (a walk saw "enter the readings" with all of them entered)', () => {
    renderForm();
    type('Refractometer (°Brix, as read)', '67');
    type('Sample temperature (°C)', '30');
    type('pH', '3.1');
    type('Fill temperature (°C)', '88');
    expect(screen.getByTestId('live-problem').textContent).toBe('No checks yet. The correction table covers 10–25 °C; bring the sample nearer 20 °C.');
    expect(screen.queryByText(/Enter the refractometer reading/)).toBeNull();
  });

  it('takes temperatures in °F and sends °C', async () => {
    actions.recordBatchAction.mockResolvedValue({ ok: true, data: { batchId: 'b', outcome: 'pass' } });
    renderForm('F');
    type('Batch size (kg)', '40');
    type('Refractometer (°Brix, as read)', '67');
    type('Sample temperature (°F)', '68');
    type('pH', '3.1');
    type('Fill temperature (°F)', '190');
    type('Jars filled', '100');
    // 190 °F is 87.8 °C: above the 85 °C minimum.
    expect(screen.getByTestId('live-checks').textContent).toMatch(/Pass — Fill temperature: Filled at 87\.8 °C/);
    fireEvent.click(screen.getByRole('button', { name: 'Record the batch' }));
    await waitFor(() => expect(actions.recordBatchAction).toHaveBeenCalledTimes(1));
    const [, sent] = actions.recordBatchAction.mock.calls[0];
    expect(sent.fillTempC).toBeCloseTo(87.78, 2);
    expect(sent.brixSampleTempC).toBe(20);
    expect(sent.batchSizeG).toBe(40_000);
    await waitFor(() => expect(push).toHaveBeenCalledWith('/production/versions/11111111-1111-4111-8111-111111111111#batches'));
  });

  it('shows the server’s field errors under the fields it converted', async () => {
    actions.recordBatchAction.mockResolvedValue({ ok: false, status: 422, error: 'Some fields are not valid.', fields: { 'batch.fillTempC': ['Fill temperature must be a number.'], 'batch.lotCode': ['That lot code is already recorded.'] } });
    renderForm();
    fireEvent.click(screen.getByRole('button', { name: 'Record the batch' }));
    await screen.findByText('Fill temperature must be a number.');
    expect(screen.getByText('That lot code is already recorded.')).toBeTruthy();
    expect(screen.getByLabelText('Fill temperature (°C)').getAttribute('aria-invalid')).toBe('true');
  });
});
