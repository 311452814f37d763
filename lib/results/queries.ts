import 'server-only';
/** Loads a session's answers for analysis and export. Staff only: this is where samples are unblinded. */
import { getEm } from '@/lib/db';
import type { Actor } from '@/lib/permissions';
import { loadTastingRows, tastingView } from '@/lib/tastings/queries';
import type { TastingRows, TastingView } from '@/lib/tastings/schema';
import { toCsv } from '@/lib/csv';
import { summaryTablesOf, type AnalysisOptions, type TastingAnalysis, type TastingData, type TastingDataAttribute } from './analysis';
import { analyseRemembered } from './analysis-memo';
import { ANOVA_SOURCE_WORDS, PENALTY_GROUP_WORDS, type AnswerRead, type AnswerRow, type ResultsSetup, type SummaryTable } from './schema';


/**
 * A session's answers as plain rows, only the columns the analysis reads (an answer row also keeps
 * every idempotency key it had): a full tasting is hundreds of rows, and making each an entity in
 * the identity map cost more than the query.
 */
async function answerRows(actor: Actor, tastingId: string): AnswerRead {
  const em = await getEm();
  const rows = await em.execute<AnswerRow[]>(
    'select seat_id, kind, attribute, sample_id, value, ranking, correct from panel_answers where workspace_id = ? and session_id = ?',
    [actor.workspaceId, tastingId],
  );
  // tastingView counts answers per seat through `seat.id`, as on the entity.
  return rows.map((r) => ({ ...r, seat: { id: r.seat_id } }));
}

/** The set-up of a tasting's results from its rows: everything but the answers (the tasting's 404 is decided reading the rows). */
function resultsSetupOf(rows: TastingRows): ResultsSetup {
  const { s, attrs, seats } = rows;
  // Seat progress is not shown with the results: no answers are needed for the rest of the view.
  const { title, state, samples } = tastingView(rows, []);
  const attributes: TastingDataAttribute[] = s.attributeIds.map((id) => attrs.find((a) => a.id === id)).filter((a): a is NonNullable<typeof a> => !!a).map((a) => ({
    id: a.id,
    name: a.name,
    purpose: a.scale.purpose === 'liking' ? 'liking' : a.scale.purpose === 'just-about-right' ? 'just-about-right' : 'intensity',
    highAnchor: a.scale.kind === 'line' ? a.scale.highAnchor : undefined,
  }));
  return {
    tastingId: s.id,
    session: { title, state, samples },
    method: s.method,
    attributes,
    seats: seats.map((x) => ({ id: x.id, seatIndex: x.seatIndex, servingOrder: x.servingOrder.map((c) => ({ code: c.code, sampleId: c.sampleId })) })),
    seatCount: seats.length,
    submittedSeats: seats.filter((x) => x.submittedAt).length,
    tables: summaryTablesOf({ method: s.method, attributes }),
  };
}

/** The analysis's input: the set-up with its answers (a ranking's codes read as samples through each seat's serving order). */
function tastingDataOf(setup: ResultsSetup, answers: AnswerRow[]): TastingData {
  const seatIndex = new Map(setup.seats.map((x) => [x.id, x.seatIndex]));
  const codeToSample = new Map<string, string>(setup.seats.flatMap((x) => x.servingOrder.map((c) => [`${x.id}|${c.code}`, c.sampleId] as [string, string])));
  return {
    method: setup.method,
    samples: setup.session.samples.map((x) => ({ sampleId: x.sampleId, label: x.variantLabel, description: x.variantDescription })),
    attributes: setup.attributes,
    answers: answers.map((a) => {
      const seatId = a.seat_id;
      return {
        seatIndex: seatIndex.get(seatId) ?? -1,
        kind: a.kind,
        attribute: a.attribute,
        sampleId: a.sample_id ?? null,
        value: a.value ?? null,
        rankingSampleIds: a.ranking ? a.ranking.map((code) => codeToSample.get(`${seatId}|${code}`) ?? code) : null,
        correct: a.correct ?? null,
      };
    }),
    seatCount: setup.seatCount,
    submittedSeats: setup.submittedSeats,
  };
}

export async function loadTastingData(actor: Actor, tastingId: string): Promise<{ data: TastingData; session: TastingView }> {
  // One set of reads serves both the session view and the analysis.
  const [rows, answers] = await Promise.all([loadTastingRows(actor, tastingId), answerRows(actor, tastingId)]);
  return { session: tastingView(rows, answers), data: tastingDataOf(resultsSetupOf(rows), answers) };
}

export async function getTastingResults(actor: Actor, tastingId: string, options: AnalysisOptions = {}): Promise<{ session: TastingView; analysis: TastingAnalysis; data: TastingData }> {
  const { data, session } = await loadTastingData(actor, tastingId);
  return { session, data, analysis: analyseRemembered(data, options) };
}

