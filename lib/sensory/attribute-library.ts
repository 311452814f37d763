/**
 * The attribute library a new workspace starts with. Workspaces edit their own copy;
 * `createDefaultAttributeLibrary()` always returns fresh objects.
 *
 * Scale choices:
 * - Texture and tartness use 0–10 intensity lines: they change with pectin, acid and cook
 *   time, and an intensity score lets batches be compared with each other.
 * - Sweetness uses just-about-right: sugar is the lever a maker adjusts to taste, and JAR
 *   answers say which way to move it.
 * - Fruit flavour uses an intensity line rather than JAR: fruit flavour fades with longer
 *   boiling, so the useful question is "how much is left", and "much too fruity" is an
 *   answer tasters rarely give, which leaves a JAR scale lopsided.
 * - Overall liking uses the 9-point hedonic scale.
 */
import {
  HEDONIC_9_POINT,
  SET_FIRMNESS_LINE,
  makeIntensityLine,
  makeJustAboutRightScale,
  type SensoryScale,
} from './scales';

export type AttributeModality = 'texture' | 'taste' | 'flavour' | 'liking';

export interface SensoryAttribute {
  id: string;
  name: string;
  modality: AttributeModality;
  scale: SensoryScale;
  /** What the taster does and attends to, shown above the scale. */
  tasterInstruction: string;
  /**
   * Shown to the maker when results suggest changing the recipe along this attribute,
   * where the change can affect keeping quality or safety.
   */
  formulationCaution?: string;
}

/**
 * Lowering sugar in a preserve is a safety question, not only a taste one.
 * Sugar binds water and, with acid, is what keeps a standard preserve shelf-stable.
 */
export const REDUCED_SUGAR_CAUTION =
  'Sugar does more than sweeten: at standard levels it lowers water activity and, with ' +
  'acidity, keeps the preserve from spoiling. A lower-sugar version may need a different ' +
  'pectin, refrigeration after opening, a preservative or a validated heat process, and ' +
  'must keep pH at or below 4.6. Local food-safety codes and licensed practice govern; ' +
  'check with your food-safety authority before selling a reduced-sugar product.';

/** Adding or removing acid shifts pH, which sets both gel strength and safety margin. */
export const ACIDITY_CHANGE_CAUTION =
  'Changing acid to adjust tartness also changes pH. Above pH 4.6 a preserve is no longer ' +
  'an acid food and standard hot-fill practice is not enough. Measure pH after any change; ' +
  'local food-safety codes and licensed practice govern.';

/** Returns a fresh copy of the default attributes, in the order tasters meet them. */
export function createDefaultAttributeLibrary(): SensoryAttribute[] {
  return [
    {
      id: 'set-firmness',
      name: 'Set firmness',
      modality: 'texture',
      scale: SET_FIRMNESS_LINE,
      tasterInstruction:
        'Before tasting, press the back of a clean spoon gently into the sample and lift it. ' +
        'Mark how firmly it holds its shape: runs freely at one end, stands up in a block at the other.',
    },
    {
      id: 'spreadability',
      name: 'Spreadability',
      modality: 'texture',
      scale: makeIntensityLine('intensity-spreadability', 'Spreadability', 'Hard to spread', 'Spreads very easily'),
      tasterInstruction:
        'Spread a spoonful across the cracker or bread provided in one stroke. ' +
        'Mark how easily it spreads in an even layer without tearing or pooling.',
    },
    {
      id: 'tartness',
      name: 'Tartness',
      modality: 'taste',
      scale: makeIntensityLine('intensity-tartness', 'Tartness', 'Not tart at all', 'Extremely tart'),
      tasterInstruction:
        'Take a half spoonful and let it sit on your tongue for a moment. ' +
        'Mark how sharp or sour it tastes, leaving sweetness aside.',
      formulationCaution: ACIDITY_CHANGE_CAUTION,
    },
    {
      id: 'sweetness',
      name: 'Sweetness',
      modality: 'taste',
      scale: makeJustAboutRightScale('jar-sweetness', 'Sweetness'),
      tasterInstruction:
        'Taste again and think about how sweet it is for a fruit spread. ' +
        'Choose whether the sweetness is too little, just about right, or too much for you.',
      formulationCaution: REDUCED_SUGAR_CAUTION,
    },
    {
      id: 'fruit-flavour',
      name: 'Fruit flavour',
      modality: 'flavour',
      scale: makeIntensityLine('intensity-fruit-flavour', 'Fruit flavour', 'No fruit flavour', 'Very strong fruit flavour'),
      tasterInstruction:
        'Breathe out through your nose as you swallow. ' +
        'Mark how strongly the fresh fruit comes through, apart from sugar and cooked notes.',
    },
    {
      id: 'overall-liking',
      name: 'Overall liking',
      modality: 'liking',
      scale: HEDONIC_9_POINT,
      tasterInstruction:
        'Thinking about everything together, how much do you like this sample? ' +
        'There is no right answer; choose the phrase that fits you.',
    },
  ];
}

/** The default library as a read-only list, e.g. for display before a workspace exists. */
export const DEFAULT_ATTRIBUTE_LIBRARY: readonly SensoryAttribute[] = Object.freeze(
  createDefaultAttributeLibrary().map((attribute) => Object.freeze(attribute)),
);

/** Attribute by id in the default library; undefined for unknown ids. */
export function defaultAttributeById(attributeId: string): SensoryAttribute | undefined {
  return DEFAULT_ATTRIBUTE_LIBRARY.find((attribute) => attribute.id === attributeId);
}

/**
 * Which library attributes a trial's factors call for: a sugar change is judged on sweetness, an
 * acid change on tartness, a pectin change on the set and the spread. Common practice, no published source.
 */
export const ATTRIBUTES_FOR_FACTOR: Readonly<Record<string, readonly string[]>> = {
  sugar_ratio: ['sweetness'],
  acid_dose: ['tartness'],
  pectin_dose: ['set-firmness', 'spreadability'],
};
/** Asked at every rated tasting: the workspace defaults. */
export const DEFAULT_TASTING_ATTRIBUTES: readonly string[] = ['overall-liking', 'fruit-flavour'];

/** The attributes to tick first for a trial's tasting: the defaults plus those its factors call for, never the whole library. */
export function suggestAttributes<T extends { id: string; libraryKey: string | null }>(attributes: readonly T[], factors: readonly string[]): string[] {
  const wanted = new Set([...DEFAULT_TASTING_ATTRIBUTES, ...factors.flatMap((f) => ATTRIBUTES_FOR_FACTOR[f] ?? [])]);
  return attributes.filter((a) => a.libraryKey !== null && wanted.has(a.libraryKey)).map((a) => a.id);
}
