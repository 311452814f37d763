/** Raised for input that the chemistry cannot work with; `field` is a path such as `lines[2].quantity`. */
export class ChemistryInputError extends Error {
  readonly field: string;

  constructor(field: string, message: string) {
    super(`${field}: ${message}`);
    this.name = 'ChemistryInputError';
    this.field = field;
  }
}

/** The message without its field path, for a screen ("sampleTempC: the table covers…" → "The table covers…"). */
export function plainChemistryMessage(err: ChemistryInputError): string {
  const detail = err.message.startsWith(`${err.field}: `) ? err.message.slice(err.field.length + 2) : err.message;
  return detail.charAt(0).toUpperCase() + detail.slice(1);
}

export function requireFiniteNumber(value: unknown, field: string): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new ChemistryInputError(field, 'must be a finite number');
  }
  return value;
}
