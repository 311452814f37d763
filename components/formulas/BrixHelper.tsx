'use client';

import { useId, useState } from 'react';
import { BRIX_CORRECTION_RANGE, ChemistryInputError, plainChemistryMessage, celsiusToFahrenheit, correctBrixTo20C, correctionCaution, fahrenheitToCelsius, type BrixCorrection } from '@/lib/chemistry';
import { inputClass } from '@/components/ui/Field';
import { Notice } from '@/components/ui/Notice';
import { parseDecimal } from './editor-state';
import { formatSigned, type TemperatureUnit } from '@/lib/format/quantities';

/** Rows of the correction table that were recalled rather than read, e.g. "18, 19, 21–25 °C". */

type BrixOutcome = { ok: true; correction: BrixCorrection } | { ok: false; field: 'readingBrix' | 'sampleTempC'; message: string } | null;

export function correctReading(readingText: string, temperatureText: string, unit: TemperatureUnit): BrixOutcome {
  const reading = parseDecimal(readingText);
  const temperature = parseDecimal(temperatureText);
  if (reading === null || temperature === null) return null;
  if (Number.isNaN(reading)) return { ok: false, field: 'readingBrix', message: 'The reading must be a number.' };
  if (Number.isNaN(temperature)) return { ok: false, field: 'sampleTempC', message: 'The temperature must be a number.' };
  const tempC = unit === 'C' ? temperature : fahrenheitToCelsius(temperature);
  try {
    return { ok: true, correction: correctBrixTo20C(reading, tempC) };
  } catch (err) {
    if (err instanceof ChemistryInputError) {
      const field = err.field === 'readingBrix' ? 'readingBrix' : 'sampleTempC';
      let message = plainChemistryMessage(err);
      if (field === 'sampleTempC' && unit === 'F') {
        message += ` (${celsiusToFahrenheit(BRIX_CORRECTION_RANGE.minTempC).toFixed(0)}–${celsiusToFahrenheit(BRIX_CORRECTION_RANGE.maxTempC).toFixed(0)} °F).`;
      }
      return { ok: false, field, message };
    }
    throw err;
  }
}

/** Refractometer reading at the sample's temperature → °Brix at 20 °C. */
export function BrixHelper({ temperatureUnit }: { temperatureUnit: TemperatureUnit }) {
  const uid = useId();
  const [readingText, setReadingText] = useState('');
  const [temperatureText, setTemperatureText] = useState('');
  const outcome = correctReading(readingText, temperatureText, temperatureUnit);
  const readingError = outcome && !outcome.ok && outcome.field === 'readingBrix' ? outcome.message : undefined;
  const temperatureError = outcome && !outcome.ok && outcome.field === 'sampleTempC' ? outcome.message : undefined;
  const id = (suffix: string) => `${uid}-${suffix}`;

  return (
    <section aria-labelledby={id('title')} className="space-y-3">
      <h2 id={id('title')} className="font-display text-xl text-damson-900">
        Refractometer correction
      </h2>
      <p className="text-sm text-rind-600">For a sucrose-scale refractometer without automatic temperature compensation.</p>
      <div className="grid gap-3 sm:grid-cols-2">
        <div>
          <label htmlFor={id('reading')} className="mb-1 block text-sm font-medium text-rind-700">
            Reading (°Brix)
          </label>
          <input
            id={id('reading')}
            inputMode="decimal"
            value={readingText}
            onChange={(e) => setReadingText(e.target.value)}
            aria-invalid={readingError ? true : undefined}
            aria-describedby={readingError ? id('reading-err') : undefined}
            className={`${inputClass} min-h-10`}
          />
          {readingError ? (
            <p id={id('reading-err')} role="alert" className="mt-1 text-sm text-ember-700">
              {readingError}
            </p>
          ) : null}
        </div>
        <div>
          <label htmlFor={id('temp')} className="mb-1 block text-sm font-medium text-rind-700">
            Sample temperature (°{temperatureUnit})
          </label>
          <input
            id={id('temp')}
            inputMode="decimal"
            value={temperatureText}
            onChange={(e) => setTemperatureText(e.target.value)}
            aria-invalid={temperatureError ? true : undefined}
            aria-describedby={temperatureError ? id('temp-err') : undefined}
            className={`${inputClass} min-h-10`}
          />
          {temperatureError ? (
            <p id={id('temp-err')} role="alert" className="mt-1 text-sm text-ember-700">
              {temperatureError}
            </p>
          ) : null}
        </div>
      </div>
      <div aria-live="polite">
        {outcome && outcome.ok ? (
          <dl className="grid gap-2 rounded-lg bg-pith-100 p-3 text-sm ring-1 ring-pith-300 sm:grid-cols-2">
            <div>
              <dt className="text-rind-600">Corrected to 20 °C</dt>
              <dd data-testid="brix-corrected" className="font-display text-lg tabular-nums text-damson-900">
                {outcome.correction.correctedBrix20C.toFixed(2)} °Brix
              </dd>
            </div>
            <div>
              <dt className="text-rind-600">Correction</dt>
              <dd data-testid="brix-correction" className="font-display text-lg tabular-nums text-damson-900">
                {formatSigned(outcome.correction.correctionBrix, 2)} °Brix
              </dd>
            </div>
            <p className="text-xs text-rind-500 sm:col-span-2">Source: {outcome.correction.source}</p>
            {correctionCaution(outcome.correction) ? (
              <div className="sm:col-span-2">
                <Notice tone="info">{correctionCaution(outcome.correction)}</Notice>
              </div>
            ) : null}
          </dl>
        ) : null}
      </div>
    </section>
  );
}
