'use client';

import { lineValueAfterKey, snapToStep, type AttributeView, type CategoryScaleView, type LineScaleView } from '@/lib/taster';

interface ScaleInputProps<S> {
  code: string;
  attribute: AttributeView & { scale: S };
  value: number | undefined;
  onChange: (value: number) => void;
}

/** A vertical list of large radio buttons, in the order the scale lists its points. */
export function CategoryScaleInput({ code, attribute, value, onChange }: ScaleInputProps<CategoryScaleView>) {
  const instructionId = `instr-${code}-${attribute.id}`;
  return (
    <fieldset aria-describedby={attribute.instruction ? instructionId : undefined}>
      <legend className="font-display text-xl text-damson-900">{attribute.name}</legend>
      {attribute.instruction ? (
        <p id={instructionId} className="mt-1 text-base text-rind-600">
          {attribute.instruction}
        </p>
      ) : null}
      <div className="mt-3 flex flex-col gap-2">
        {attribute.scale.points.map((point) => {
          const checked = value === point.value;
          return (
            <label
              key={point.value}
              className={`flex min-h-12 cursor-pointer items-center gap-3 rounded-lg px-4 py-3 text-lg ring-1 ring-inset transition-colors has-[:focus-visible]:ring-2 has-[:focus-visible]:ring-quince-400 ${
                checked ? 'bg-damson-700 text-pith-50 ring-damson-700' : 'bg-white text-rind-900 ring-rind-300'
              }`}
            >
              <input
                type="radio"
                name={`${code}-${attribute.id}`}
                value={point.value}
                checked={checked}
                onChange={() => onChange(point.value)}
                className="size-6 shrink-0 accent-quince-400"
              />
              <span>{point.label}</span>
            </label>
          );
        })}
      </div>
    </fieldset>
  );
}

/**
 * A 0–10 line with its two anchors and a numeric readout; arrow keys move it one step. Until it is
 * marked it shows no thumb and no fill (the `line-unmarked` rules in globals.css), so the untouched
 * slider does not point at the middle of the scale.
 */
export function LineScaleInput({ code, attribute, value, onChange }: ScaleInputProps<LineScaleView>) {
  const { scale } = attribute;
  const inputId = `line-${code}-${attribute.id}`;
  const middle = snapToStep((scale.min + scale.max) / 2, scale);
  return (
    <div>
      <label htmlFor={inputId} className="block font-display text-xl text-damson-900">
        {attribute.name}
      </label>
      {attribute.instruction ? <p className="mt-1 text-base text-rind-600">{attribute.instruction}</p> : null}
      <div className="mt-3 flex items-baseline justify-between gap-3">
        <output htmlFor={inputId} aria-live="polite" className="font-display text-3xl tabular-nums text-damson-800">
          {value === undefined ? '–' : value}
        </output>
        {value === undefined ? <span className="text-sm text-rind-500">Not marked yet: move the slider</span> : null}
      </div>
      <input
        id={inputId}
        type="range"
        min={scale.min}
        max={scale.max}
        step={scale.step}
        value={value ?? middle}
        aria-valuetext={value === undefined ? 'Not marked yet' : String(value)}
        onChange={(e) => onChange(snapToStep(Number(e.currentTarget.value), scale))}
        onClick={(e) => {
          // A tap on the untouched thumb fires no change event, yet it is a mark.
          if (value === undefined) onChange(snapToStep(Number(e.currentTarget.value), scale));
        }}
        onPointerUp={(e) => {
          // A finger's tap at the middle (where the hidden thumb sits) fires neither a change nor a
          // click in Chromium: the lifted pointer is the mark. A scroll cancels the pointer, so it marks nothing.
          if (value === undefined) onChange(snapToStep(Number(e.currentTarget.value), scale));
        }}
        onKeyDown={(e) => {
          const next = lineValueAfterKey(value, e.key, scale);
          if (next === null) return;
          e.preventDefault();
          onChange(next);
        }}
        data-marked={value === undefined ? 'no' : 'yes'}
        className={`mt-2 h-12 w-full cursor-pointer accent-damson-700 ${value === undefined ? 'line-unmarked' : ''}`}
      />
      <div className="flex justify-between gap-4 text-sm text-rind-700">
        <span>
          <span className="font-semibold tabular-nums">{scale.min}</span> {scale.lowAnchor}
        </span>
        <span className="text-right">
          {scale.highAnchor} <span className="font-semibold tabular-nums">{scale.max}</span>
        </span>
      </div>
    </div>
  );
}
