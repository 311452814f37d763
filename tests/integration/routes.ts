/** Finds every route handler under app/ and names it "METHOD /path/[param]" as the file system does. */
import fs from 'node:fs';
import path from 'node:path';

export const ROOT = path.resolve(__dirname, '../..');
export type RouteHandler = (req: Request, ctx: { params: Promise<Record<string, string>> }) => Promise<Response>;
const METHODS = ['GET', 'POST', 'PUT', 'PATCH', 'DELETE'] as const;

export function walk(dir: string, match: (f: string) => boolean, out: string[] = []): string[] {
  for (const entry of fs.readdirSync(dir, { withFileTypes: true })) {
    const full = path.join(dir, entry.name);
    if (entry.isDirectory()) walk(full, match, out);
    else if (match(full)) out.push(full);
  }
  return out;
}

export const routeFiles = walk(path.join(ROOT, 'app'), (f) => f.endsWith(`${path.sep}route.ts`));

export const routeKey = (file: string, method: string) =>
  `${method} /${path.relative(path.join(ROOT, 'app'), path.dirname(file)).split(path.sep).filter((s) => !s.startsWith('(')).join('/')}`;

/** "post" + "/api/v1/trials/{trialId}" (an API_OPERATIONS entry) → "POST /api/v1/trials/[trialId]". */
export const operationKey = (op: { method: string; path: string }) => `${op.method.toUpperCase()} ${op.path.replace(/\{(\w+)\}/g, '[$1]')}`;

export async function discoverRoutes(): Promise<Map<string, RouteHandler>> {
  const found = new Map<string, RouteHandler>();
  for (const file of routeFiles) {
    const mod = await import(file);
    for (const m of METHODS) if (typeof mod[m] === 'function') found.set(routeKey(file, m), mod[m]);
  }
  return found;
}

/** Route keys whose handler source reads a JSON body through the adapter's body(schema). */
export function routesReadingJsonBody(): string[] {
  const keys: string[] = [];
  for (const file of routeFiles) {
    const src = fs.readFileSync(file, 'utf8');
    // Each exported handler up to the next export; a handler that destructures `body` and calls it reads JSON.
    const parts = src.split(/(?=export const (?:GET|POST|PUT|PATCH|DELETE)\b)/);
    for (const part of parts) {
      const m = /^export const (GET|POST|PUT|PATCH|DELETE)\b/.exec(part);
      if (m && /\bbody\(/.test(part)) keys.push(routeKey(file, m[1]));
    }
  }
  return keys;
}
