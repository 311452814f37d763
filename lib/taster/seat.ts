/**
 * The taster's side, reached only through the seat token. Everything returned here is
 * limited to codes, attribute ids and the seat's own answers: no variant, formula or
 * sample id ever leaves this module toward a phone.
 */
import { getEm } from '@/lib/db';
import { sql } from '@/lib/sql';
import { TastingAnswer, TastingSeat, Tasting, SensoryAttributeDef } from '@/entities';
import { AccessDenied, notFound } from '@/lib/permissions';
import { ApiError } from '@/lib/api/errors';
import { ValidationFailed } from '@/lib/errors';
import { hashSecret } from '@/lib/secrets';
import { isValidScaleValue, type SensoryScale } from '@/lib/sensory';
import { SEAT_TOKEN_PREFIX } from '@/lib/tastings/mutations';
import type { AnswerInput, TasterScale, TasterView } from '@/lib/tastings/schema';

type SeatRow = { id: string; workspace: { id: string }; session: { id: string }; servingOrder: Array<{ code: string; sampleId: string }>; displayName: string; consentedAt?: Date | null; submittedAt?: Date | null };
type SessionRow = { id: string; title: string; notice: string; method: TasterView['session']['method']; state: 'draft' | 'open' | 'closed'; place?: string | null; startsAt?: Date | null; attributeIds: string[]; rankingAttributeId?: string | null };

const closed = () => new ApiError(409, 'closed', 'This tasting has closed, so answers are no longer accepted. Thank you for taking part.');

async function seatFor(token: string): Promise<{ seat: SeatRow; session: SessionRow }> {
  if (!token.startsWith(SEAT_TOKEN_PREFIX) || token.length > 100) throw notFound('tasting');
  const em = await getEm();
  const seat = (await em.findOne(TastingSeat, { tokenHash: hashSecret(token) }));
  if (!seat) throw notFound('tasting');
  const session = (await em.findOneOrFail(Tasting, { id: seat.session.id }));
  if (session.state === 'draft') throw notFound('tasting');
  return { seat, session };
}

function tasterScale(scale: SensoryScale): TasterScale {
  return scale.kind === 'category'
    ? { kind: 'category', points: scale.points.map((p) => ({ value: p.value, label: p.label })) }
    : { kind: 'line', min: scale.minValue, max: scale.maxValue, step: scale.resolution, lowAnchor: scale.lowAnchor, highAnchor: scale.highAnchor };
}

async function attributesOf(session: SessionRow) {
  const ids = [...session.attributeIds, ...(session.rankingAttributeId ? [session.rankingAttributeId] : [])];
  if (!ids.length) return new Map<string, { id: string; name: string; instruction: string; scale: SensoryScale }>();
  const em = await getEm();
  const rows = await em.find(SensoryAttributeDef, { id: { $in: ids } });
  return new Map(rows.map((r) => [r.id, { id: r.id, name: r.name, instruction: r.instruction, scale: r.scale }]));
}

export async function tasterView(token: string): Promise<TasterView> {
  const { seat, session } = await seatFor(token);
  const em = await getEm();
  await em.nativeUpdate(TastingSeat, { id: seat.id }, { lastSeenAt: new Date() });
  const attrs = await attributesOf(session);
  const answers = await em.find(TastingAnswer, { seat: seat.id }, { orderBy: { createdAt: 'asc' } });
  return {
    session: {
      title: session.title, notice: session.notice, method: session.method, state: session.state === 'open' ? 'open' : 'closed',
      place: session.place ?? null, startsAt: session.startsAt ? session.startsAt.toISOString() : null,
    },
    seat: { displayName: seat.displayName, consented: !!seat.consentedAt, submitted: !!seat.submittedAt },
    samples: seat.servingOrder.map((c, i) => ({ code: c.code, position: i + 1 })),
    attributes: session.attributeIds.map((id) => attrs.get(id)!).filter(Boolean).map((a) => ({ id: a.id, name: a.name, instruction: a.instruction, scale: tasterScale(a.scale) })),
    ...(session.method === 'ranking'
      ? {
          ranking: {
            attributeId: session.rankingAttributeId ?? null,
            instruction: session.rankingAttributeId
              ? `Put the samples in order of ${attrs.get(session.rankingAttributeId)?.name.toLowerCase() ?? 'the attribute'}, most first.`
              : 'Put the samples in order of preference, the one you like most first.',
          },
        }
      : {}),
    answers: answers.map((a) =>
      a.kind === 'rating'
        ? { code: a.item, attributeId: a.attribute, value: a.value ?? undefined }
        : a.kind === 'ranking'
          ? { ranking: a.ranking ?? [], ...(a.attribute !== '*' ? { attributeId: a.attribute } : {}) }
          : { oddCode: a.oddCode ?? undefined, confidence: a.confidence ?? undefined, comment: a.comment ?? undefined },
    ),
  };
}

