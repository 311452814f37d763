/**
 * When a step happened. Absent, it is now. Given only by seeds (the demo's story days) and imports
 * of earlier records; no request, form or API body ever sets it.
 */
export interface RecordedAt {
  at?: Date;
}

export function momentOf(options: RecordedAt = {}): Date {
  return options.at ?? new Date();
}
