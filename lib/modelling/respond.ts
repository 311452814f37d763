/** Shared pieces of the models endpoints: the family in the path (404 when malformed) and the export query (422). */
import { ValidationFailed } from '@/lib/errors';
import { familyFromPath } from './page-query';
import { readExportQuery, type ExportQuery, type FamilyKey } from './schema';

export function familyParam(value: string | undefined): FamilyKey {
  return familyFromPath(value);
}

export function exportQuery(req: Request): ExportQuery {
  const parsed = readExportQuery(new URL(req.url).searchParams);
  if (!parsed.success) {
    const message = parsed.error.issues[0]?.message ?? 'The query is not valid.';
    throw new ValidationFailed(message, { query: [message] });
  }
  return parsed.data;
}
