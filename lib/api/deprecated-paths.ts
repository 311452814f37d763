// words-codemod: keep — this file names the old paths on purpose.
/**
 * API paths renamed by issue 18 ("one word per thing": tasting, taster, cook), kept for one release as
 * deprecated aliases. Each old path's app/api/v1/…/route.ts re-exports the handlers of the new one, so both
 * answer alike; API_OPERATIONS lists the old path with `deprecated: true`. Remove them in the next release.
 */
export const DEPRECATED_API_PATHS: ReadonlyArray<{ old: string; now: string }> = [
  { old: '/api/v1/trials/{trialId}/panels', now: '/api/v1/trials/{trialId}/tastings' },
  { old: '/api/v1/panels/{tastingId}', now: '/api/v1/tastings/{tastingId}' },
  { old: '/api/v1/panels/{tastingId}/open', now: '/api/v1/tastings/{tastingId}/open' },
  { old: '/api/v1/panels/{tastingId}/close', now: '/api/v1/tastings/{tastingId}/close' },
  { old: '/api/v1/panels/{tastingId}/invitations', now: '/api/v1/tastings/{tastingId}/invitations' },
  { old: '/api/v1/panels/{tastingId}/serving-sheet', now: '/api/v1/tastings/{tastingId}/serving-sheet' },
  { old: '/api/v1/panels/{tastingId}/results', now: '/api/v1/tastings/{tastingId}/results' },
  { old: '/api/v1/panels/{tastingId}/answers.csv', now: '/api/v1/tastings/{tastingId}/answers.csv' },
  { old: '/api/v1/panels/{tastingId}/summary.csv', now: '/api/v1/tastings/{tastingId}/summary.csv' },
  { old: '/api/v1/tasting/join', now: '/api/v1/tastings/join' },
  { old: '/api/v1/tasting/{seatToken}', now: '/api/v1/tastings/seats/{seatToken}' },
  { old: '/api/v1/tasting/{seatToken}/consent', now: '/api/v1/tastings/seats/{seatToken}/consent' },
  { old: '/api/v1/tasting/{seatToken}/answers', now: '/api/v1/tastings/seats/{seatToken}/answers' },
  { old: '/api/v1/tasting/{seatToken}/submit', now: '/api/v1/tastings/seats/{seatToken}/submit' },
  { old: '/api/v1/trials/{trialId}/measurements', now: '/api/v1/trials/{trialId}/cooks' },
  { old: '/api/v1/trials/{trialId}/measurements/import', now: '/api/v1/trials/{trialId}/cooks/import' },
  { old: '/api/v1/trials/{trialId}/measurements/{cookId}', now: '/api/v1/trials/{trialId}/cooks/{cookId}' },
  { old: '/api/v1/trials/{trialId}/measurements/{cookId}/withdraw', now: '/api/v1/trials/{trialId}/cooks/{cookId}/withdraw' },
];

/** The old path of a renamed one, or null. */
export function deprecatedAliasOf(path: string): string | null {
  return DEPRECATED_API_PATHS.find((p) => p.now === path)?.old ?? null;
}
