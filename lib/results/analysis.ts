/**
 * Turns a closed (or running) panel's answers into the analyses and plain-language verdicts
 * the results page shows. Pure: built only on lib/stats, no framework or database.
 */
import {
  analyseDiscriminationTest, blockedAnova, compareTreatmentMeans, describeTreatments, friedmanTest, penaltyAnalysis,
  type AnovaResult, type ComparisonResult, type DiscriminationResult, type FriedmanResult, type GroupDescription, type PenaltyAnalysisResult,
} from '@/lib/stats';
import type { SummaryTable } from './schema';
import { formatP } from './words';

export interface TastingDataSample {
  sampleId: string;
  /** The variant label (A, B, …), shown only to staff. */
  label: string;
  description: string;
}

export interface TastingDataAttribute {
  id: string;
  name: string;
  /** 'liking' (hedonic), 'just-about-right' or 'intensity'. */
  purpose: 'liking' | 'just-about-right' | 'intensity';
  /** For verdict wording: the high end of an intensity line, e.g. "Very firm". */
  highAnchor?: string;
}

export interface TastingDataAnswer {
  seatIndex: number;
  kind: 'rating' | 'ranking' | 'triangle';
  attribute: string;
  sampleId: string | null;
  value: number | null;
  /** Ranking: sample ids, first = rank 1. */
  rankingSampleIds: string[] | null;
  correct: boolean | null;
}

export interface TastingData {
  method: 'rated' | 'ranking' | 'triangle';
  samples: TastingDataSample[];
  attributes: TastingDataAttribute[];
  answers: TastingDataAnswer[];
  seatCount: number;
  submittedSeats: number;
}

export interface Verdict {
  headline: string;
  /** true: a difference unlikely to be chance; false: none shown; null: could not test. */
  differs: boolean | null;
  cautions: string[];
}

export interface AttributeAnalysis {
  attribute: TastingDataAttribute;
  descriptive: GroupDescription[];
  anova: AnovaResult;
  comparison: ComparisonResult;
  assessors: number;
  verdict: Verdict;
  /** Just-about-right attributes: one penalty analysis per sample, as the method intends. */
  penalties?: SamplePenalty[];
  /** All samples pooled: only when asked for (`pooledPenalty`), because it mixes products. */
  pooledPenalty?: PenaltyAnalysisResult;
}

export interface SamplePenalty {
  label: string;
  result: PenaltyAnalysisResult;
}

export interface AnalysisOptions {
  /** Also compute the penalty analysis over all samples together. Off by default. */
  pooledPenalty?: boolean;
  /**
   * Also each pair's Tukey p-value (a studentized-range integral per pair, most of a large tasting's
   * analysis time). The page and its CSVs show letters, not pairs' p: off by default; the API asks.
   */
  pairwiseP?: boolean;
}

export interface TastingAnalysis {
  method: TastingData['method'];
  attributes: AttributeAnalysis[];
  ranking?: { friedman: FriedmanResult; verdict: Verdict };
  triangle?: { result: DiscriminationResult; verdict: Verdict };
  /** Raw counts for charts: JAR shares per sample and attribute. */
  jarShares: Array<{ attributeId: string; label: string; tooLittle: number; justAboutRight: number; tooMuch: number; n: number }>;
}

/** Below this many assessors a verdict carries a caution (common practice, no published source). */
export const SMALL_PANEL = 12;
const ALPHA = 0.05;


function list(labels: string[]): string {
  return labels.length <= 1 ? labels.join('') : `${labels.slice(0, -1).join(', ')} and ${labels.at(-1)}`;
}

function comparative(attr: TastingDataAttribute): string {
  if (attr.purpose === 'liking') return 'liked more';
  if (attr.purpose === 'just-about-right') return `scored further towards “too much” ${attr.name.toLowerCase()}`;
  const word = (attr.highAnchor ?? attr.name).toLowerCase().replace(/^very\s+/, '');
  return `rated higher for ${attr.name.toLowerCase()}${word && word !== attr.name.toLowerCase() ? ` (towards “${word}”)` : ''}`;
}

