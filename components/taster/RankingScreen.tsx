'use client';

import { useState } from 'react';
import { Button, buttonClass } from '@/components/ui/Button';
import { moveCode } from '@/lib/taster';

/** All codes on one screen, reordered with up/down buttons (no drag needed), then saved. */
export function RankingScreen({
  initialOrder,
  attributeName,
  instruction,
  onSave,
}: {
  initialOrder: string[];
  attributeName: string;
  instruction: string;
  onSave: (order: string[]) => void;
}) {
  const [order, setOrder] = useState(initialOrder);
  const [moved, setMoved] = useState('');
  function move(index: number, delta: -1 | 1) {
    const next = moveCode(order, index, delta);
    setOrder(next);
    setMoved(`${order[index]} is now number ${index + delta + 1}.`);
  }
  return (
    <div className="space-y-5">
      <div>
        <h2 className="font-display text-2xl text-damson-900">{attributeName || 'Rank the samples'}</h2>
        <p className="mt-1 text-base text-rind-700">{instruction || 'Put the sample you like most at the top.'}</p>
        <p className="mt-1 text-sm text-rind-500">Best at the top.</p>
      </div>
      <ol className="space-y-2" aria-label="Your order, best first">
        {order.map((code, index) => (
          <li key={code} className="flex items-center gap-3 rounded-lg bg-white px-3 py-2 ring-1 ring-inset ring-rind-300">
            <span className="w-6 text-center text-sm font-semibold text-rind-500">{index + 1}</span>
            <span className="flex-1 font-display text-3xl tabular-nums tracking-wider text-damson-900">{code}</span>
            <button
              type="button"
              className={buttonClass('secondary', 'min-h-12 min-w-12 text-lg')}
              aria-label={`Move ${code} up`}
              disabled={index === 0}
              onClick={() => move(index, -1)}
            >
              ↑
            </button>
            <button
              type="button"
              className={buttonClass('secondary', 'min-h-12 min-w-12 text-lg')}
              aria-label={`Move ${code} down`}
              disabled={index === order.length - 1}
              onClick={() => move(index, 1)}
            >
              ↓
            </button>
          </li>
        ))}
      </ol>
      <p className="sr-only" aria-live="polite">
        {moved}
      </p>
      <Button type="button" className="min-h-12 w-full text-base" onClick={() => onSave(order)}>
        Save this order
      </Button>
    </div>
  );
}