/**
 * The results page in two steps: the set-up first (the tasting of this workspace, or 404), shown
 * at once; then the answers and their analysis (analyseResults), which never decide a 404.
 */
export async function loadResultsSetup(actor: Actor, tastingId: string): Promise<ResultsSetup> {
  return resultsSetupOf(await loadTastingRows(actor, tastingId));
}

/** The statistics of a set-up loadResultsSetup() returned: its answers read (scoped to the workspace) and analysed. */
export async function analyseResults(actor: Actor, setup: ResultsSetup, options: AnalysisOptions = {}, answers: AnswerRead = answerRows(actor, setup.tastingId)): Promise<TastingAnalysis> {
  return analyseRemembered(tastingDataOf(setup, await answers), options);
}

/**
 * The answers, read while the page checks the tasting itself (loadResultsSetup), so the page waits
 * for one round trip instead of two. The read is scoped to the workspace: when the tasting turns out
 * not to exist, nothing was revealed, and nobody awaits the read, so its failure is nobody's.
 */
export function readAnswers(actor: Actor, tastingId: string): AnswerRead {
  const read = answerRows(actor, tastingId);
  read.catch(() => undefined);
  return read;
}

/** One answer as the raw export reads it: the triangle's chosen cup and when the answer was given besides. */
type ExportedAnswerRow = {
  seat_id: string; kind: AnswerRow['kind']; attribute: string; sample_id: string | null; value: number | null;
  ranking: string[] | null; odd_code: string | null; correct: boolean | null; updated_at: Date | string;
};

const yesNo = (x: boolean | null) => (x === null ? '' : x ? 'yes' : 'no');

/**
 * Raw answers, one row per answer, in long format: the seat (submitted or partial, and when it was
 * submitted), the blind code and its variant (for a triangle, the cup chosen as the odd one), the
 * attribute, the value, whether a triangle choice was correct, and when the answer was last given.
 * Words, not keys: seat_status is "submitted" or "partial"; correct is "yes"/"no"; times are ISO 8601 (UTC).
 */
export async function answersCsv(actor: Actor, tastingId: string): Promise<string> {
  // The tasting's rows first: another workspace's or a missing tasting is a 404 here.
  const rows = await loadTastingRows(actor, tastingId);
  const em = await getEm();
  const answers = await em.execute<ExportedAnswerRow[]>(
    'select seat_id, kind, attribute, sample_id, value, ranking, odd_code, correct, updated_at from panel_answers where workspace_id = ? and session_id = ? order by created_at, id',
    [actor.workspaceId, tastingId],
  );
  const seats = new Map(rows.seats.map((x) => [x.id, x]));
  const label = new Map(rows.samples.map((x) => [x.id, x.variantLabel]));
  const attrName = new Map(rows.attrs.map((a) => [a.id, a.name]));
  const sampleOfCode = (seatId: string, code: string) => seats.get(seatId)?.servingOrder.find((c) => c.code === code)?.sampleId;
  const codeOfSample = (seatId: string, sampleId: string) => seats.get(seatId)?.servingOrder.find((c) => c.sampleId === sampleId)?.code;
  const code = (a: ExportedAnswerRow) => (a.kind === 'rating' && a.sample_id ? codeOfSample(a.seat_id, a.sample_id) : a.kind === 'triangle' ? a.odd_code : null);
  const sampleOf = (a: ExportedAnswerRow) => (a.kind === 'rating' ? a.sample_id : a.kind === 'triangle' && a.odd_code ? sampleOfCode(a.seat_id, a.odd_code) : null);
  const attribute = (a: ExportedAnswerRow) =>
    a.kind === 'rating' ? attrName.get(a.attribute) : a.kind === 'ranking' ? (a.attribute === '*' ? 'preference' : attrName.get(a.attribute)) : 'odd sample';
  const value = (a: ExportedAnswerRow) =>
    a.kind === 'rating' ? a.value : a.kind === 'ranking' ? (a.ranking ?? []).map((c) => label.get(sampleOfCode(a.seat_id, c) ?? '') ?? c).join('>') : '';
  const ordered = [...answers].sort((x, y) => (seats.get(x.seat_id)?.seatIndex ?? -1) - (seats.get(y.seat_id)?.seatIndex ?? -1));
  return toCsv(ordered, [
    { header: 'session', value: () => rows.s.title },
    { header: 'seat', value: (a) => (seats.get(a.seat_id)?.seatIndex ?? -1) + 1 },
    { header: 'seat_status', value: (a) => (seats.get(a.seat_id)?.submittedAt ? 'submitted' : 'partial') },
    { header: 'seat_submitted_at', value: (a) => seats.get(a.seat_id)?.submittedAt ?? '' },
    { header: 'code', value: (a) => code(a) ?? '' },
    { header: 'variant', value: (a) => label.get(sampleOf(a) ?? '') ?? '' },
    { header: 'attribute', value: attribute },
    { header: 'value', value },
    { header: 'correct', value: (a) => (a.kind === 'triangle' ? yesNo(a.correct) : '') },
    { header: 'answered_at', value: (a) => new Date(a.updated_at).toISOString() },
  ]);
}

