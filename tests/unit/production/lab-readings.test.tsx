// @vitest-environment jsdom
/** The review's lab readings say when the variant to approve was never cooked (a walk read the other variants' cooks as its evidence). */
import { afterEach, describe, expect, it } from 'vitest';
import { cleanup, render, screen } from '@testing-library/react';
import { LabReadings } from '@/components/production/LabReadings';

const cookOf = (label: string) => ({ label, cookDate: '2026-11-20', ph: 3.2, brix20: 65.1, endPointTempC: 104.2, setTestScore: 4 });

afterEach(cleanup);

describe('LabReadings', () => {
  it('warns when the promoted variant has no cook among the readings', () => {
    render(<LabReadings lab={[cookOf('A')]} variantLabel="B" temperatures="metric" />);
    expect(screen.getByText('Variant B was never cooked in this trial: the readings below are of the other variants, not of the one to approve.')).toBeTruthy();
  });

  it('no warning when it was cooked; a plain line when nothing was', () => {
    const { unmount } = render(<LabReadings lab={[cookOf('A'), cookOf('B')]} variantLabel="B" temperatures="metric" />);
    expect(screen.queryByText(/was never cooked/)).toBeNull();
    unmount();
    render(<LabReadings lab={[]} variantLabel="B" temperatures="metric" />);
    expect(screen.getByText('No cooks were recorded.')).toBeTruthy();
  });
});
