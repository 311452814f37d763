// @vitest-environment jsdom
/**
 * The browser draws a date input in its own locale (11/20/2026 or 20/11/2026); every date input reads
 * its day back in the app's one format (lib/format/dates.ts), controlled or not (issue 14, part 11).
 */
import { afterEach, describe, expect, it } from 'vitest';
import { useState } from 'react';
import { cleanup, fireEvent, render, screen } from '@testing-library/react';
import { Field } from '@/components/ui/Field';
import { DateInput } from '@/components/ui/DateInput';

afterEach(cleanup);

function Controlled({ initial }: { initial: string }) {
  const [day, setDay] = useState(initial);
  return <Field label="Batch date" name="batchDate" type="date" value={day} onChange={(e) => setDay(e.target.value)} />;
}

describe('a date input', () => {
  it('reads a controlled field back as "20 Nov 2026" and follows each change', () => {
    const { container } = render(<Controlled initial="2026-11-20" />);
    const input = screen.getByLabelText('Batch date');
    expect(input.getAttribute('type')).toBe('date');
    expect(container.querySelector('[data-date-reads]')?.textContent).toBe('20 Nov 2026');
    fireEvent.change(input, { target: { value: '2027-01-03' } });
    expect(container.querySelector('[data-date-reads]')?.textContent).toBe('3 Jan 2027');
  });

  it('reads an uncontrolled one back from its default and from what is picked', () => {
    const { container } = render(<><label htmlFor="from">From</label><DateInput id="from" name="from" defaultValue="2026-03-05" /></>);
    expect(container.querySelector('[data-date-reads]')?.textContent).toBe('5 Mar 2026');
    fireEvent.change(screen.getByLabelText('From'), { target: { value: '2026-12-31' } });
    expect(container.querySelector('[data-date-reads]')?.textContent).toBe('31 Dec 2026');
  });

  it('says nothing while no day is chosen', () => {
    const { container } = render(<><label htmlFor="to">To</label><DateInput id="to" name="to" defaultValue="" /></>);
    expect(container.querySelector('[data-date-reads]')).toBeNull();
  });
});
