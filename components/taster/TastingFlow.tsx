'use client';

import { useEffect, useRef, useState } from 'react';
import { useHydrated } from '@/components/ui/useHydrated';
import { Button } from '@/components/ui/Button';
import { Notice } from '@/components/ui/Notice';
import {
  applyAnswer,
  describeQueueStatus,
  emptyAnswerBook,
  initialRankingOrder,
  isRankingComplete,
  isSampleComplete,
  isTriangleComplete,
  LAST_SEAT_STORAGE_KEY,
  mergeAnswers,
  parseSeatView,
  ratedValue,
  resumeStep,
  RINSE_REMINDER,
  SEAT_NOT_FOUND_MESSAGE,
  SeatViewError,
  stepAfter,
  type AnswerBook,
  type AnswerPayload,
  type FlowStep,
  type SeatView,
} from '@/lib/taster';
import { useAnswerQueue } from './useAnswerQueue';
import { CategoryScaleInput, LineScaleInput } from './ScaleInputs';
import { RankingScreen } from './RankingScreen';
import { TriangleScreen } from './TriangleScreen';
import { formatDateTime } from '@/lib/format/dates';
import { AnswerList } from './AnswerList';
import { responseErrorMessage } from '@/lib/api/error-body';

type Load = { kind: 'loading' } | { kind: 'failed'; message: string } | { kind: 'ready'; view: SeatView };

const bigButton = 'min-h-12 w-full text-base';

const serverMessage = responseErrorMessage;

function forgetLastSeat(seatToken: string) {
  try {
    if (window.localStorage.getItem(LAST_SEAT_STORAGE_KEY) === seatToken) window.localStorage.removeItem(LAST_SEAT_STORAGE_KEY);
  } catch {
    // Nothing to forget without storage.
  }
}

/**
 * The whole taster flow for one seat: notice, samples, review, thank-you. With `first` (the page
 * read the seat on the server) the first screen is in the HTML, so the phone paints it without
 * waiting for this script and an API round trip; answers still waiting on the phone are merged
 * in once it runs.
 */
