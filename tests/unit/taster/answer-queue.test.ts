import { afterEach, describe, expect, it, vi } from 'vitest';
import {
  AnswerQueue,
  answerRequestBody,
  describeQueueStatus,
  queueStorageKey,
  retryDelayMs,
  STUBBORN_ATTEMPTS,
  type AnswerPayload,
  type KeyValueStorage,
} from '@/lib/taster';

const SEAT = 'seat_tok_7Qx2mPz9';

class MemoryStorage implements KeyValueStorage {
  data = new Map<string, string>();
  getItem(key: string) {
    return this.data.get(key) ?? null;
  }
  setItem(key: string, value: string) {
    this.data.set(key, value);
  }
  removeItem(key: string) {
    this.data.delete(key);
  }
}

/** Timers the test fires by hand, so backoff delays can be read instead of waited for. */
function manualTimers() {
  const pending: Array<{ run: () => void; delayMs: number }> = [];
  return {
    pending,
    setTimer: (run: () => void, delayMs: number) => {
      const t = { run, delayMs };
      pending.push(t);
      return t;
    },
    clearTimer: (t: unknown) => {
      const i = pending.indexOf(t as (typeof pending)[number]);
      if (i >= 0) pending.splice(i, 1);
    },
    fireNext() {
      const t = pending.shift();
      if (!t) throw new Error('no timer pending');
      t.run();
      return t.delayMs;
    },
  };
}

function json(status: number, body: unknown) {
  return new Response(JSON.stringify(body), { status, headers: { 'content-type': 'application/json' } });
}

const settle = () => new Promise((r) => setTimeout(r, 0));

function bodies(fetchMock: ReturnType<typeof vi.fn>) {
  return fetchMock.mock.calls.map((c) => JSON.parse(String((c[1] as RequestInit).body)));
}

let keyCounter = 0;
const sequentialKeys = () => `00000000-0000-4000-8000-${String(++keyCounter).padStart(12, '0')}`;

const liking = (code: string, value: number): AnswerPayload => ({ kind: 'rated', code, attributeId: 'attr-liking', value });

afterEach(() => {
  vi.restoreAllMocks();
});

function makeQueue(fetchMock: ReturnType<typeof vi.fn>, storage = new MemoryStorage(), timers = manualTimers()) {
  const queue = new AnswerQueue({
    seatToken: SEAT,
    storage,
    fetchImpl: fetchMock as unknown as typeof fetch,
    setTimer: timers.setTimer,
    clearTimer: timers.clearTimer,
    makeKey: sequentialKeys,
  });
  return { queue, storage, timers };
}

describe('retryDelayMs', () => {
  it('doubles from 1 s and stops at 30 s', () => {
    // Common practice, no published source: doubling backoff capped at 30 s, as the tasting API contract asks.
    expect([1, 2, 3, 4, 5, 6, 7, 20].map(retryDelayMs)).toEqual([1000, 2000, 4000, 8000, 16000, 30000, 30000, 30000]);
  });
});

