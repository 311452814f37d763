/**
 * The phone's outbox: a persistent, in-order queue of answer PUTs for one seat. Every answer is
 * written to localStorage before it is sent, so the taster sees "Saved on this phone" at once (no
 * network wait) and a dropped connection or a reload loses nothing; "Sent" follows when the server
 * confirms. Each item keeps the idempotency key it was born with for all of its retries, so a
 * replay after a reload is a duplicate the server recognises, never a second answer.
 */
import { backoffDelayMs } from '@/lib/backoff';
import type { AnswerPayload, TriangleConfidence } from './types';
import { makeIdempotencyKey } from './idempotency';
import { responseErrorMessage } from '@/lib/api/error-body';

export interface KeyValueStorage {
  getItem(key: string): string | null;
  setItem(key: string, value: string): void;
  removeItem(key: string): void;
}

export interface QueuedAnswer {
  idempotencyKey: string;
  answer: AnswerPayload;
  /** Failed send attempts so far; drives the backoff delay. */
  attempts: number;
}

/**
 * idle: nothing waiting; saving: a request is out; offline: the network failed and a retry
 * is scheduled; retrying: the server was busy or failed, retry scheduled; closed: the
 * session closed (409) and the queue stopped; stopped: the seat is unknown (404).
 */
export type QueuePhase = 'idle' | 'saving' | 'offline' | 'retrying' | 'closed' | 'stopped';

export interface QueueStatus {
  phase: QueuePhase;
  waitingCount: number;
  /** Answer slots (see `answerSlot`) still waiting to be stored, oldest first. */
  waitingSlots: string[];
  /** True once any answer has been stored during this page's life. */
  hasStored: boolean;
  /** True when every waiting answer is written to this phone's storage (survives a reload). */
  keptOnPhone: boolean;
  /** Failed sends of the oldest waiting answer; past STUBBORN_ATTEMPTS the status says so plainly. */
  oldestAttempts: number;
  /** The server's message for a 409/404 stop. */
  stopMessage?: string;
  /** The server's message for the last answer it refused (422); that answer was dropped. */
  rejectionMessage?: string;
}

type Timer = unknown;

export interface AnswerQueueOptions {
  seatToken: string;
  /** null when there is no localStorage (server render, private mode). */
  storage: KeyValueStorage | null;
  fetchImpl?: typeof fetch;
  setTimer?: (run: () => void, delayMs: number) => Timer;
  clearTimer?: (timer: Timer) => void;
  makeKey?: () => string;
}

const MAX_RETRY_DELAY_MS = 30_000;
/**
 * After this many failed sends of one answer (about a minute of backoff) the status stops saying
 * "trying again" and says the answer has not gone, while the queue keeps retrying.
 */
export const STUBBORN_ATTEMPTS = 6;
const FIRST_RETRY_DELAY_MS = 1_000;

/** Delay before retry number `attempt` (1-based): 1 s, 2 s, 4 s … capped at 30 s. */
export function retryDelayMs(attempt: number): number {
  return backoffDelayMs(attempt, { firstMs: FIRST_RETRY_DELAY_MS, maxMs: MAX_RETRY_DELAY_MS });
}

/** Which question an answer fills; a newer answer to the same slot replaces an unsent older one. */
export function answerSlot(answer: AnswerPayload): string {
  switch (answer.kind) {
    case 'rated':
      return `rated:${answer.code}:${answer.attributeId}`;
    case 'ranking':
      return `ranking:${answer.attributeId}`;
    case 'triangle':
      return 'triangle';
  }
}

export function queueStorageKey(seatToken: string): string {
  return `setwell.tasting.queue.${seatToken}`;
}

