/**
 * What the model page of a family shows, from its path and query: the data set (all the family's
 * trials or the ones picked), the chosen response and model kind, the fit and its diagnostics, the
 * curvature test, the history, and the contour's axes. Query values that are not valid fall back to
 * the defaults (a page never fails on its query).
 */
import { notFound, type Actor } from '@/lib/permissions';
import { fitResponse, curvatureTest, modelHistory, varyingFactors, type FitResult, type HistoryStep } from './fit';
import type { CurvatureTest } from '@/lib/models';
import { modelDataset } from './queries';
import {
  DEFAULT_MODEL_FACTORS,
  familySlugSchema,
  modelFactorSchema,
  modelKindSchema,
  responseKeySchema,
  MAX_SELECTED_TRIALS,
  type Dataset,
  type FamilyInfo,
  type ModelFactor,
  type ModelKindKey,
  type ResponseInfo,
} from './schema';
import { isUuid } from '@/lib/ids';

export type SearchValue = string | string[] | undefined;

function first(value: SearchValue): string | undefined {
  return Array.isArray(value) ? value[0] : value;
}

/** The family in a path, or 404 (as for a family of another workspace). */
export function familyFromPath(value: string | undefined) {
  const parsed = familySlugSchema.safeParse(value ?? '');
  if (!parsed.success) throw notFound('product family');
  return parsed.data;
}

export interface ModelPageData {
  family: FamilyInfo;
  dataset: Dataset;
  /** The family's trials, for the picker, in date order. */
  trials: Array<{ id: string; code: string; title: string; date: string; variants: number; selected: boolean }>;
  response: ResponseInfo | null;
  kind: ModelKindKey | null;
  factors: ModelFactor[];
  fit: FitResult | null;
  curvature: CurvatureTest | null;
  history: HistoryStep[];
  contour: { x: ModelFactor; y: ModelFactor; fixed: Partial<Record<ModelFactor, number>> } | null;
}

export async function modelPage(actor: Actor, familyValue: string | undefined, query: Record<string, SearchValue>): Promise<ModelPageData> {
  const familyKey = familyFromPath(familyValue);
  const all = await modelDataset(actor, { family: familyKey });
  if (!all.family) throw notFound('product family');
  const family = all.family;

  const trialMap = new Map<string, ModelPageData['trials'][number]>();
  for (const row of all.rows) {
    const entry = trialMap.get(row.trialId) ?? { id: row.trialId, code: row.trialCode, title: row.trialTitle, date: row.trialDate, variants: 0, selected: false };
    entry.variants++;
    trialMap.set(row.trialId, entry);
  }
  const picked = new Set(([] as string[]).concat(query.trials ?? []).slice(0, MAX_SELECTED_TRIALS).filter((id) => isUuid(id) && trialMap.has(id)));
  const trials = [...trialMap.values()].map((t) => ({ ...t, selected: picked.size === 0 || picked.has(t.id) }));
  const rows = all.rows.filter((r) => picked.size === 0 || picked.has(r.trialId));
  const dataset: Dataset = { ...all, rows };

  const responseKey = responseKeySchema.safeParse(first(query.response) ?? '');
  const response =
    (responseKey.success ? dataset.responses.find((r) => r.key === responseKey.data) : undefined) ??
    dataset.responses.find((r) => r.libraryKey === 'overall-liking') ??
    dataset.responses[0] ??
    null;
  const kindParsed = modelKindSchema.safeParse(first(query.kind) ?? '');
  const kind = kindParsed.success ? kindParsed.data : null;
  const factors = varyingFactors(rows, DEFAULT_MODEL_FACTORS);

  const fit = response && factors.length ? fitResponse(rows, response, factors, kind ?? undefined) : null;
  const history = response && factors.length ? modelHistory(rows, response, factors, kind ?? undefined) : [];
  const curvature = fit?.ok ? curvatureTest(fit.model.surface) : null;

  let contour: ModelPageData['contour'] = null;
  if (fit?.ok && factors.length >= 2) {
    const asked = (key: string) => {
      const parsed = modelFactorSchema.safeParse(first(query[key]) ?? '');
      return parsed.success && factors.includes(parsed.data) ? parsed.data : undefined;
    };
    const x = asked('x') ?? factors[0];
    let y = asked('y') ?? factors.find((f) => f !== x)!;
    if (y === x) y = factors.find((f) => f !== x)!;
    const box = fit.model.surface.dataBox;
    const fixed: Partial<Record<ModelFactor, number>> = {};
    for (const f of factors) {
      if (f === x || f === y) continue;
      const range = box.find((r) => r.name === f)!;
      fixed[f] = (range.low + range.high) / 2;
    }
    contour = { x, y, fixed };
  }
  return { family, dataset, trials, response, kind, factors, fit, curvature, history, contour };
}
