// words-codemod: keep — deprecated alias of /api/v1/tastings/{tastingId} (lib/api/deprecated-paths.ts), for one release.
export { GET, PATCH, DELETE } from '@/app/api/v1/tastings/[tastingId]/route';

export const dynamic = 'force-dynamic';