function verdictFor(attr: TastingDataAttribute, anova: AnovaResult, cmp: ComparisonResult, assessors: number): Verdict {
  const cautions: string[] = [];
  if (assessors < SMALL_PANEL) cautions.push(`Only ${assessors} assessor${assessors === 1 ? '' : 's'}: treat the result as a first look (common practice is at least ${SMALL_PANEL}).`);
  if (anova.incomplete) cautions.push(anova.message ?? 'Some assessors did not score every sample; sums of squares are adjusted.');
  const treat = anova.rows.find((r) => r.source === 'treatments');
  if (!treat || treat.p === null) return { headline: anova.message ?? 'These answers do not allow a test.', differs: null, cautions };
  if (treat.p >= ALPHA) return { headline: `No clear difference between the samples on ${attr.name.toLowerCase()} (${formatP(treat.p)}).`, differs: false, cautions };
  // Name only pairs the letters separate: samples sharing no letter differ (Tukey HSD). `below` are those
  // apart from the top sample; the samples named above them are the top one and any other that is
  // apart from every one of them too. A sample tied with the top but sharing a letter with one below
  // it is named on neither side.
  const top = cmp.orderedLabels[0];
  const apart = (x: string, y: string) => ![...(cmp.letters[x] ?? '')].some((c) => (cmp.letters[y] ?? '').includes(c));
  const below = cmp.orderedLabels.filter((l) => apart(l, top));
  const above = cmp.orderedLabels.filter((l) => !below.includes(l) && below.every((b) => apart(l, b)));
  const who = above.length === 1 ? `Sample ${above[0]} is` : `Samples ${list(above)} are`;
  const headline = below.length
    ? `${who} ${comparative(attr)} than ${list(below)}; the difference is unlikely to be chance, ${formatP(treat.p)}.`
    : `The samples differ on ${attr.name.toLowerCase()} overall (${formatP(treat.p)}), but no single pair stands apart after Tukey's adjustment.`;
  return { headline, differs: true, cautions };
}

/** A rated tasting with a liking attribute runs a penalty analysis on each just-about-right attribute. */
function likingForPenalties(data: Pick<TastingData, 'method' | 'attributes'>): TastingDataAttribute | undefined {
  return data.method === 'rated' ? data.attributes.find((a) => a.purpose === 'liking') : undefined;
}

/**
 * The summary tables a tasting gives, known from its set-up before any answer is read: the results
 * page links their CSVs while the statistics are still loading. Means and ANOVA always (empty for a
 * ranking or a triangle), penalties, triangle and ranking as analyseTasting() fills them.
 */
export function summaryTablesOf(data: Pick<TastingData, 'method' | 'attributes'>): SummaryTable[] {
  const penalties = likingForPenalties(data) !== undefined && data.attributes.some((a) => a.purpose === 'just-about-right');
  return ['means', 'anova', ...(penalties ? (['penalty'] as const) : []), ...(data.method === 'triangle' ? (['triangle'] as const) : []), ...(data.method === 'ranking' ? (['ranking'] as const) : [])];
}

/**
 * Pairs each JAR answer with the same taster's liking of the same sample. Penalty analysis is run
 * per sample: a drop in liking means something only within one product (pooling lets one sample's
 * "too sweet" tasters and another's low liking make a penalty neither has).
 */
