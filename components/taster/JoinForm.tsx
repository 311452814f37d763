'use client';

import { useEffect, useState, useSyncExternalStore } from 'react';
import Link from 'next/link';
import { useRouter } from 'next/navigation';
import { Button, buttonClass } from '@/components/ui/Button';
import { Field, FieldErrorText } from '@/components/ui/Field';
import { Notice } from '@/components/ui/Notice';
import {
  checkJoinInput, DISPLAY_NAME_MAX, isPlausibleSeatToken, JOIN_CODE_LENGTH, JOINED_SEATS_STORAGE_KEY, LAST_SEAT_STORAGE_KEY, normalizeJoinCode,
  parseSeatView, readJoinedSeats, withJoinedSeat, type JoinProblems,
} from '@/lib/taster';
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

function rememberJoinedSeat(joinCode: string, seatToken: string) {
  try {
    const list = withJoinedSeat(readJoinedSeats(window.localStorage.getItem(JOINED_SEATS_STORAGE_KEY)), { joinCode, seatToken });
    window.localStorage.setItem(JOINED_SEATS_STORAGE_KEY, JSON.stringify(list));
  } catch {
    // Without storage the phone cannot tell it has taken part before.
  }
}

/**
 * The name under which this phone has already submitted for the tasting of this code, or null. Asks
 * the server about each seat joined here with the code; a seat that cannot be read says nothing.
 */
async function submittedHereAs(joinCode: string): Promise<string | null> {
  let list: ReturnType<typeof readJoinedSeats> = [];
  try {
    list = readJoinedSeats(window.localStorage.getItem(JOINED_SEATS_STORAGE_KEY));
  } catch {
    return null;
  }
  for (const seat of list.filter((x) => x.joinCode === joinCode).reverse()) {
    try {
      const res = await fetch(`/api/v1/tastings/seats/${encodeURIComponent(seat.seatToken)}`, { headers: { accept: 'application/json' }, cache: 'no-store', credentials: 'same-origin' });
      if (!res.ok) continue;
      const view = parseSeatView(await res.json());
      if (view.seat.submitted) return view.seat.displayName;
    } catch {
      // Offline or an old seat: joining decides.
    }
  }
  return null;
}

/**
 * Join a tasting with the six-character code the organiser shows or prints as a QR link. A phone that
 * has already submitted for this tasting says so first, and takes a second seat (a tablet passed to
 * the next taster) only when asked to: never a silent second seat for the same person.
 */
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
  // The tasting this phone has submitted for (its code and the name it used), and the code for which a new taster was asked for.
  const [submittedHere, setSubmittedHere] = useState<{ joinCode: string; displayName: string } | null>(null);
  const [newTasterFor, setNewTasterFor] = useState<string | null>(null);

  // A QR link names the tasting: say at once when this phone has submitted for it.
  useEffect(() => {
    const code = normalizeJoinCode(initialCode);
    if (code.length !== JOIN_CODE_LENGTH) return;
    let cancelled = false;
    submittedHereAs(code).then((name) => {
      if (!cancelled && name !== null) setSubmittedHere({ joinCode: code, displayName: name });
    });
    return () => {
      cancelled = true;
    };
  }, [initialCode]);

  async function join(e: React.FormEvent<HTMLFormElement>) {
    e.preventDefault();
    setError(undefined);
    const found = checkJoinInput(joinCode, displayName);
    setProblems(found);
    if (found.joinCode || found.displayName) return;
    setBusy(true);
    const code = normalizeJoinCode(joinCode);
    if (newTasterFor !== code) {
      const name = await submittedHereAs(code);
      if (name !== null) {
        setSubmittedHere({ joinCode: code, displayName: name });
        setBusy(false);
        return;
      }
    }
    try {
      const res = await fetch('/api/v1/tastings/join', {
        method: 'POST',
        headers: { 'content-type': 'application/json' },
        credentials: 'same-origin',
        body: JSON.stringify({ joinCode: code, displayName: displayName.trim() }),
      });
      const body = (await res.json().catch(() => ({}))) as { seatToken?: unknown; error?: { message?: unknown; fields?: Record<string, string[]> } };
      if (res.ok && isPlausibleSeatToken(body.seatToken)) {
        try {
          window.localStorage.setItem(LAST_SEAT_STORAGE_KEY, body.seatToken);
        } catch {
          // Without storage the taster simply cannot use "Continue" later.
        }
        rememberJoinedSeat(code, body.seatToken);
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
      {submittedHere && submittedHere.joinCode === normalizeJoinCode(joinCode) ? (
        <div role="status" className="space-y-3 rounded-card bg-quince-50 p-4 ring-1 ring-quince-200">
          <p className="text-base font-semibold text-rind-900">This phone has already submitted answers for this tasting, as {submittedHere.displayName}.</p>
          <p className="text-sm text-rind-700">Nothing more is needed from you. If someone else is tasting with this phone, start a new seat for them.</p>
          <Button
            type="button"
            tone="secondary"
            className="min-h-12 w-full text-base"
            onClick={() => {
              setNewTasterFor(submittedHere.joinCode);
              setSubmittedHere(null);
              setDisplayName('');
              document.getElementById('display-name')?.focus();
            }}
          >
            Start as a new taster on this phone
          </Button>
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
