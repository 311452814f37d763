'use client';

import { useState, useSyncExternalStore } from 'react';
import Link from 'next/link';
import { useRouter } from 'next/navigation';
import { Button, buttonClass } from '@/components/ui/Button';
import { Field, FieldErrorText } from '@/components/ui/Field';
import { Notice } from '@/components/ui/Notice';
import { checkJoinInput, DISPLAY_NAME_MAX, isPlausibleSeatToken, JOIN_CODE_LENGTH, LAST_SEAT_STORAGE_KEY, normalizeJoinCode, type JoinProblems } from '@/lib/taster';
import { readErrorBody } from '@/lib/api/error-body';

function subscribeToStorage(listener: () => void) {
  window.addEventListener('storage', listener);
  return () => window.removeEventListener('storage', listener);
}

function readLastSeat(): string | null {
  try {
    const token = window.localStorage.getItem(LAST_SEAT_STORAGE_KEY);
    return isPlausibleSeatToken(token) ? token : null;
  } catch {
    return null;
  }
}

/** Join a tasting with the six-character code the organiser shows or prints as a QR link. */
export function JoinForm({ initialCode = '' }: { initialCode?: string }) {
  const router = useRouter();
  const [joinCode, setJoinCode] = useState(() => normalizeJoinCode(initialCode));
  const [displayName, setDisplayName] = useState('');
  const [problems, setProblems] = useState<JoinProblems>({});
  const [error, setError] = useState<string>();
  const [busy, setBusy] = useState(false);
  const [dismissedSeat, setDismissedSeat] = useState<string | null>(null);
  const lastSeat = useSyncExternalStore(subscribeToStorage, readLastSeat, () => null);
  const continueSeat = lastSeat && lastSeat !== dismissedSeat ? lastSeat : null;

  async function join(e: React.FormEvent<HTMLFormElement>) {
    e.preventDefault();
    setError(undefined);
    const found = checkJoinInput(joinCode, displayName);
    setProblems(found);
    if (found.joinCode || found.displayName) return;
    setBusy(true);
    try {
      const res = await fetch('/api/v1/tastings/join', {
        method: 'POST',
        headers: { 'content-type': 'application/json' },
        credentials: 'same-origin',
        body: JSON.stringify({ joinCode: normalizeJoinCode(joinCode), displayName: displayName.trim() }),
      });
      const body = (await res.json().catch(() => ({}))) as { seatToken?: unknown; error?: { message?: unknown; fields?: Record<string, string[]> } };
      if (res.ok && isPlausibleSeatToken(body.seatToken)) {
        try {
          window.localStorage.setItem(LAST_SEAT_STORAGE_KEY, body.seatToken);
        } catch {
          // Without storage the taster simply cannot use "Continue" later.
        }
        router.push(`/t/${encodeURIComponent(body.seatToken)}`);
        return;
      }
      const { message: sent, fields } = readErrorBody(body);
      const serverMessage = sent ?? '';
      if (res.status === 404) setError('That code does not match an open tasting. Check the letters and digits and try again.');
      else if (res.status === 429) setError(serverMessage || 'Too many tries. Wait a minute, then try again.');
      else if (res.status === 422 && fields) {
        setProblems({ joinCode: fields.joinCode?.join(' '), displayName: fields.displayName?.join(' ') });
        if (serverMessage) setError(serverMessage);
      } else setError(serverMessage || 'Joining did not work. Try again.');
    } catch {
      setError('No connection. Check your signal and try again.');
    } finally {
      setBusy(false);
    }
  }

  return (
    <div className="space-y-6">
      {continueSeat ? (
        <div className="space-y-3 rounded-card bg-quince-50 p-4 ring-1 ring-quince-200">
          <p className="text-base font-semibold text-rind-900">You have a tasting in progress on this phone.</p>
          <Link href={`/t/${encodeURIComponent(continueSeat)}`} className={buttonClass('primary', 'min-h-12 w-full text-base')}>
            Continue your tasting
          </Link>
          <button
            type="button"
            className="min-h-12 w-full text-sm font-semibold text-damson-700 underline underline-offset-4"
            onClick={() => {
              try {
                window.localStorage.removeItem(LAST_SEAT_STORAGE_KEY);
              } catch {
                // Hiding it is enough when storage is unavailable.
              }
              setDismissedSeat(continueSeat);
            }}
          >
            Join a different tasting
          </button>
        </div>
      ) : null}
      <form onSubmit={join} noValidate className="space-y-5">
        {error ? <Notice tone="danger">{error}</Notice> : null}
        <div>
          <label htmlFor="join-code" className="mb-1 block text-base font-semibold text-rind-800">
            Tasting code
          </label>
          <input
            id="join-code"
            name="joinCode"
            value={joinCode}
            onChange={(e) => setJoinCode(normalizeJoinCode(e.target.value))}
            inputMode="text"
            autoCapitalize="characters"
            autoComplete="off"
            autoCorrect="off"
            spellCheck={false}
            maxLength={JOIN_CODE_LENGTH}
            placeholder="ABC123"
            aria-invalid={problems.joinCode ? true : undefined}
            aria-describedby={problems.joinCode ? 'join-code-err' : 'join-code-hint'}
            className="block min-h-16 w-full rounded-lg border-0 bg-white px-3 py-3 text-center font-mono text-4xl uppercase tracking-[0.35em] text-rind-900 ring-1 ring-inset ring-rind-300 placeholder:text-rind-300 focus:ring-2 focus:ring-damson-500 aria-[invalid=true]:ring-ember-600"
          />
          {problems.joinCode ? null : (
            <p id="join-code-hint" className="mt-1 text-sm text-rind-500">
              Six letters or digits, from the card or screen at the tasting.
            </p>
          )}
          <FieldErrorText id="join-code-err" errors={problems.joinCode ? [problems.joinCode] : undefined} />
        </div>
        <Field
          label="Your name"
          name="displayName"
          id="display-name"
          value={displayName}
          onChange={(e) => setDisplayName(e.target.value)}
          maxLength={DISPLAY_NAME_MAX}
          autoComplete="nickname"
          hint="A first name or nickname is enough."
          errors={problems.displayName ? [problems.displayName] : undefined}
        />
        <Button type="submit" className="min-h-12 w-full text-base" disabled={busy}>
          {busy ? 'Joining…' : 'Join the tasting'}
        </Button>
      </form>
    </div>
  );
}