export function analyseTasting(data: TastingData, options: AnalysisOptions = {}): TastingAnalysis {
  const labelOf = new Map(data.samples.map((s) => [s.sampleId, s.label]));
  const out: TastingAnalysis = { method: data.method, attributes: [], jarShares: [] };

  if (data.method === 'rated') {
    const liking = likingForPenalties(data);
    for (const attr of data.attributes) {
      const obs = data.answers
        .filter((a) => a.kind === 'rating' && a.attribute === attr.id && a.sampleId && a.value !== null)
        .map((a) => ({ treatment: labelOf.get(a.sampleId!)!, block: `seat-${a.seatIndex}`, value: a.value! }));
      const anova = blockedAnova(obs);
      const comparison = compareTreatmentMeans(anova, { method: 'tukey-hsd', alpha: ALPHA, pairwiseP: options.pairwiseP === true });
      const assessors = new Set(obs.map((o) => o.block)).size;
      const descriptive = describeTreatments(obs).sort((x, y) => x.label.localeCompare(y.label));
      const analysis: AttributeAnalysis = { attribute: attr, descriptive, anova, comparison, assessors, verdict: verdictFor(attr, anova, comparison, assessors) };
      if (attr.purpose === 'just-about-right') {
        for (const s of data.samples) {
          const scores = obs.filter((o) => o.treatment === s.label).map((o) => o.value);
          out.jarShares.push({
            attributeId: attr.id, label: s.label, n: scores.length,
            tooLittle: scores.filter((v) => v <= 2).length, justAboutRight: scores.filter((v) => v === 3).length, tooMuch: scores.filter((v) => v >= 4).length,
          });
        }
        if (liking) {
          const likingBy = new Map(data.answers.filter((a) => a.kind === 'rating' && a.attribute === liking.id).map((a) => [`${a.seatIndex}|${a.sampleId}`, a.value]));
          const responsesOf = (sampleId: string | null) => data.answers
            .filter((a) => a.kind === 'rating' && a.attribute === attr.id && a.value !== null && (sampleId === null || a.sampleId === sampleId))
            .map((a) => ({ jarScore: a.value!, liking: likingBy.get(`${a.seatIndex}|${a.sampleId}`) ?? NaN }))
            .filter((r) => Number.isFinite(r.liking));
          analysis.penalties = [...data.samples]
            .sort((x, y) => x.label.localeCompare(y.label))
            .map((s) => ({ label: s.label, result: penaltyAnalysis(responsesOf(s.sampleId)) }));
          if (options.pooledPenalty) analysis.pooledPenalty = penaltyAnalysis(responsesOf(null));
        }
      }
      out.attributes.push(analysis);
    }
  }

  if (data.method === 'ranking') {
    const blocks = data.answers
      .filter((a) => a.kind === 'ranking' && a.rankingSampleIds)
      .map((a) => ({ block: `seat-${a.seatIndex}`, values: Object.fromEntries(a.rankingSampleIds!.map((id, i) => [labelOf.get(id) ?? id, i + 1])) }));
    const friedman = friedmanTest(blocks, { treatments: data.samples.map((s) => s.label) });
    const cautions = blocks.length < SMALL_PANEL ? [`Only ${blocks.length} ranking${blocks.length === 1 ? '' : 's'}: a first look (common practice is at least ${SMALL_PANEL}).`] : [];
    const best = [...friedman.treatments].sort((x, y) => friedman.rankSums[x] - friedman.rankSums[y])[0];
    const verdict: Verdict =
      friedman.p === null
        ? { headline: friedman.message ?? 'These rankings do not allow a test.', differs: null, cautions }
        : friedman.p < ALPHA
          ? { headline: `The rankings differ (${formatP(friedman.p)}); sample ${best} has the lowest rank sum, i.e. was put first most often.`, differs: true, cautions }
          : { headline: `No clear difference in the rankings (${formatP(friedman.p)}).`, differs: false, cautions };
    out.ranking = { friedman, verdict };
  }

  if (data.method === 'triangle') {
    const answers = data.answers.filter((a) => a.kind === 'triangle' && a.correct !== null);
    const correct = answers.filter((a) => a.correct).length;
    const result = analyseDiscriminationTest({ method: 'triangle', correct, total: answers.length, alpha: ALPHA });
    const cautions = answers.length < SMALL_PANEL ? [`Only ${answers.length} tasters: a first look.`] : [];
    const verdict: Verdict =
      result.pValue === null
        ? { headline: result.message ?? 'No answers to test.', differs: null, cautions }
        : result.differenceShown
          ? { headline: `${correct} of ${answers.length} tasters picked the odd sample: a perceptible difference, ${formatP(result.pValue)} (at least ${result.minimumCorrectForDifference} were needed).`, differs: true, cautions }
          : { headline: `${correct} of ${answers.length} tasters picked the odd sample: no difference shown, ${formatP(result.pValue)} (${result.minimumCorrectForDifference ?? '—'} needed at α = 0.05). This alone does not prove the samples are the same.`, differs: false, cautions };
    out.triangle = { result, verdict };
  }
  return out;
}