/** The PUT body the contract expects for one answer. */
export function answerRequestBody(item: QueuedAnswer): Record<string, unknown> {
  const a = item.answer;
  switch (a.kind) {
    case 'rated':
      return { idempotencyKey: item.idempotencyKey, code: a.code, attributeId: a.attributeId, value: a.value };
    case 'ranking':
      // A preference ranking has no attribute: the field is left out, never sent empty (the contract wants a UUID or nothing).
      return { idempotencyKey: item.idempotencyKey, ...(a.attributeId ? { attributeId: a.attributeId } : {}), ranking: [...a.ranking] };
    case 'triangle': {
      const body: Record<string, unknown> = { idempotencyKey: item.idempotencyKey, oddCode: a.oddCode };
      if (a.confidence !== undefined) body.confidence = a.confidence;
      if (a.comment !== undefined && a.comment !== '') body.comment = a.comment;
      return body;
    }
  }
}

function isString(v: unknown): v is string {
  return typeof v === 'string';
}

/** Rebuilds one answer from storage, keeping only the contract's fields. */
export function reviveAnswer(raw: unknown): AnswerPayload | null {
  if (!raw || typeof raw !== 'object') return null;
  const r = raw as Record<string, unknown>;
  if (r.kind === 'rated' && isString(r.code) && isString(r.attributeId) && typeof r.value === 'number' && Number.isFinite(r.value)) {
    return { kind: 'rated', code: r.code, attributeId: r.attributeId, value: r.value };
  }
  if (r.kind === 'ranking' && isString(r.attributeId) && Array.isArray(r.ranking) && r.ranking.every(isString)) {
    return { kind: 'ranking', attributeId: r.attributeId, ranking: [...r.ranking] };
  }
  if (r.kind === 'triangle' && isString(r.oddCode)) {
    const out: AnswerPayload = { kind: 'triangle', oddCode: r.oddCode };
    if (r.confidence === 1 || r.confidence === 2 || r.confidence === 3) out.confidence = r.confidence as TriangleConfidence;
    if (isString(r.comment)) out.comment = r.comment;
    return out;
  }
  return null;
}

function readStoredItems(storage: KeyValueStorage | null, key: string): QueuedAnswer[] {
  if (!storage) return [];
  let parsed: unknown;
  try {
    const text = storage.getItem(key);
    if (!text) return [];
    parsed = JSON.parse(text);
  } catch {
    return [];
  }
  const list = (parsed as { items?: unknown })?.items;
  if (!Array.isArray(list)) return [];
  const items: QueuedAnswer[] = [];
  for (const raw of list) {
    const r = raw as Record<string, unknown>;
    const answer = reviveAnswer(r?.answer);
    if (!answer || !isString(r.idempotencyKey)) continue;
    const attempts = typeof r.attempts === 'number' && r.attempts >= 0 ? Math.floor(r.attempts) : 0;
    items.push({ idempotencyKey: r.idempotencyKey, answer, attempts });
  }
  return items;
}

type SendOutcome =
  | { kind: 'stored' }
  | { kind: 'rejected'; message: string }
  | { kind: 'closed'; message: string }
  | { kind: 'unknown-seat'; message: string }
  | { kind: 'retry'; offline: boolean };

const errorMessage = responseErrorMessage;

export class AnswerQueue {
  private readonly seatToken: string;
  private readonly storage: KeyValueStorage | null;
  private readonly fetchImpl: typeof fetch;
  private readonly setTimer: (run: () => void, delayMs: number) => Timer;
  private readonly clearTimer: (timer: Timer) => void;
  private readonly makeKey: () => string;
  private items: QueuedAnswer[];
  private inFlightKey: string | null = null;
  private pumping = false;
  private started = false;
  private halted = false;
  private paused = false;
  private retryTimer: Timer | null = null;
  private listeners = new Set<() => void>();
  private snapshot: QueueStatus;
  private phase: QueuePhase = 'idle';
  private hasStored = false;
  private keptOnPhone: boolean;
  private stopMessage?: string;
  private rejectionMessage?: string;

