import { buildOpenApiDocument } from '@/lib/api/openapi';
import { env } from '@/lib/env';

export const dynamic = 'force-dynamic';

export function GET() {
  return Response.json(buildOpenApiDocument(env().APP_URL));
}