/** Every summary table of the results page as CSV: means (default), anova, penalty, triangle, ranking. */
export async function summaryCsv(actor: Actor, tastingId: string, table: SummaryTable = 'means'): Promise<string> {
  const { analysis } = await getTastingResults(actor, tastingId);
  if (table === 'anova') {
    const rows = analysis.attributes.flatMap((a) => a.anova.rows.map((r) => ({ a, r })));
    return toCsv(rows, [
      { header: 'attribute', value: (x) => x.a.attribute.name },
      { header: 'source', value: (x) => ANOVA_SOURCE_WORDS[x.r.source].toLowerCase() },
      { header: 'sum_of_squares', value: (x) => x.r.sumOfSquares },
      { header: 'df', value: (x) => x.r.df },
      { header: 'mean_square', value: (x) => x.r.meanSquare ?? '' },
      { header: 'f', value: (x) => x.r.f ?? '' },
      { header: 'p', value: (x) => x.r.p ?? '' },
    ]);
  }
  if (table === 'penalty') {
    // One penalty analysis per sample (variant).
    const rows = analysis.attributes.flatMap((a) => (a.penalties ?? []).flatMap((p) => (['tooLittle', 'justAboutRight', 'tooMuch'] as const).map((g) => ({ a, variant: p.label, g, x: p.result.groups[g] }))));
    return toCsv(rows, [
      { header: 'attribute', value: (r) => r.a.attribute.name },
      { header: 'variant', value: (r) => r.variant },
      { header: 'group', value: (r) => PENALTY_GROUP_WORDS[r.g].toLowerCase() },
      { header: 'count', value: (r) => r.x.count },
      { header: 'share', value: (r) => r.x.share },
      { header: 'mean_liking', value: (r) => r.x.meanLiking ?? '' },
      { header: 'mean_drop', value: (r) => r.x.meanDrop ?? '' },
      { header: 'weighted_penalty', value: (r) => r.x.weightedPenalty ?? '' },
      { header: 'share_at_least_20pct', value: (r) => (r.x.largeEnoughToInterpret ? 'yes' : 'no') },
    ]);
  }
  if (table === 'triangle') {
    const t = analysis.triangle?.result;
    return toCsv(t ? [t] : [], [
      { header: 'correct', value: (r) => r.correct },
      { header: 'total', value: (r) => r.total },
      { header: 'p_value', value: (r) => r.pValue ?? '' },
      { header: 'minimum_correct_alpha_0_05', value: (r) => r.minimumCorrectForDifference ?? '' },
      { header: 'discriminators_estimate', value: (r) => r.discriminators?.estimate ?? '' },
      { header: 'discriminators_upper_limit', value: (r) => r.discriminators?.upperConfidenceLimit ?? '' },
    ]);
  }
  if (table === 'ranking') {
    const f = analysis.ranking?.friedman;
    return toCsv(f ? f.treatments.map((t) => ({ t, f })) : [], [
      { header: 'variant', value: (r) => r.t },
      { header: 'rank_sum', value: (r) => r.f.rankSums[r.t] },
      { header: 'mean_rank', value: (r) => r.f.meanRanks[r.t] },
      { header: 'letters', value: (r) => r.f.letters[r.t] ?? '' },
      { header: 'friedman_statistic', value: (r) => r.f.statistic ?? '' },
      { header: 'p', value: (r) => r.f.p ?? '' },
    ]);
  }
  const rows = analysis.attributes.flatMap((a) => a.descriptive.map((d) => ({ a, d })));
  const p = (x: (typeof rows)[number]) => x.a.anova.rows.find((r) => r.source === 'treatments')?.p ?? '';
  return toCsv(rows, [
    { header: 'attribute', value: (x) => x.a.attribute.name },
    { header: 'variant', value: (x) => x.d.label },
    { header: 'n', value: (x) => x.d.n },
    { header: 'mean', value: (x) => x.d.mean ?? '' },
    { header: 'sd', value: (x) => x.d.standardDeviation ?? '' },
    { header: 'ci95_lower', value: (x) => x.d.confidenceInterval?.lower ?? '' },
    { header: 'ci95_upper', value: (x) => x.d.confidenceInterval?.upper ?? '' },
    { header: 'adjusted_mean', value: (x) => x.a.anova.treatments.find((t) => t.label === x.d.label)?.adjustedMean ?? '' },
    { header: 'tukey_letters', value: (x) => x.a.comparison.letters[x.d.label] ?? '' },
    { header: 'anova_p', value: p },
    { header: 'median', value: (x) => x.d.median ?? '' },
    { header: 'quartile_lower', value: (x) => x.d.quartiles?.lower ?? '' },
    { header: 'quartile_upper', value: (x) => x.d.quartiles?.upper ?? '' },
  ]);
}
