// words-codemod: keep — deprecated alias of /api/v1/trials/{trialId}/cooks/{cookId} (lib/api/deprecated-paths.ts), for one release.
export { PATCH } from '@/app/api/v1/trials/[trialId]/cooks/[cookId]/route';

export const dynamic = 'force-dynamic';
