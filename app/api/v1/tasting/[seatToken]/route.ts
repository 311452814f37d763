// words-codemod: keep — deprecated alias of /api/v1/tastings/seats/{seatToken} (lib/api/deprecated-paths.ts), for one release.
export { GET } from '@/app/api/v1/tastings/seats/[seatToken]/route';

export const dynamic = 'force-dynamic';
