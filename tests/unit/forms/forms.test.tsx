// @vitest-environment jsdom
import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, fireEvent, render, screen } from '@testing-library/react';
import { waitFor } from '@testing-library/dom';

const router = vi.hoisted(() => ({ push: vi.fn(), refresh: vi.fn(), replace: vi.fn() }));
vi.mock('next/navigation', () => ({ useRouter: () => router }));
const account = vi.hoisted(() => ({ acceptInvitationAction: vi.fn(), requestPasswordResetAction: vi.fn(), resetPasswordAction: vi.fn(), updatePreferencesAction: vi.fn() }));
vi.mock('@/lib/account/actions', () => account);
const trials = vi.hoisted(() => ({ createTrialAction: vi.fn() }));
vi.mock('@/lib/trials/actions', () => trials);

import { AcceptInvitationForm } from '@/components/auth/AccountForms';
import { PreferencesForm } from '@/components/settings/PreferencesForm';
import { NewTrialForm } from '@/components/trials/NewTrialForm';
import { NETWORK_FAILURE_MESSAGE } from '@/components/ui/useFormAction';

const TOKEN = 'x'.repeat(43);
const type = (label: string, value: string) => fireEvent.change(screen.getByLabelText(label), { target: { value } });
const valueOf = (label: string) => (screen.getByLabelText(label) as HTMLInputElement).value;

afterEach(() => {
  cleanup();
  vi.clearAllMocks();
});

describe('the accept-invitation form', () => {
  it('keeps the name after a password error, and the errors go once the fields are valid', async () => {
    account.acceptInvitationAction.mockResolvedValue({
      ok: false, status: 422, error: 'Some fields need attention.',
      fields: { password: ['Include at least one digit or symbol.'], confirm: ['The two passwords differ.'] },
    });
    render(<AcceptInvitationForm token={TOKEN} hasAccount={false} />);
    type('Your name', 'Marta Quince');
    type('New password', 'marmaladeonly');
    type('Repeat the password', 'marmalade');
    fireEvent.click(screen.getByRole('button', { name: 'Accept and join' }));
    await screen.findByText('Include at least one digit or symbol.');
    expect(screen.getByText('Some fields need attention.')).toBeTruthy();
    // Nothing typed is lost.
    expect(valueOf('Your name')).toBe('Marta Quince');
    expect(valueOf('New password')).toBe('marmaladeonly');
    // The FormData sent carries the token and the typed values.
    const sent = account.acceptInvitationAction.mock.calls[0][1] as FormData;
    expect(Object.fromEntries(sent.entries())).toEqual({ token: TOKEN, name: 'Marta Quince', password: 'marmaladeonly', confirm: 'marmalade' });

    // Still invalid: the message stays, rewritten by the same rules the server uses.
    type('New password', 'marmaladejam');
    expect(screen.getByText('Include at least one digit or symbol.')).toBeTruthy();
    type('New password', 'quince');
    expect(screen.getByText(/Use at least 10 characters\./)).toBeTruthy();
    type('New password', 'marmalade-7');
    expect(screen.queryByText('Include at least one digit or symbol.')).toBeNull();
    expect(screen.getByText('Some fields need attention.')).toBeTruthy();
    type('Repeat the password', 'marmalade-7');
    expect(screen.queryByText('The two passwords differ.')).toBeNull();
    expect(screen.queryByText('Some fields need attention.')).toBeNull();
  });

  it('says when the server cannot be reached and does not stay on "Joining…"', async () => {
    account.acceptInvitationAction.mockRejectedValue(new TypeError('Failed to fetch'));
    render(<AcceptInvitationForm token={TOKEN} hasAccount={false} />);
    type('Your name', 'Marta Quince');
    type('New password', 'marmalade-7');
    type('Repeat the password', 'marmalade-7');
    fireEvent.click(screen.getByRole('button', { name: 'Accept and join' }));
    await screen.findByText(NETWORK_FAILURE_MESSAGE);
    const button = screen.getByRole('button', { name: 'Accept and join' }) as HTMLButtonElement;
    expect(button.disabled).toBe(false);
    expect(valueOf('Your name')).toBe('Marta Quince');
  });
});

describe('the new-trial form', () => {
  const bases = [{ formulaId: '11111111-1111-4111-8111-111111111111', name: 'Quince jelly', latestRevision: 2 }];

  it('leaves "Starting…" when the connection is lost, keeps the text, and can try again', async () => {
    let reject!: (err: unknown) => void;
    trials.createTrialAction.mockImplementationOnce(() => new Promise((_, r) => { reject = r; }));
    render(<NewTrialForm bases={bases} />);
    type('Title', 'Less sugar in the quince jelly');
    type('Question or hypothesis', 'Does a 0.8 sugar ratio still set?');
    fireEvent.click(screen.getByRole('button', { name: 'Start the trial' }));
    expect(await screen.findByRole('button', { name: 'Starting…' })).toBeTruthy();
    reject(new TypeError('Failed to fetch'));
    await screen.findByText(NETWORK_FAILURE_MESSAGE);
    expect(screen.getByRole('button', { name: 'Start the trial' })).toBeTruthy();
    expect(valueOf('Title')).toBe('Less sugar in the quince jelly');

    trials.createTrialAction.mockResolvedValueOnce({ ok: true, data: { trialId: 'new-trial' } });
    fireEvent.click(screen.getByRole('button', { name: 'Start the trial' }));
    await waitFor(() => expect(router.push).toHaveBeenCalledWith('/trials/new-trial'));
    expect(screen.queryByText(NETWORK_FAILURE_MESSAGE)).toBeNull();
  });

  it('clears a field error as soon as that field is edited', async () => {
    trials.createTrialAction.mockResolvedValue({ ok: false, status: 422, error: 'Some fields need attention.', fields: { title: ['Give the trial a title.'] } });
    render(<NewTrialForm bases={bases} />);
    fireEvent.click(screen.getByRole('button', { name: 'Start the trial' }));
    await screen.findByText('Give the trial a title.');
    type('Title', 'Quince, less sugar');
    expect(screen.queryByText('Give the trial a title.')).toBeNull();
    expect(screen.queryByText('Some fields need attention.')).toBeNull();
  });
});

describe('the preferences form', () => {
  it('keeps a refused name instead of resetting to the saved one', async () => {
    account.updatePreferencesAction.mockResolvedValue({ ok: false, status: 422, error: 'Some fields need attention.', fields: { name: ['Use at most 120 characters.'] } });
    render(<PreferencesForm name="Marta" massUnits="metric" temperatureUnit="C" />);
    type('Your name', 'M'.repeat(121));
    fireEvent.click(screen.getByRole('button', { name: 'Save preferences' }));
    await screen.findByText('Use at most 120 characters.');
    expect(valueOf('Your name')).toBe('M'.repeat(121));
    type('Your name', 'Marta Q.');
    expect(screen.queryByText('Use at most 120 characters.')).toBeNull();
  });
});
