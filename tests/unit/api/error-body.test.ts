/** One reader of the API's error shape in the browser (issue 18, part 5: it replaces six hand-written ones). */
import { describe, expect, it } from 'vitest';
import { readErrorBody, responseErrorMessage } from '@/lib/api/error-body';
import { backoffDelayMs } from '@/lib/backoff';

describe('readErrorBody', () => {
  it('reads the message and the field errors of the API’s error shape', () => {
    expect(readErrorBody({ error: { code: 'invalid', message: 'Some fields are not valid.', fields: { title: ['Give a title.'] } } }))
      .toEqual({ message: 'Some fields are not valid.', fields: Object.assign(Object.create(null), { title: ['Give a title.'] }) });
  });

  it.each([null, undefined, 'text', 42, [], { error: 'flat' }, { error: { message: 7 } }, { error: { message: '' } }])('gives nothing for %j', (body) => {
    expect(readErrorBody(body)).toEqual({ message: null, fields: null });
  });

  it('keeps only strings, and a prototype-named field stays data', () => {
    const body = JSON.parse('{"error":{"message":"m","fields":{"__proto__":["x"],"a":[1,"ok"],"b":"no"}}}');
    const { fields } = readErrorBody(body);
    expect(Object.getPrototypeOf(fields)).toBeNull();
    expect(fields!.__proto__).toEqual(['x']);
    expect(fields!.a).toEqual(['ok']);
    expect('b' in fields!).toBe(false);
  });

  it('a response that is not JSON gives the fallback', async () => {
    expect(await responseErrorMessage(new Response('<html>', { status: 502 }), 'Try again.')).toBe('Try again.');
    expect(await responseErrorMessage(new Response(JSON.stringify({ error: { message: 'Closed.' } }), { status: 409 }), 'x')).toBe('Closed.');
  });
});

describe('backoffDelayMs', () => {
  it('counts retries from 1, doubles, and stops at the cap', () => {
    expect([1, 2, 3, 4, 5, 6].map((n) => backoffDelayMs(n, { firstMs: 1000, maxMs: 30_000 }))).toEqual([1000, 2000, 4000, 8000, 16000, 30000]);
    expect(backoffDelayMs(0, { firstMs: 2000, maxMs: 30_000 })).toBe(2000);
    expect(backoffDelayMs(Number.NaN, { firstMs: 2000, maxMs: 30_000 })).toBe(2000);
    expect(backoffDelayMs(2 ** 53, { firstMs: 2000, maxMs: 30_000 })).toBe(30_000);
  });
});
