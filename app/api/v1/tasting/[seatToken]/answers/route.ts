// words-codemod: keep — deprecated alias of /api/v1/tastings/seats/{seatToken}/answers (lib/api/deprecated-paths.ts), for one release.
export { PUT } from '@/app/api/v1/tastings/seats/[seatToken]/answers/route';

export const dynamic = 'force-dynamic';
