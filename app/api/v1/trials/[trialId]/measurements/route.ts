// words-codemod: keep — deprecated alias of /api/v1/trials/{trialId}/cooks (lib/api/deprecated-paths.ts), for one release.
export { GET, POST } from '@/app/api/v1/trials/[trialId]/cooks/route';

export const dynamic = 'force-dynamic';