describe('AnswerQueue', () => {
  it('retries a failed send with the same idempotency key', async () => {
    const fetchMock = vi.fn().mockRejectedValueOnce(new TypeError('Failed to fetch')).mockResolvedValue(json(200, { stored: true, duplicate: false }));
    const { queue, timers } = makeQueue(fetchMock);
    queue.enqueue(liking('482', 7));
    queue.start();
    await settle();
    expect(fetchMock).toHaveBeenCalledTimes(1);
    expect(queue.status().phase).toBe('offline');
    expect(describeQueueStatus(queue.status())).toBe('Saved on this phone — offline, 1 answer to send');
    expect(timers.fireNext()).toBe(1000);
    await settle();
    expect(fetchMock).toHaveBeenCalledTimes(2);
    const [first, second] = bodies(fetchMock);
    expect(second.idempotencyKey).toBe(first.idempotencyKey);
    expect(second).toEqual({ idempotencyKey: first.idempotencyKey, code: '482', attributeId: 'attr-liking', value: 7 });
    expect(fetchMock.mock.calls[0][0]).toBe(`/api/v1/tastings/seats/${SEAT}/answers`);
    expect((fetchMock.mock.calls[0][1] as RequestInit).method).toBe('PUT');
    expect(queue.pending()).toHaveLength(0);
    expect(describeQueueStatus(queue.status())).toBe('Sent');
  });

  it('sends ten retries of one answer under one key, backing off 1, 2, 4 … 30 s', async () => {
    const fetchMock = vi.fn();
    for (let i = 0; i < 10; i++) fetchMock.mockRejectedValueOnce(new TypeError('Failed to fetch'));
    fetchMock.mockResolvedValue(json(200, { stored: true, duplicate: true }));
    const { queue, timers } = makeQueue(fetchMock);
    queue.enqueue(liking('615', 3));
    queue.start();
    await settle();
    const delays: number[] = [];
    for (let i = 0; i < 10; i++) {
      delays.push(timers.fireNext());
      await settle();
    }
    expect(fetchMock).toHaveBeenCalledTimes(11);
    expect(new Set(bodies(fetchMock).map((b) => b.idempotencyKey)).size).toBe(1);
    // Common practice, no published source: doubling backoff capped at 30 s (the API contract's schedule).
    expect(delays).toEqual([1000, 2000, 4000, 8000, 16000, 30000, 30000, 30000, 30000, 30000]);
    expect(queue.pending()).toHaveLength(0);
    expect(timers.pending).toHaveLength(0);
  });

  it('stops on 409 closed, keeps the unsent answers and sends nothing more', async () => {
    const fetchMock = vi.fn().mockResolvedValue(json(409, { error: { code: 'closed', message: 'The organiser has closed this tasting.' } }));
    const { queue, timers } = makeQueue(fetchMock);
    queue.enqueue(liking('482', 7));
    queue.enqueue(liking('615', 4));
    queue.start();
    await settle();
    expect(fetchMock).toHaveBeenCalledTimes(1);
    expect(queue.status().phase).toBe('closed');
    expect(queue.status().stopMessage).toBe('The organiser has closed this tasting.');
    queue.enqueue(liking('903', 6));
    queue.resume();
    await settle();
    expect(fetchMock).toHaveBeenCalledTimes(1);
    expect(timers.pending).toHaveLength(0);
    expect(queue.pending().map((i) => (i.answer as { code: string }).code)).toEqual(['482', '615', '903']);
  });

  it('drops an answer the server refuses with 422 and goes on with the next', async () => {
    const fetchMock = vi
      .fn()
      .mockResolvedValueOnce(json(422, { error: { code: 'invalid', message: 'That value is not on the scale.' } }))
      .mockResolvedValue(json(200, { stored: true, duplicate: false }));
    const { queue, storage } = makeQueue(fetchMock);
    queue.enqueue(liking('482', 12));
    queue.enqueue(liking('615', 4));
    queue.start();
    await settle();
    await settle();
    expect(fetchMock).toHaveBeenCalledTimes(2);
    expect(bodies(fetchMock).map((b) => b.code)).toEqual(['482', '615']);
    expect(queue.pending()).toHaveLength(0);
    expect(queue.status().rejectionMessage).toBe('That value is not on the scale.');
    expect(storage.getItem(queueStorageKey(SEAT))).toBeNull();
  });

  it('sends answers in the order they were given, including ones given mid-send', async () => {
    let release!: () => void;
    const fetchMock = vi.fn().mockImplementationOnce(
      () =>
        new Promise<Response>((resolve) => {
          release = () => resolve(json(200, { stored: true, duplicate: false }));
        }),
    );
    fetchMock.mockResolvedValue(json(200, { stored: true, duplicate: false }));
    const { queue } = makeQueue(fetchMock);
    queue.enqueue(liking('482', 7));
    queue.enqueue(liking('615', 4));
    queue.start();
    await settle();
    expect(queue.status().phase).toBe('saving');
    expect(describeQueueStatus(queue.status())).toBe('Saved on this phone');
    // A change to the answer being sent goes out after it, under its own key.
    queue.enqueue(liking('482', 8));
    queue.enqueue({ kind: 'ranking', attributeId: 'attr-liking', ranking: ['903', '482', '615'] });
    release();
    await settle();
    await settle();
    const sent = bodies(fetchMock);
    expect(sent.map((b) => b.code ?? 'ranking')).toEqual(['482', '615', '482', 'ranking']);
    expect(sent[2].value).toBe(8);
    expect(sent[2].idempotencyKey).not.toBe(sent[0].idempotencyKey);
    expect(sent[3].ranking).toEqual(['903', '482', '615']);
  });

  it('replaces an unsent older answer to the same question', async () => {
    const fetchMock = vi.fn().mockResolvedValue(json(200, { stored: true, duplicate: false }));
    const { queue } = makeQueue(fetchMock);
    queue.enqueue(liking('482', 5));
    queue.enqueue(liking('615', 2));
    queue.enqueue(liking('482', 6));
    expect(describeQueueStatus(queue.status())).toBe('Saved on this phone');
    queue.start();
    await settle();
    expect(bodies(fetchMock).map((b) => [b.code, b.value])).toEqual([
      ['615', 2],
      ['482', 6],
    ]);
  });

  it('survives a reload: a new queue on the same storage resends the same items with the same keys', async () => {
    const offline = vi.fn().mockRejectedValue(new TypeError('Failed to fetch'));
    const first = makeQueue(offline);
    first.queue.enqueue(liking('482', 7));
    first.queue.enqueue({ kind: 'triangle', oddCode: '615', confidence: 2, comment: 'Sharper finish' });
    first.queue.start();
    await settle();
    const before = first.queue.pending().map((i) => i.idempotencyKey);
    expect(before).toHaveLength(2);
    expect(describeQueueStatus(first.queue.status())).toBe('Saved on this phone — offline, 2 answers to send');

    const online = vi.fn().mockResolvedValue(json(200, { stored: true, duplicate: false }));
    const reloaded = makeQueue(online, first.storage);
    expect(reloaded.queue.pending().map((i) => i.idempotencyKey)).toEqual(before);
    reloaded.queue.start();
    await settle();
    await settle();
    const sent = bodies(online);
    expect(sent.map((b) => b.idempotencyKey)).toEqual(before);
    expect(sent[1]).toEqual({ idempotencyKey: before[1], oddCode: '615', confidence: 2, comment: 'Sharper finish' });
    expect(first.storage.getItem(queueStorageKey(SEAT))).toBeNull();
  });

  it('ignores tampered storage fields when it rebuilds the queue', () => {
    const storage = new MemoryStorage();
    storage.setItem(
      queueStorageKey(SEAT),
      JSON.stringify({
        v: 1,
        items: [
          { idempotencyKey: 'k1', attempts: 0, answer: { kind: 'rated', code: '482', attributeId: 'a', value: 6, variantName: 'SECRET' } },
          { idempotencyKey: 'k2', attempts: 0, answer: { kind: 'rated', code: '482' } },
          'junk',
        ],
      }),
    );
    const { queue } = makeQueue(vi.fn(), storage);
    expect(queue.pending()).toEqual([{ idempotencyKey: 'k1', attempts: 0, answer: { kind: 'rated', code: '482', attributeId: 'a', value: 6 } }]);
  });

  it('retries at once when the browser comes back online', async () => {
    const fetchMock = vi.fn().mockRejectedValueOnce(new TypeError('Failed to fetch')).mockResolvedValue(json(200, { stored: true, duplicate: false }));
    const { queue, timers } = makeQueue(fetchMock);
    queue.enqueue(liking('482', 7));
    queue.start();
    await settle();
    expect(timers.pending).toHaveLength(1);
    queue.resume();
    await settle();
    expect(fetchMock).toHaveBeenCalledTimes(2);
    expect(timers.pending).toHaveLength(0);
    expect(queue.status().phase).toBe('idle');
  });

  it('treats a 503 as worth retrying, not as a refusal', async () => {
    const fetchMock = vi.fn().mockResolvedValueOnce(json(503, { error: { code: 'busy', message: 'Busy' } })).mockResolvedValue(json(200, { stored: true, duplicate: false }));
    const { queue, timers } = makeQueue(fetchMock);
    queue.enqueue(liking('482', 7));
    queue.start();
    await settle();
    expect(queue.status().phase).toBe('retrying');
    expect(queue.pending()).toHaveLength(1);
    timers.fireNext();
    await settle();
    expect(bodies(fetchMock)[1].idempotencyKey).toBe(bodies(fetchMock)[0].idempotencyKey);
    expect(queue.pending()).toHaveLength(0);
  });

  it('builds each method’s PUT body with only the contract fields', () => {
    expect(answerRequestBody({ idempotencyKey: 'k', attempts: 0, answer: { kind: 'ranking', attributeId: 'a', ranking: ['1', '2'] } })).toEqual({
      idempotencyKey: 'k',
      attributeId: 'a',
      ranking: ['1', '2'],
    });
    expect(answerRequestBody({ idempotencyKey: 'k', attempts: 0, answer: { kind: 'triangle', oddCode: '615' } })).toEqual({ idempotencyKey: 'k', oddCode: '615' });
    // A preference ranking has no attribute: the field is left out, not sent as "" (which the server refuses).
    expect(answerRequestBody({ idempotencyKey: 'k', attempts: 0, answer: { kind: 'ranking', attributeId: '', ranking: ['1', '2'] } })).toEqual({ idempotencyKey: 'k', ranking: ['1', '2'] });
  });
});

