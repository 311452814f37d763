// words-codemod: keep — deprecated alias of /api/v1/tastings/{tastingId}/serving-sheet (lib/api/deprecated-paths.ts), for one release.
export { GET } from '@/app/api/v1/tastings/[tastingId]/serving-sheet/route';

export const dynamic = 'force-dynamic';
