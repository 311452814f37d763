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

export type ServerAction = (...args: unknown[]) => Promise<{ ok: boolean; status?: number }>;

/** Every exported function of a 'use server' actions.ts under lib/, named "lib/<feature>/actions.ts#name". */
export async function discoverActions(): Promise<Map<string, ServerAction>> {
  const files = walk(path.join(ROOT, 'lib'), (f) => f.endsWith(`${path.sep}actions.ts`) && fs.readFileSync(f, 'utf8').startsWith("'use server'"));
  const found = new Map<string, ServerAction>();
  for (const file of files) {
    const mod = await import(file);
    for (const [name, fn] of Object.entries(mod)) {
      if (typeof fn === 'function') found.set(`${path.relative(ROOT, file).split(path.sep).join('/')}#${name}`, fn as ServerAction);
    }
  }
  return found;
}

/** Page files (page.tsx anywhere under app/) whose component reads searchParams, named by their path under app/. */
export function pagesReadingSearchParams(): string[] {
  return walk(path.join(ROOT, 'app'), (f) => f.endsWith(`${path.sep}page.tsx`) && /\bsearchParams\b/.test(fs.readFileSync(f, 'utf8'))).map((f) =>
    path.relative(path.join(ROOT, 'app'), f).split(path.sep).join('/'),
  );
}