describe('the outbox on the phone', () => {
  it('writes an answer to the phone before it is sent and says so at once, then "Sent" when the server confirms', async () => {
    const storage = new MemoryStorage();
    let release!: () => void;
    let storedWhenSent: string | null = null;
    const fetchMock = vi.fn().mockImplementation(() => {
      storedWhenSent = storage.getItem(queueStorageKey(SEAT));
      return new Promise<Response>((resolve) => {
        release = () => resolve(json(200, { stored: true, duplicate: false }));
      });
    });
    const { queue } = makeQueue(fetchMock, storage);
    queue.start();
    queue.enqueue(liking('482', 7));
    // Before any reply: the answer is on the phone and the taster is told so.
    expect(describeQueueStatus(queue.status())).toBe('Saved on this phone');
    expect(JSON.parse(storage.getItem(queueStorageKey(SEAT))!).items[0].answer).toEqual(liking('482', 7));
    await settle();
    expect(JSON.parse(storedWhenSent!).items).toHaveLength(1);
    release();
    await settle();
    expect(describeQueueStatus(queue.status())).toBe('Sent');
    expect(storage.getItem(queueStorageKey(SEAT))).toBeNull();
  });

  it('does not claim "Saved on this phone" when the phone refuses to store it', async () => {
    const full: KeyValueStorage = {
      getItem: () => null,
      setItem: () => {
        throw new DOMException('Quota exceeded', 'QuotaExceededError');
      },
      removeItem: () => {},
    };
    const fetchMock = vi.fn().mockRejectedValue(new TypeError('Failed to fetch'));
    const { queue } = makeQueue(fetchMock, full as MemoryStorage);
    queue.enqueue(liking('482', 7));
    expect(describeQueueStatus(queue.status())).toBe('1 answer waiting');
    queue.start();
    await settle();
    // Kept in memory and still retried, but the taster is not told it would survive a reload.
    expect(describeQueueStatus(queue.status())).toBe('Offline — 1 answer waiting');
    expect(queue.pending()).toHaveLength(1);
  });

  it('says plainly when an answer has not gone after many tries, and still sends it later under its key', async () => {
    const fetchMock = vi.fn();
    for (let i = 0; i < STUBBORN_ATTEMPTS; i++) fetchMock.mockResolvedValueOnce(json(503, { error: { code: 'busy', message: 'Busy' } }));
    fetchMock.mockResolvedValue(json(200, { stored: true, duplicate: false }));
    const { queue, timers } = makeQueue(fetchMock);
    queue.enqueue(liking('482', 7));
    queue.enqueue(liking('615', 3));
    queue.start();
    await settle();
    expect(describeQueueStatus(queue.status())).toBe('Saved on this phone — not sent yet, trying again (2 answers to send)');
    for (let i = 1; i < STUBBORN_ATTEMPTS; i++) {
      timers.fireNext();
      await settle();
    }
    expect(describeQueueStatus(queue.status())).toBe(
      `Not sent after ${STUBBORN_ATTEMPTS} tries — 2 answers kept on this phone. Keep this page open; they go when the connection allows.`,
    );
    timers.fireNext();
    await settle();
    await settle();
    const sent = bodies(fetchMock);
    expect(new Set(sent.slice(0, STUBBORN_ATTEMPTS + 1).map((b) => b.idempotencyKey)).size).toBe(1);
    expect(sent.map((b) => b.code)).toEqual([...Array(STUBBORN_ATTEMPTS + 1).fill('482'), '615']);
    expect(describeQueueStatus(queue.status())).toBe('Sent');
  });

  it('loses nothing across two reloads mid-send: every answer reaches the server once per key, in order', async () => {
    const storage = new MemoryStorage();
    // First page: two answers, the first request never returns (the phone reloads while it is out).
    const hanging = vi.fn().mockImplementation(() => new Promise<Response>(() => {}));
    const first = makeQueue(hanging, storage);
    first.queue.start();
    first.queue.enqueue(liking('482', 7));
    first.queue.enqueue(liking('615', 4));
    await settle();
    // Second page: offline; one more answer given.
    const offline = vi.fn().mockRejectedValue(new TypeError('Failed to fetch'));
    const second = makeQueue(offline, storage);
    second.queue.enqueue(liking('903', 9));
    second.queue.start();
    await settle();
    // Third page: online; the outbox replays in the order the answers were given.
    const server = new Map<string, number>();
    const online = vi.fn().mockImplementation(async (_url: string, init: RequestInit) => {
      const body = JSON.parse(String(init.body));
      server.set(body.idempotencyKey, (server.get(body.idempotencyKey) ?? 0) + 1);
      return json(200, { stored: true, duplicate: false });
    });
    const third = makeQueue(online, storage);
    third.queue.start();
    for (let i = 0; i < 4; i++) await settle();
    expect(bodies(online).map((b) => [b.code, b.value])).toEqual([
      ['482', 7],
      ['615', 4],
      ['903', 9],
    ]);
    // The replay of the first answer carries the key of the request lost in the first reload.
    expect(bodies(online)[0].idempotencyKey).toBe(bodies(hanging)[0].idempotencyKey);
    expect([...server.values()]).toEqual([1, 1, 1]);
    expect(storage.getItem(queueStorageKey(SEAT))).toBeNull();
  });
});
