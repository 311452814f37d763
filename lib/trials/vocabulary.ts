/** Trial vocabulary shared by entities, schemas and screens. Pure data. */

/** Where a trial stands. The keys are stable; the labels are what people read. */
export const TRIAL_STATUSES = ['planning', 'cooking', 'tasting', 'decided', 'archived'] as const;
export type TrialStatus = (typeof TRIAL_STATUSES)[number];

export const TRIAL_STATUS_LABELS: Record<TrialStatus, string> = {
  planning: 'Drawing up',
  cooking: 'At the stove',
  tasting: 'On the panel',
  decided: 'Decided',
  archived: 'Shelved',
};

/** Allowed moves. A trial can step back (a re-cook) but never leave "Shelved" except to reopen planning. */
export const TRIAL_TRANSITIONS: Record<TrialStatus, TrialStatus[]> = {
  planning: ['cooking', 'archived'],
  cooking: ['planning', 'tasting', 'decided', 'archived'],
  tasting: ['cooking', 'decided', 'archived'],
  decided: ['tasting', 'archived'],
  archived: ['planning'],
};

/** The factors the plan helper varies. */
export const TRIAL_FACTORS = ['sugar_ratio', 'acid_dose', 'pectin_dose', 'target_solids'] as const;
export type TrialFactor = (typeof TRIAL_FACTORS)[number];

export const FACTOR_LABELS: Record<TrialFactor, { name: string; unit: string; help: string }> = {
  sugar_ratio: { name: 'Sugar ratio', unit: 'g sweetener per g fruit', help: 'All sweetener lines together, scaled to this multiple of the fruit mass.' },
  acid_dose: { name: 'Acid dose', unit: 'g per kg fruit', help: 'All acid lines together, scaled to this many grams per kilogram of fruit.' },
  pectin_dose: { name: 'Pectin dose', unit: 'g per kg fruit', help: 'All pectin lines together, scaled to this many grams per kilogram of fruit.' },
  target_solids: { name: 'Target soluble solids', unit: '°Brix', help: 'The soluble solids the batch is boiled to; the lines stay as they are.' },
};

/**
 * The widest levels a plan accepts per factor: far outside any preserve, so a slip of the keyboard
 * (5000 for 0.5) is refused rather than planned. Generous bounds, common practice, no published source.
 */
export const FACTOR_LEVEL_BOUNDS: Record<TrialFactor, { min: number; max: number }> = {
  sugar_ratio: { min: 0, max: 3 },
  acid_dose: { min: 0, max: 200 },
  pectin_dose: { min: 0, max: 60 },
  target_solids: { min: 20, max: 80 },
};

/** A small scale of our own for the cold-plate, spoon and flake set tests. */
export const SET_TEST_SCALE = [
  { value: 1, label: 'Runs freely', hint: 'No skin, floods back at once' },
  { value: 2, label: 'Slow flow', hint: 'Thickens, no wrinkle' },
  { value: 3, label: 'Soft wrinkle', hint: 'Wrinkles when pushed, still soft' },
  { value: 4, label: 'Clean set', hint: 'Wrinkles clearly, holds a line, flakes from the spoon' },
  { value: 5, label: 'Stiff', hint: 'Holds its shape, cuts with a knife' },
] as const;
export const SET_TEST_METHODS = ['cold_plate', 'spoon', 'flake'] as const;
export const SET_TEST_METHOD_LABELS: Record<(typeof SET_TEST_METHODS)[number], string> = {
  cold_plate: 'Cold plate',
  spoon: 'Spoon',
  flake: 'Flake (sheet test)',
};
export const SYNERESIS_LEVELS = ['none', 'slight', 'marked'] as const;
export const SYNERESIS_LABELS: Record<(typeof SYNERESIS_LEVELS)[number], string> = {
  none: 'None',
  slight: 'Slight weeping',
  marked: 'Marked weeping',
};