  constructor(options: AnswerQueueOptions) {
    this.seatToken = options.seatToken;
    this.storage = options.storage;
    this.fetchImpl = options.fetchImpl ?? ((input, init) => globalThis.fetch(input, init));
    this.setTimer = options.setTimer ?? ((run, ms) => globalThis.setTimeout(run, ms));
    this.clearTimer = options.clearTimer ?? ((t) => globalThis.clearTimeout(t as ReturnType<typeof setTimeout>));
    this.makeKey = options.makeKey ?? (() => makeIdempotencyKey());
    this.items = readStoredItems(this.storage, queueStorageKey(this.seatToken));
    this.keptOnPhone = this.storage !== null;
    this.snapshot = this.buildSnapshot();
  }

  /** Answers not yet stored by the server, oldest first. */
  pending(): readonly QueuedAnswer[] {
    return this.items.map((i) => ({ ...i, answer: { ...i.answer } as AnswerPayload }));
  }

  status(): QueueStatus {
    return this.snapshot;
  }

  subscribe(listener: () => void): () => void {
    this.listeners.add(listener);
    return () => this.listeners.delete(listener);
  }

  /** Adds an answer with a fresh idempotency key; an unsent older answer to the same question is replaced. */
  enqueue(answer: AnswerPayload): QueuedAnswer {
    const slot = answerSlot(answer);
    this.items = this.items.filter((i) => i.idempotencyKey === this.inFlightKey || answerSlot(i.answer) !== slot);
    const item: QueuedAnswer = { idempotencyKey: this.makeKey(), answer, attempts: 0 };
    this.items.push(item);
    this.persist();
    this.emit();
    if (this.started && !this.paused && this.retryTimer === null) void this.pump();
    return { ...item };
  }

  /** Begins sending (call once the seat is known to be open). */
  start(): void {
    this.started = true;
    this.paused = false;
    void this.pump();
  }

  isStarted(): boolean {
    return this.started;
  }

  /** Skips the backoff wait, e.g. when the browser reports it is online again. */
  resume(): void {
    if (!this.started || this.halted) return;
    this.paused = false;
    if (this.retryTimer !== null) {
      this.clearTimer(this.retryTimer);
      this.retryTimer = null;
    }
    void this.pump();
  }

  /** Stops sending and cancels a scheduled retry; the stored items stay for `resume`. */
  pause(): void {
    this.paused = true;
    if (this.retryTimer !== null) this.clearTimer(this.retryTimer);
    this.retryTimer = null;
  }

  /** Forgets the stored queue (after the taster submits). */
  clear(): void {
    this.items = [];
    this.storage?.removeItem(queueStorageKey(this.seatToken));
    this.emit();
  }

  private persist(): void {
    if (!this.storage) return;
    const key = queueStorageKey(this.seatToken);
    try {
      if (this.items.length === 0) this.storage.removeItem(key);
      else this.storage.setItem(key, JSON.stringify({ v: 1, items: this.items }));
      this.keptOnPhone = true;
    } catch {
      // Storage full or blocked: keep going in memory rather than lose the answer now, and stop
      // claiming it is kept on the phone.
      this.keptOnPhone = false;
    }
  }

  private buildSnapshot(): QueueStatus {
    return {
      phase: this.phase,
      waitingCount: this.items.length,
      waitingSlots: this.items.map((i) => answerSlot(i.answer)),
      hasStored: this.hasStored,
      keptOnPhone: this.keptOnPhone && this.storage !== null,
      oldestAttempts: this.items[0]?.attempts ?? 0,
      stopMessage: this.stopMessage,
      rejectionMessage: this.rejectionMessage,
    };
  }

  private emit(): void {
    this.snapshot = this.buildSnapshot();
    for (const l of [...this.listeners]) l();
  }

  private setPhase(phase: QueuePhase): void {
    this.phase = phase;
    this.emit();
  }

