// words-codemod: keep — deprecated alias of /api/v1/trials/{trialId}/cooks/{cookId}/withdraw (lib/api/deprecated-paths.ts), for one release.
export { POST } from '@/app/api/v1/trials/[trialId]/cooks/[cookId]/withdraw/route';

export const dynamic = 'force-dynamic';
