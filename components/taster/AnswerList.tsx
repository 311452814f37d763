'use client';

import { answerSlot, initialRankingOrder, ratedValue, type AnswerBook, type SeatView } from '@/lib/taster';
import { confidenceText, ratedAnswerText } from './answer-text';

type ChangeTarget = { kind: 'sample'; index: number } | { kind: 'ranking' } | { kind: 'triangle' };

function ChangeButton({ label, onClick }: { label: string; onClick: () => void }) {
  return (
    <button type="button" onClick={onClick} aria-label={label} className="min-h-12 px-2 text-base font-semibold text-damson-700 underline underline-offset-4">
      Change
    </button>
  );
}

function SentMark({ waiting }: { waiting: boolean }) {
  return <span className={`text-xs font-semibold ${waiting ? 'text-ember-700' : 'text-leaf-700'}`}>{waiting ? 'Not sent' : 'Sent'}</span>;
}

/**
 * Every answer the taster has given, sample by sample. With `onChange` each block gets a
 * Change link (review); with `waitingSlots` each answer says whether it reached the server.
 */
export function AnswerList({
  view,
  book,
  onChange,
  waitingSlots,
}: {
  view: SeatView;
  book: AnswerBook;
  onChange?: (target: ChangeTarget) => void;
  waitingSlots?: readonly string[];
}) {
  const waiting = new Set(waitingSlots ?? []);
  const method = view.session.method;

  if (method === 'rated') {
    return (
      <ul className="space-y-3">
        {view.samples.map((sample, index) => (
          <li key={sample.code} className="rounded-card bg-pith-50 p-4 ring-1 ring-pith-300">
            <div className="flex items-center justify-between gap-3">
              <h3 className="font-display text-2xl tabular-nums tracking-wider text-damson-900">Sample {sample.code}</h3>
              {onChange ? <ChangeButton label={`Change sample ${sample.code}`} onClick={() => onChange({ kind: 'sample', index })} /> : null}
            </div>
            <dl className="mt-2 space-y-1">
              {view.attributes.map((attr) => {
                const value = ratedValue(book, sample.code, attr.id);
                return (
                  <div key={attr.id} className="flex flex-wrap items-baseline justify-between gap-x-3">
                    <dt className="text-sm text-rind-600">{attr.name}</dt>
                    <dd className={`text-base ${value === undefined ? 'text-ember-700' : 'text-rind-900'}`}>
                      {ratedAnswerText(attr, value)}{' '}
                      {waitingSlots && value !== undefined ? (
                        <SentMark waiting={waiting.has(answerSlot({ kind: 'rated', code: sample.code, attributeId: attr.id, value }))} />
                      ) : null}
                    </dd>
                  </div>
                );
              })}
            </dl>
          </li>
        ))}
      </ul>
    );
  }

  if (method === 'ranking') {
    const attributeId = view.ranking?.attributeId ?? '';
    const order = book.ranking ? initialRankingOrder(book, view) : null;
    return (
      <div className="rounded-card bg-pith-50 p-4 ring-1 ring-pith-300">
        <div className="flex items-center justify-between gap-3">
          <h3 className="font-display text-xl text-damson-900">Your order, best first</h3>
          {onChange ? <ChangeButton label="Change your order" onClick={() => onChange({ kind: 'ranking' })} /> : null}
        </div>
        {order ? (
          <ol className="mt-2 list-decimal space-y-1 pl-6 font-display text-2xl tabular-nums">
            {order.map((code) => (
              <li key={code}>{code}</li>
            ))}
          </ol>
        ) : (
          <p className="mt-2 text-ember-700">Not saved yet</p>
        )}
        {waitingSlots && order ? <SentMark waiting={waiting.has(answerSlot({ kind: 'ranking', attributeId, ranking: order }))} /> : null}
      </div>
    );
  }

  const t = book.triangle;
  return (
    <div className="rounded-card bg-pith-50 p-4 ring-1 ring-pith-300">
      <div className="flex items-center justify-between gap-3">
        <h3 className="font-display text-xl text-damson-900">The odd one</h3>
        {onChange ? <ChangeButton label="Change your triangle answer" onClick={() => onChange({ kind: 'triangle' })} /> : null}
      </div>
      {t ? (
        <dl className="mt-2 space-y-1">
          <div className="flex justify-between gap-3">
            <dt className="text-sm text-rind-600">Odd sample</dt>
            <dd className="font-display text-2xl tabular-nums">{t.oddCode}</dd>
          </div>
          <div className="flex justify-between gap-3">
            <dt className="text-sm text-rind-600">How sure</dt>
            <dd>{confidenceText(t.confidence)}</dd>
          </div>
          {t.comment ? (
            <div>
              <dt className="text-sm text-rind-600">Comment</dt>
              <dd className="whitespace-pre-line">{t.comment}</dd>
            </div>
          ) : null}
        </dl>
      ) : (
        <p className="mt-2 text-ember-700">Not answered yet</p>
      )}
      {waitingSlots && t ? <SentMark waiting={waiting.has('triangle')} /> : null}
    </div>
  );
}
