/**
 * The model page (/models/[family]) and its API siblings take their query through zod schemas.
 * Fed each class of bad input — NUL and control characters, lone surrogates, bidi overrides,
 * numbers past 2^31 and 2^53, prototype-named keys and values, huge lengths — the API answers 4xx
 * (422 for the query, 404 for the family in the path), the page falls back to its defaults (its
 * query never fails it) or answers its own not-found for the path, and nothing changes.
 */
import { describe, it, expect, beforeAll } from 'vitest';
import path from 'node:path';
import { createWorkspace, callRoute, actorOf, asCaller, type WorkspaceFixture } from './harness';
import { modelFamily } from './access-models';
import { getEm } from '@/lib/db';
import { AuditEvent, Cook, Formula, FormulaRevision, Trial, Variant } from '@/entities';
import { modelPage, type ModelPageData, type SearchValue } from '@/lib/modelling/page-query';
import { badInputClasses, searchParamsOf } from './fuzz-inputs';
import * as datasetRoute from '@/app/api/v1/models/[family]/dataset/route';
import * as datasetCsvRoute from '@/app/api/v1/models/[family]/dataset.csv/route';
import * as coefficientsRoute from '@/app/api/v1/models/[family]/coefficients.csv/route';

let a: WorkspaceFixture;
let slug: string;

/** One value per class of bad input (the house rule's list), around a response key the page knows. */
const CLASSES = badInputClasses('lab:setTest');
const PAGE_KEYS = ['response', 'kind', 'x', 'y', 'trials'] as const;
const EXPORT_KEYS = ['response', 'kind', 'trials'] as const;
const EXPORTS = [
  ['dataset', datasetRoute.GET],
  ['dataset.csv', datasetCsvRoute.GET],
  ['coefficients.csv', coefficientsRoute.GET],
] as const;

async function counts() {
  const em = (await getEm()).fork();
  const ws = { workspace: a.workspaceId };
  return Promise.all([em.count(Formula, ws), em.count(FormulaRevision, ws), em.count(Trial, ws), em.count(Variant, ws), em.count(Cook, ws), em.count(AuditEvent, ws)]);
}

/** What the page shows that its query chooses: the response, the kind, the contour's axes, the picked trials. */
function chosen(data: ModelPageData) {
  return { response: data.response?.key ?? null, kind: data.kind, contour: data.contour, trials: data.trials.map((t) => t.selected), rows: data.dataset.rows.length };
}

beforeAll(async () => {
  a = await createWorkspace('Model query classes');
  slug = (await modelFamily(a)).slug;
}, 240_000);

describe('the model page query, class by class', () => {
  it('falls back to its defaults for every bad value of every key, and changes nothing', async () => {
    const actor = actorOf(a, 'developer');
    const before = await counts();
    const defaults = chosen(await modelPage(actor, slug, {}));
    expect(defaults.response).not.toBeNull();
    expect(defaults.trials.every(Boolean)).toBe(true);
    for (const key of PAGE_KEYS) {
      for (const [what, value] of CLASSES) {
        const query: Record<string, SearchValue> = { [key]: key === 'trials' ? [value, value] : value };
        expect(chosen(await modelPage(actor, slug, query)), `${key} = ${what}`).toEqual(defaults);
      }
    }
    // A huge list of trial ids (none of this family's) picks nothing, so every trial stays in.
    const many = Array.from({ length: 50_000 }, (_, i) => `00000000-0000-4000-8000-${String(i).padStart(12, '0')}`);
    expect(chosen(await modelPage(actor, slug, { trials: many }))).toEqual(defaults);
    expect(await counts()).toEqual(before);
  });

  it('treats prototype-named keys as data: no crash, no pollution, the defaults', async () => {
    const actor = actorOf(a, 'developer');
    const defaults = chosen(await modelPage(actor, slug, {}));
    const query = searchParamsOf([['__proto__', 'lab:setTest'], ['constructor', 'full_quadratic'], ['valueOf', '1'], ['hasOwnProperty', 'x'], ['toString', 'y']]);
    expect(chosen(await modelPage(actor, slug, query))).toEqual(defaults);
    expect(({} as Record<string, unknown>).polluted).toBeUndefined();
    expect(Object.prototype.toString.call({})).toBe('[object Object]');
  });

  it('answers its own not-found for every bad family in the path, through the page component too', async () => {
    const actor = actorOf(a, 'developer');
    const page = (await import(path.join(process.cwd(), 'app', '(lab)/models/[family]/page.tsx'))) as {
      default: (props: { params: Promise<unknown>; searchParams: Promise<unknown> }) => Promise<unknown>;
    };
    const before = await counts();
    const families = [...CLASSES.map(([, v]) => v), ...CLASSES.map(([, v]) => `${slug}${v}`), `jam.${'f'.repeat(36)}`, `${slug.split('.')[0]}.__proto__`];
    for (const family of families) {
      await expect(modelPage(actor, family, {}), JSON.stringify(family.slice(0, 60))).rejects.toMatchObject({ status: 404 });
      let digest: unknown;
      try {
        await asCaller({ kind: 'session', person: a.people.developer }, () => page.default({ params: Promise.resolve({ family }), searchParams: Promise.resolve({}) }));
      } catch (err) {
        digest = (err as { digest?: unknown }).digest;
      }
      expect(digest, JSON.stringify(family.slice(0, 60))).toBe('NEXT_HTTP_ERROR_FALLBACK;404');
    }
    expect(await counts()).toEqual(before);
  });
});