/** The seat for the page's first screen; null when the token names no tasting (the API's 404). */
export async function tasterViewOrNull(token: string): Promise<TasterView | null> {
  try {
    return await tasterView(token);
  } catch (err) {
    if (err instanceof AccessDenied && err.status === 404) return null;
    throw err;
  }
}

export async function recordConsent(token: string): Promise<void> {
  const { seat, session } = await seatFor(token);
  if (session.state !== 'open') throw closed();
  const em = await getEm();
  await em.nativeUpdate(TastingSeat, { id: seat.id, consentedAt: null }, { consentedAt: new Date() });
}

/**
 * How many idempotency keys (the first answer and its changes) one answer keeps. Bounds the row a
 * seat token can grow; a taster changes an answer a few times at most (common practice, no
 * published source).
 */
export const MAX_KEYS_PER_ANSWER = 100;

type AnswerContext = { seat: SeatRow; session: SessionRow; scales: Map<string, SensoryScale> };

/**
 * The hot path's read: seat, session and the session's attribute scales in one round trip (an
 * answer is the request a full tasting room sends most). Same checks as seatFor.
 */
async function answerContext(token: string): Promise<AnswerContext> {
  if (!token.startsWith(SEAT_TOKEN_PREFIX) || token.length > 100) throw notFound('tasting');
  const rows = await sql<{
    id: string; workspace_id: string; session_id: string; serving_order: SeatRow['servingOrder']; consented_at: Date | null; method: SessionRow['method'];
    state: SessionRow['state']; attribute_ids: string[]; ranking_attribute_id: string | null; scales: Record<string, SensoryScale>;
  }>(
    `select st.id, st.workspace_id, st.session_id, st.serving_order, st.consented_at, s.method, s.state, s.attribute_ids, s.ranking_attribute_id,
            (select coalesce(jsonb_object_agg(a.id, a.scale), '{}'::jsonb) from sensory_attributes a
              where a.workspace_id = st.workspace_id and a.id::text in (select jsonb_array_elements_text(s.attribute_ids))) as scales
       from panel_seats st join panel_sessions s on s.id = st.session_id
      where st.token_hash = $1`,
    [hashSecret(token)],
    'setwell_answer_context',
  );
  const r = rows[0];
  if (!r || r.state === 'draft') throw notFound('tasting');
  const seat = { id: r.id, workspace: { id: r.workspace_id }, session: { id: r.session_id }, servingOrder: r.serving_order, displayName: '', consentedAt: r.consented_at } as SeatRow;
  const session = { id: r.session_id, method: r.method, state: r.state, attributeIds: r.attribute_ids, rankingAttributeId: r.ranking_attribute_id } as SessionRow;
  return { seat, session, scales: new Map(Object.entries(r.scales)) };
}

