// words-codemod: keep — deprecated alias of /api/v1/tastings/{tastingId}/summary.csv (lib/api/deprecated-paths.ts), for one release.
export { GET } from '@/app/api/v1/tastings/[tastingId]/summary.csv/route';

export const dynamic = 'force-dynamic';
