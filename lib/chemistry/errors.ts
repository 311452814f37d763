/** Raised for input that the chemistry cannot work with; `field` is a path such as `lines[2].quantity`. */
export class ChemistryInputError extends Error {
  readonly field: string;

  constructor(field: string, message: string) {
    super(`${field}: ${message}`);
    this.name = 'ChemistryInputError';
    this.field = field;
  }
}

export function requireFiniteNumber(value: unknown, field: string): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new ChemistryInputError(field, 'must be a finite number');
  }
  return value;
}
