/** Pure: remembers recent analyses (no framework or database imports). */
import { analyseTasting, type AnalysisOptions, type TastingAnalysis, type TastingData } from './analysis';

/**
 * Recent analyses by their exact input. The analysis is pure and the heaviest step of the results
 * page (tens of ms of CPU per load); a room of people opening the same results, or a closed
 * tasting read again, gets the same input, so it is computed once. The key is the whole input, so
 * any changed answer, seat or label is a new key: nothing stale can be served. Callers only read
 * the shared result.
 */
export const ANALYSIS_MEMO_SIZE = 16;
const analysisMemo = new Map<string, TastingAnalysis>();

export function analyseRemembered(data: TastingData, options: AnalysisOptions = {}): TastingAnalysis {
  const key = JSON.stringify([data, options]);
  const hit = analysisMemo.get(key);
  if (hit) {
    // Most recently used last, so the oldest entry is the first to go.
    analysisMemo.delete(key);
    analysisMemo.set(key, hit);
    return hit;
  }
  const analysis = analyseTasting(data, options);
  analysisMemo.set(key, analysis);
  if (analysisMemo.size > ANALYSIS_MEMO_SIZE) analysisMemo.delete(analysisMemo.keys().next().value!);
  return analysis;
}

