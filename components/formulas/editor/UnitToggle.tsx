'use client';

/** A two-way segmented switch (Metric / Imperial, °C / °F); each side is a real button with aria-pressed. */
export function UnitToggle<T extends string>({
  label,
  value,
  options,
  onChange,
}: {
  label: string;
  value: T;
  options: ReadonlyArray<{ value: T; label: string }>;
  onChange: (value: T) => void;
}) {
  return (
    <div role="group" aria-label={label} className="inline-flex rounded-lg bg-pith-200 p-1 ring-1 ring-inset ring-pith-300">
      {options.map((o) => {
        const active = o.value === value;
        return (
          <button
            key={o.value}
            type="button"
            aria-pressed={active}
            onClick={() => {
              if (!active) onChange(o.value);
            }}
            className={`min-h-10 rounded-md px-3 text-sm font-semibold transition-colors focus-visible:outline-2 focus-visible:outline-damson-500 ${
              active ? 'bg-damson-700 text-pith-50 shadow-sm' : 'text-damson-800 hover:bg-damson-50'
            }`}
          >
            {o.label}
          </button>
        );
      })}
    </div>
  );
}