/**
 * Stores one answer exactly once, and only forward. A single upsert keyed on (seat, item,
 * attribute) keeps the hot path to one statement. The row keeps every idempotency key it has
 * had: a retry or a late replay of any of them changes nothing (`duplicate`; `stale` when a newer
 * answer has replaced it since), while a change of mind (a new key) replaces the value as long as
 * the session is open. Both replies are 2xx, so the phone stops resending.
 */
export async function recordAnswer(token: string, input: AnswerInput): Promise<{ stored: true; duplicate: boolean; stale: boolean }> {
  const { seat, session, scales } = await answerContext(token);
  if (session.state !== 'open') throw closed();
  if (!seat.consentedAt) throw new ApiError(409, 'no_consent', 'Read and accept the notice before the first sample.');
  const codes = seat.servingOrder.map((c) => c.code);
  let row: { kind: 'rating' | 'ranking' | 'triangle'; item: string; attribute: string; sampleId: string | null; value: number | null; ranking: string[] | null; oddCode: string | null; correct: boolean | null; confidence: number | null; comment: string | null };

  if ('value' in input) {
    if (session.method !== 'rated') throw new ValidationFailed('This tasting does not take ratings.', { value: ['This tasting does not take ratings.'] });
    const cup = seat.servingOrder.find((c) => c.code === input.code);
    if (!cup) throw new ValidationFailed('That is not one of your samples.', { code: ['That is not one of your samples.'] });
    if (!session.attributeIds.includes(input.attributeId)) throw new ValidationFailed('That attribute is not part of this tasting.', { attributeId: ['That attribute is not part of this tasting.'] });
    const scale = scales.get(input.attributeId);
    if (!scale || !isValidScaleValue(scale, input.value)) throw new ValidationFailed('That value is not on the scale.', { value: ['That value is not on the scale.'] });
    row = { kind: 'rating', item: input.code, attribute: input.attributeId, sampleId: cup.sampleId, value: input.value, ranking: null, oddCode: null, correct: null, confidence: null, comment: null };
  } else if ('ranking' in input) {
    if (session.method !== 'ranking') throw new ValidationFailed('This tasting does not take a ranking.', { ranking: ['This tasting does not take a ranking.'] });
    if (input.ranking.length !== codes.length || new Set(input.ranking).size !== codes.length || !input.ranking.every((c) => codes.includes(c))) {
      throw new ValidationFailed('Rank each of your samples exactly once.', { ranking: ['Rank each of your samples exactly once.'] });
    }
    row = { kind: 'ranking', item: '*', attribute: session.rankingAttributeId ?? '*', sampleId: null, value: null, ranking: input.ranking, oddCode: null, correct: null, confidence: null, comment: null };
  } else {
    if (session.method !== 'triangle') throw new ValidationFailed('This tasting is not a triangle test.', { oddCode: ['This tasting is not a triangle test.'] });
    const cup = seat.servingOrder.find((c) => c.code === input.oddCode);
    if (!cup) throw new ValidationFailed('That is not one of your samples.', { oddCode: ['That is not one of your samples.'] });
    const isOdd = seat.servingOrder.filter((c) => c.sampleId === cup.sampleId).length === 1;
    row = { kind: 'triangle', item: '*', attribute: '*', sampleId: null, value: null, ranking: null, oddCode: input.oddCode, correct: isOdd, confidence: input.confidence ?? null, comment: input.comment ?? null };
  }

  const result = await sql(
    `insert into panel_answers (id, workspace_id, session_id, seat_id, kind, item, attribute, sample_id, value, ranking, odd_code, correct, confidence, comment, idempotency_key, idempotency_keys, created_at, updated_at)
     values (gen_random_uuid(), $1, $2, $3, $4, $5, $6, $7, $8, $9::jsonb, $10, $11, $12, $13, $14, array[$14::uuid], now(), now())
     on conflict (seat_id, item, attribute) do update set
       value = excluded.value, ranking = excluded.ranking, odd_code = excluded.odd_code, correct = excluded.correct,
       confidence = excluded.confidence, comment = excluded.comment, idempotency_key = excluded.idempotency_key,
       idempotency_keys = panel_answers.idempotency_keys || excluded.idempotency_key, updated_at = now()
     where excluded.idempotency_key <> all(panel_answers.idempotency_keys)
       and cardinality(panel_answers.idempotency_keys) < $15
       and exists (select 1 from panel_sessions s where s.id = panel_answers.session_id and s.state = 'open')
     returning (xmax = 0) as inserted`,
    [seat.workspace.id, seat.session.id, seat.id, row.kind, row.item, row.attribute, row.sampleId, row.value, row.ranking ? JSON.stringify(row.ranking) : null, row.oddCode, row.correct, row.confidence, row.comment, input.idempotencyKey, MAX_KEYS_PER_ANSWER],
    'setwell_store_answer',
  );
  // No row back: this key was stored before (a retry, or a late replay of an older answer), the
  // session closed meanwhile, or the answer has had as many keys as it may keep.
  if (result.length === 0) {
    const [replay] = await sql<{ state: SessionRow['state']; current_key: string | null; seen: boolean | null }>(
      `select s.state, a.idempotency_key as current_key, $5::uuid = any(a.idempotency_keys) as seen
         from panel_sessions s left join panel_answers a on a.seat_id = $2 and a.item = $3 and a.attribute = $4
        where s.id = $1`,
      [seat.session.id, seat.id, row.item, row.attribute, input.idempotencyKey],
      'setwell_answer_replay',
    );
    if (replay?.state !== 'open') throw closed();
    if (!replay.seen) throw new ApiError(422, 'too_many_changes', 'This answer has been changed too many times to take another change. Your last saved answer stands.');
    return { stored: true, duplicate: true, stale: replay.current_key !== input.idempotencyKey };
  }
  return { stored: true, duplicate: false, stale: false };
}

