// words-codemod: keep — deprecated alias of /api/v1/tastings/{tastingId}/open (lib/api/deprecated-paths.ts), for one release.
export { POST } from '@/app/api/v1/tastings/[tastingId]/open/route';

export const dynamic = 'force-dynamic';
