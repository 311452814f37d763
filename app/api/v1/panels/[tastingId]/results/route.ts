// words-codemod: keep — deprecated alias of /api/v1/tastings/{tastingId}/results (lib/api/deprecated-paths.ts), for one release.
export { GET } from '@/app/api/v1/tastings/[tastingId]/results/route';

export const dynamic = 'force-dynamic';