/**
 * What a seat still lacks before it can be submitted, in the taster's words; empty when complete.
 * PURE. The phone asks for the same before it offers "Submit", but only the stored answers count: an
 * answer the phone holds and the server refused must not end in "Thank you".
 */
export function missingBeforeSubmit(
  method: SessionRow['method'],
  stored: ReadonlyArray<{ kind: string; item: string; attribute: string }>,
  need: { consented: boolean; codes: readonly string[]; attributeIds: readonly string[] },
): string | null {
  if (!need.consented) return 'Agree to take part first.';
  if (method === 'ranking') return stored.some((a) => a.kind === 'ranking') ? null : 'Your order of the samples has not reached the organiser yet: save it again, then submit.';
  if (method === 'triangle') return stored.some((a) => a.kind === 'triangle') ? null : 'Your choice of the odd sample has not reached the organiser yet: choose it again, then submit.';
  const have = new Set(stored.filter((a) => a.kind === 'rating').map((a) => `${a.item}\u0000${a.attribute}`));
  const missing = need.codes.flatMap((code) => need.attributeIds.filter((id) => !have.has(`${code}\u0000${id}`)).map(() => code));
  if (!missing.length) return null;
  const samples = [...new Set(missing)];
  return `Some answers have not reached the organiser yet (sample${samples.length === 1 ? '' : 's'} ${samples.join(', ')}): answer them again, then submit.`;
}

export async function submitSeat(token: string): Promise<void> {
  const { seat, session } = await seatFor(token);
  if (session.state !== 'open') throw closed();
  const stored = await sql<{ kind: string; item: string; attribute: string }>(
    'select kind, item, attribute from panel_answers where seat_id = $1',
    [seat.id],
    'setwell_submit_answers',
  );
  const missing = missingBeforeSubmit(session.method, stored, {
    consented: !!seat.consentedAt, codes: seat.servingOrder.map((c) => c.code), attributeIds: session.attributeIds,
  });
  if (missing) throw new ValidationFailed(missing, { answers: [missing] });
  const em = await getEm();
  await em.nativeUpdate(TastingSeat, { id: seat.id, submittedAt: null }, { submittedAt: new Date() });
}