/**
 * Percent-encoding as a client would send it. A lone surrogate has no UTF-8 form (encodeURIComponent
 * throws): a client that sends one anyway sends its WTF-8 bytes, which the server decodes to U+FFFD.
 */
function encode(value: string): string {
  return [...value].map((c) => {
    const code = c.charCodeAt(0);
    if (c.length === 1 && code >= 0xd800 && code <= 0xdfff) {
      return [0xe0 | (code >> 12), 0x80 | ((code >> 6) & 0x3f), 0x80 | (code & 0x3f)].map((b) => `%${b.toString(16).toUpperCase()}`).join('');
    }
    return encodeURIComponent(c);
  }).join('');
}

describe('the models API query, class by class', () => {
  const get = (handler: (typeof EXPORTS)[number][1], name: string, family: string, query: string) =>
    callRoute(handler, { method: 'GET', path: `/api/v1/models/${encode(family)}/${name}?${query}`, caller: { kind: 'session', person: a.people.developer }, params: { family } });

  it('answers 422 for every bad value of every key, in the error shape, and changes nothing', async () => {
    const before = await counts();
    for (const [name, handler] of EXPORTS) {
      expect((await get(handler, name, slug, '')).status, name).toBe(200);
      for (const key of EXPORT_KEYS) {
        for (const [what, value] of CLASSES) {
          const res = await get(handler, name, slug, `${key}=${encode(value)}`);
          expect(res.status, `${name} ${key} = ${what}`).toBe(422);
          expect(res.body.error.fields.query, `${name} ${key} = ${what}`).toBeDefined();
        }
      }
      // Prototype-named keys are unknown keys: refused, never read.
      for (const key of ['__proto__', 'constructor', 'valueOf', 'toString']) {
        const res = await get(handler, name, slug, `${key}=1`);
        expect(res.status, `${name} ${key}`).toBe(422);
      }
      expect(({} as Record<string, unknown>)['1']).toBeUndefined();
      // More trials than a pick may hold.
      const many = Array.from({ length: 5_000 }, (_, i) => `trials=00000000-0000-4000-8000-${String(i).padStart(12, '0')}`).join('&');
      expect((await get(handler, name, slug, many)).status, `${name} many trials`).toBe(422);
    }
    expect(await counts()).toEqual(before);
  });

  it('answers 404 for every bad family in the path', async () => {
    const before = await counts();
    for (const [name, handler] of EXPORTS) {
      for (const [what, value] of CLASSES) {
        expect((await get(handler, name, value, '')).status, `${name} family = ${what}`).toBe(404);
        expect((await get(handler, name, `${slug}${value}`, '')).status, `${name} family = slug + ${what}`).toBe(404);
      }
    }
    expect(await counts()).toEqual(before);
  });
});