  private async send(item: QueuedAnswer): Promise<SendOutcome> {
    let res: Response;
    try {
      res = await this.fetchImpl(`/api/v1/tastings/seats/${encodeURIComponent(this.seatToken)}/answers`, {
        method: 'PUT',
        headers: { 'content-type': 'application/json' },
        credentials: 'same-origin',
        body: JSON.stringify(answerRequestBody(item)),
      });
    } catch {
      return { kind: 'retry', offline: true };
    }
    if (res.ok) return { kind: 'stored' };
    if (res.status === 409) return { kind: 'closed', message: await errorMessage(res, 'This tasting has closed.') };
    if (res.status === 404) return { kind: 'unknown-seat', message: await errorMessage(res, 'This tasting link is no longer valid.') };
    // A busy or failing server is worth another try; a refused answer is not.
    if (res.status === 408 || res.status === 429 || res.status >= 500) return { kind: 'retry', offline: false };
    return { kind: 'rejected', message: await errorMessage(res, 'That answer was not accepted.') };
  }

  private async pump(): Promise<void> {
    if (this.pumping || this.halted || this.paused || !this.started) return;
    this.pumping = true;
    try {
      while (this.items.length > 0 && !this.halted && !this.paused) {
        const item = this.items[0];
        this.inFlightKey = item.idempotencyKey;
        this.setPhase('saving');
        const outcome = await this.send(item);
        this.inFlightKey = null;
        if (outcome.kind === 'stored' || outcome.kind === 'rejected') {
          this.items = this.items.filter((i) => i !== item);
          if (outcome.kind === 'stored') this.hasStored = true;
          else this.rejectionMessage = outcome.message;
          this.persist();
          continue;
        }
        if (outcome.kind === 'closed' || outcome.kind === 'unknown-seat') {
          this.halted = true;
          this.stopMessage = outcome.message;
          this.setPhase(outcome.kind === 'closed' ? 'closed' : 'stopped');
          return;
        }
        item.attempts += 1;
        this.persist();
        if (this.paused) return;
        this.retryTimer = this.setTimer(() => {
          this.retryTimer = null;
          void this.pump();
        }, retryDelayMs(item.attempts));
        this.setPhase(outcome.offline ? 'offline' : 'retrying');
        return;
      }
      if (!this.halted && !this.paused) this.setPhase('idle');
    } finally {
      this.pumping = false;
    }
  }
}

/**
 * The one-line status under the questions. "Saved on this phone" as soon as an answer is in the
 * phone's storage, "Sent" once the server has every answer. Empty when there is nothing to say yet.
 */
export function describeQueueStatus(status: QueueStatus): string {
  const n = status.waitingCount;
  const answers = `${n} ${n === 1 ? 'answer' : 'answers'}`;
  const kept = status.keptOnPhone;
  if (n > 0 && status.oldestAttempts >= STUBBORN_ATTEMPTS && (status.phase === 'offline' || status.phase === 'retrying')) {
    return kept
      ? `Not sent after ${status.oldestAttempts} tries — ${answers} kept on this phone. Keep this page open; they go when the connection allows.`
      : `Not sent after ${status.oldestAttempts} tries — ${answers} waiting. Keep this page open; they go when the connection allows.`;
  }
  switch (status.phase) {
    case 'saving':
      return kept ? 'Saved on this phone' : 'Sending…';
    case 'offline':
      return kept ? `Saved on this phone — offline, ${answers} to send` : `Offline — ${answers} waiting`;
    case 'retrying':
      return kept ? `Saved on this phone — not sent yet, trying again (${answers} to send)` : `Not sent yet — ${answers} waiting, trying again`;
    case 'closed':
      return n > 0 ? `This tasting has closed — ${answers} could not be sent` : 'This tasting has closed';
    case 'stopped':
      return status.stopMessage ?? 'This tasting link is no longer valid.';
    case 'idle':
      if (n > 0) return kept ? 'Saved on this phone' : `${answers} waiting`;
      return status.hasStored ? 'Sent' : '';
  }
}
