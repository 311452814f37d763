'use client';

import { useState } from 'react';
import { Button } from '@/components/ui/Button';
import { CONFIDENCE_CHOICES, type AnswerPayload, type TriangleAnswer, type TriangleConfidence } from '@/lib/taster';

const COMMENT_MAX = 500;

function choiceClass(checked: boolean) {
  return `flex min-h-12 cursor-pointer items-center gap-3 rounded-lg px-4 py-3 ring-1 ring-inset has-[:focus-visible]:ring-2 has-[:focus-visible]:ring-quince-400 ${
    checked ? 'bg-damson-700 text-pith-50 ring-damson-700' : 'bg-white text-rind-900 ring-rind-300'
  }`;
}

/** Three codes in serving order; the taster picks the odd one, and may say how sure they are. */
export function TriangleScreen({
  codes,
  saved,
  onAnswer,
  onContinue,
  continueLabel,
}: {
  codes: string[];
  saved: TriangleAnswer | null;
  onAnswer: (answer: AnswerPayload & { kind: 'triangle' }, options: { debounce?: boolean }) => void;
  onContinue: () => void;
  continueLabel: string;
}) {
  const [oddCode, setOddCode] = useState(saved?.oddCode);
  const [confidence, setConfidence] = useState<TriangleConfidence | undefined>(saved?.confidence);
  const [comment, setComment] = useState(saved?.comment ?? '');

  function send(next: { oddCode?: string; confidence?: TriangleConfidence; comment: string }, debounce = false) {
    // Confidence and comment only mean something next to a choice.
    if (!next.oddCode) return;
    const answer: AnswerPayload & { kind: 'triangle' } = { kind: 'triangle', oddCode: next.oddCode };
    if (next.confidence !== undefined) answer.confidence = next.confidence;
    if (next.comment.trim()) answer.comment = next.comment.trim();
    onAnswer(answer, { debounce });
  }

  return (
    <div className="space-y-6">
      <div>
        <p className="text-sm text-rind-600">Taste the three samples in this order, left to right:</p>
        <p className="mt-2 flex justify-between gap-2 font-display text-4xl tabular-nums tracking-wider text-damson-900">
          {codes.map((c) => (
            <span key={c}>{c}</span>
          ))}
        </p>
        <p className="mt-2 text-sm text-rind-600">Two are the same and one is different.</p>
      </div>
      <fieldset>
        <legend className="font-display text-xl text-damson-900">Which sample is the odd one?</legend>
        <div className="mt-3 flex flex-col gap-2">
          {codes.map((code) => (
            <label key={code} className={choiceClass(oddCode === code)}>
              <input
                type="radio"
                name="odd-sample"
                value={code}
                checked={oddCode === code}
                onChange={() => {
                  setOddCode(code);
                  send({ oddCode: code, confidence, comment });
                }}
                className="size-6 accent-quince-400"
              />
              <span className="font-display text-3xl tabular-nums tracking-wider">{code}</span>
            </label>
          ))}
        </div>
      </fieldset>
      <fieldset>
        <legend className="text-lg font-semibold text-rind-800">How sure are you? (optional)</legend>
        <div className="mt-2 grid grid-cols-3 gap-2">
          {CONFIDENCE_CHOICES.map((choice) => (
            <label key={choice.value} className={`${choiceClass(confidence === choice.value)} justify-center text-center text-sm`}>
              <input
                type="radio"
                name="confidence"
                value={choice.value}
                checked={confidence === choice.value}
                disabled={!oddCode}
                onChange={() => {
                  setConfidence(choice.value);
                  send({ oddCode, confidence: choice.value, comment });
                }}
                className="sr-only"
              />
              <span>{choice.label}</span>
            </label>
          ))}
        </div>
      </fieldset>
      <div>
        <label htmlFor="triangle-comment" className="mb-1 block text-lg font-semibold text-rind-800">
          Comment (optional)
        </label>
        <textarea
          id="triangle-comment"
          rows={3}
          maxLength={COMMENT_MAX}
          value={comment}
          disabled={!oddCode}
          onChange={(e) => {
            setComment(e.target.value);
            send({ oddCode, confidence, comment: e.target.value }, true);
          }}
          className="block w-full rounded-lg border-0 bg-white px-3 py-2 text-base text-rind-900 ring-1 ring-inset ring-rind-300 focus:ring-2 focus:ring-damson-500"
        />
      </div>
      <Button type="button" className="min-h-12 w-full text-base" disabled={!oddCode} onClick={onContinue}>
        {continueLabel}
      </Button>
    </div>
  );
}