export function TastingFlow({ seatToken, first: firstProp }: { seatToken: string; first?: SeatView }) {
  const { queue, status, give, flushDebounced } = useAnswerQueue(seatToken);
  // Only the view the page was first served with counts; a later render never rewinds the taster.
  const [first] = useState(firstProp);
  const hydrated = useHydrated();
  const [load, setLoad] = useState<Load>(first ? { kind: 'ready', view: first } : { kind: 'loading' });
  const [loadAttempt, setLoadAttempt] = useState(0);
  const [book, setBook] = useState<AnswerBook>(() => (first ? mergeAnswers(first, []) : emptyAnswerBook()));
  const [step, setStep] = useState<FlowStep>(() => (first ? resumeStep(first, mergeAnswers(first, [])) : { kind: 'notice' }));
  const [busy, setBusy] = useState(false);
  const [actionError, setActionError] = useState<string>();
  const [closedMessage, setClosedMessage] = useState<string>();
  const headingRef = useRef<HTMLHeadingElement>(null);
  const base = `/api/v1/tastings/seats/${encodeURIComponent(seatToken)}`;

  useEffect(() => {
    let cancelled = false;
    const settle = (view: SeatView) => {
      const merged = mergeAnswers(
        view,
        queue.pending().map((item) => item.answer),
      );
      setBook(merged);
      setStep(resumeStep(view, merged));
      setLoad({ kind: 'ready', view });
      if (view.session.state === 'open' && !view.seat.submitted) queue.start();
    };
    // The server's first read stands for the first attempt; "Try again" always asks the API.
    if (loadAttempt === 0 && first) {
      settle(first);
      return;
    }
    (async () => {
      try {
        const res = await fetch(base, { headers: { accept: 'application/json' }, cache: 'no-store', credentials: 'same-origin' });
        if (res.status === 404) throw new SeatViewError(SEAT_NOT_FOUND_MESSAGE);
        if (!res.ok) throw new SeatViewError(await serverMessage(res, 'The tasting could not be loaded.'));
        const view = parseSeatView(await res.json());
        if (cancelled) return;
        settle(view);
      } catch (e) {
        if (cancelled) return;
        const message = e instanceof SeatViewError ? e.message : 'No connection. Check your signal and try again.';
        setLoad({ kind: 'failed', message });
      }
    })();
    return () => {
      cancelled = true;
    };
  }, [base, queue, loadAttempt, first]);

  // Each new screen starts at its heading, for screen readers and for the scroll position.
  useEffect(() => {
    headingRef.current?.focus();
  }, [step]);

  if (load.kind === 'loading') return <p className="py-16 text-center text-lg text-rind-600">Loading your tasting…</p>;
  if (load.kind === 'failed') {
    return (
      <div className="space-y-4 py-8">
        <Notice tone="danger">{load.message}</Notice>
        <Button
          type="button"
          className={bigButton}
          onClick={() => {
            setLoad({ kind: 'loading' });
            setLoadAttempt((n) => n + 1);
          }}
        >
          Try again
        </Button>
      </div>
    );
  }

  const view = load.view;
  const closed = status.phase === 'closed' || step.kind === 'closed';
  const statusText = describeQueueStatus(status);

  function answer(payload: AnswerPayload, options: { debounce?: boolean } = {}) {
    setBook((b) => applyAnswer(b, payload));
    give(payload, options);
  }

  function goTo(next: FlowStep) {
    flushDebounced();
    setActionError(undefined);
    setStep(next);
  }

  async function post(path: string): Promise<'ok' | 'closed' | 'failed'> {
    setBusy(true);
    setActionError(undefined);
    try {
      const res = await fetch(`${base}/${path}`, { method: 'POST', headers: { 'content-type': 'application/json' }, credentials: 'same-origin', body: '{}' });
      if (res.ok) return 'ok';
      const message = await serverMessage(res, 'That did not go through. Try again.');
      if (res.status === 409) {
        setClosedMessage(message);
        return 'closed';
      }
      setActionError(message);
      return 'failed';
    } catch {
      setActionError('No connection. Check your signal and try again.');
      return 'failed';
    } finally {
      setBusy(false);
    }
  }

  async function consent() {
    const outcome = await post('consent');
    if (outcome === 'ok') goTo(stepAfter({ kind: 'notice' }, view, book));
    else if (outcome === 'closed') goTo({ kind: 'closed' });
  }

  async function submit() {
    flushDebounced();
    const outcome = await post('submit');
    if (outcome === 'ok') {
      queue.clear();
      forgetLastSeat(seatToken);
      goTo({ kind: 'thanks' });
    } else if (outcome === 'closed') goTo({ kind: 'closed' });
  }

  const heading = (text: string) => (
    <h1 ref={headingRef} tabIndex={-1} className="font-display text-3xl leading-tight text-damson-900 outline-none">
      {text}
    </h1>
  );

  let screen: React.ReactNode;
  if (closed) {
    screen = (
      <div className="space-y-5">
        {heading('This tasting has closed')}
        {closedMessage || status.stopMessage ? <Notice tone="warning">{closedMessage ?? status.stopMessage}</Notice> : null}
        <p className="text-base text-rind-700">Here is what you answered. Answers marked “Not sent” did not reach the organiser.</p>
        <AnswerList view={view} book={book} waitingSlots={status.waitingSlots} />
      </div>
    );
  } else if (step.kind === 'thanks') {
    screen = (
      <div className="space-y-4 py-8 text-center">
        {heading('Thank you!')}
        <p className="text-lg text-rind-700">Your answers are in. You can close this page or hand the phone back.</p>
      </div>
    );
  } else if (step.kind === 'notice') {
    screen = (
      <div className="space-y-5">
        {heading(view.session.title || 'Tasting')}
        {view.session.place || view.session.startsAt ? (
          <p className="text-sm text-rind-600">{[view.session.place, formatStart(view.session.startsAt)].filter(Boolean).join(' · ')}</p>
        ) : null}
        <section aria-label="Before you start" className="rounded-card bg-pith-50 p-4 ring-1 ring-pith-300">
          <h2 className="mb-2 text-lg font-semibold text-rind-800">Before you start</h2>
          {/* Plain text on purpose: the organiser's words are shown as written, never as HTML. */}
          <p className="whitespace-pre-line text-base text-rind-900">{view.session.notice}</p>
        </section>
        <Button type="button" className={bigButton} disabled={busy} onClick={consent}>
          {busy ? 'One moment…' : 'I agree, start'}
        </Button>
      </div>
    );
  } else if (step.kind === 'sample') {
    const sample = view.samples[step.index];
    const complete = isSampleComplete(book, sample.code, view);
    const isLast = step.index === view.samples.length - 1;
    screen = (
      <div className="space-y-6">
        <div className="text-center">
          <p className="text-base font-semibold text-rind-600">
            Sample {step.index + 1} of {view.samples.length}
          </p>
          <h1 ref={headingRef} tabIndex={-1} className="mt-1 font-display text-7xl tabular-nums tracking-widest text-damson-900 outline-none">
            <span className="sr-only">Sample code </span>
            {sample.code}
          </h1>
        </div>
        {view.attributes.map((attr) => {
          const value = ratedValue(book, sample.code, attr.id);
          const onChange = (v: number) =>
            answer({ kind: 'rated', code: sample.code, attributeId: attr.id, value: v }, { debounce: attr.scale.kind === 'line' });
          return (
            <div key={attr.id} className="rounded-card bg-pith-50 p-4 ring-1 ring-pith-300">
              {attr.scale.kind === 'category' ? (
                <CategoryScaleInput code={sample.code} attribute={{ ...attr, scale: attr.scale }} value={value} onChange={onChange} />
              ) : (
                <LineScaleInput code={sample.code} attribute={{ ...attr, scale: attr.scale }} value={value} onChange={onChange} />
              )}
            </div>
          );
        })}
        {!complete ? <p className="text-center text-sm text-rind-600">Answer every question to go on.</p> : null}
        <Button type="button" className={bigButton} disabled={!complete} onClick={() => goTo(stepAfter(step, view, book))}>
          {step.fromReview ? 'Back to review' : isLast ? 'Review my answers' : 'Next'}
        </Button>
      </div>
    );
  } else if (step.kind === 'rinse') {
    screen = (
      <div className="space-y-6 py-8 text-center">
        {heading('Rinse')}
        <p className="text-xl text-rind-800">{RINSE_REMINDER}</p>
        <Button type="button" className={bigButton} onClick={() => goTo(stepAfter(step, view, book))}>
          Next sample
        </Button>
      </div>
    );
  } else if (step.kind === 'ranking') {
    const attributeId = view.ranking?.attributeId ?? '';
    const attributeName = view.attributes.find((a) => a.id === attributeId)?.name ?? '';
    screen = (
      <div className="space-y-4">
        {heading('Put them in order')}
        <RankingScreen
          initialOrder={initialRankingOrder(book, view)}
          attributeName={attributeName}
          instruction={view.ranking?.instruction ?? ''}
          onSave={(order) => {
            answer({ kind: 'ranking', attributeId, ranking: order });
            goTo(stepAfter(step, view, book));
          }}
        />
      </div>
    );
  } else if (step.kind === 'triangle') {
    screen = (
      <div className="space-y-4">
        {heading('Find the odd one')}
        <TriangleScreen
          codes={view.samples.map((s) => s.code)}
          saved={book.triangle}
          onAnswer={(a, options) => answer(a, options)}
          continueLabel={step.fromReview ? 'Back to review' : 'Review my answers'}
          onContinue={() => goTo(stepAfter(step, view, book))}
        />
      </div>
    );
  } else {
    const ready =
      view.session.method === 'rated'
        ? view.samples.every((s) => isSampleComplete(book, s.code, view))
        : view.session.method === 'ranking'
          ? isRankingComplete(book, view)
          : isTriangleComplete(book, view);
    const waiting = status.waitingCount;
    screen = (
      <div className="space-y-5">
        {heading('Check your answers')}
        <p className="text-base text-rind-700">You can change any answer before you submit.</p>
        <AnswerList
          view={view}
          book={book}
          onChange={(target) => goTo(target.kind === 'sample' ? { kind: 'sample', index: target.index, fromReview: true } : { ...target, fromReview: true })}
        />
        {!ready ? <Notice tone="warning">Some questions still need an answer.</Notice> : null}
        {waiting > 0 ? (
          <p className="text-center text-sm text-rind-600">
            Waiting for {waiting} {waiting === 1 ? 'answer' : 'answers'} to be sent before you can submit.
          </p>
        ) : null}
        <Button type="button" className={bigButton} disabled={!ready || waiting > 0 || busy} onClick={submit}>
          {busy ? 'Submitting…' : 'Submit my answers'}
        </Button>
      </div>
    );
  }

  const showStatus = !closed && step.kind !== 'thanks' && step.kind !== 'notice';
  return (
    <div className="space-y-4 pb-16">
      {actionError ? <Notice tone="danger">{actionError}</Notice> : null}
      {status.rejectionMessage && !closed ? <Notice tone="warning">{status.rejectionMessage}</Notice> : null}
      {/* min-w-0: a fieldset is as wide as its content by default, which would scroll sideways. */}
      <fieldset disabled={!hydrated} className="min-w-0">
        {screen}
      </fieldset>
      {showStatus ? (
        <p
          role="status"
          aria-live="polite"
          className={`fixed inset-x-0 bottom-0 bg-pith-50/95 px-4 py-3 text-center text-sm ring-1 ring-pith-300 ${
            status.phase === 'offline' || status.phase === 'retrying' ? 'text-amberline-700' : 'text-rind-600'
          }`}
        >
          {hydrated ? statusText || '\u00a0' : 'Getting the page ready…'}
        </p>
      ) : null}
    </div>
  );
}

function formatStart(startsAt: string): string {
  if (!startsAt || Number.isNaN(new Date(startsAt).getTime())) return '';
  return formatDateTime(startsAt);
}
