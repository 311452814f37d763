import 'server-only';
/** The organiser's reads: sessions, live progress and the kitchen serving sheet (staff only). */
import { getEm } from '@/lib/db';
import { sql } from '@/lib/sql';
import { TastingAnswer, TastingSeat, SensoryAttributeDef } from '@/entities';
import { inWorkspace, notFound, type Actor } from '@/lib/permissions';
import { trialCode } from '@/lib/trials/access';
import { isUuid } from '@/lib/ids';
import type { TastingMethod, TastingState } from './vocabulary';
import type { MySeat, SeatProgress, TastingRows, TastingSummary, TastingView, TrialTastingRow } from './schema';

export async function listAttributes(actor: Actor) {
  const em = await getEm();
  const rows = await em.find(SensoryAttributeDef, inWorkspace(actor), { orderBy: { createdAt: 'asc' } });
  return rows.map((r) => ({ id: r.id, name: r.name, instruction: r.instruction, modality: r.modality, scaleName: r.scale.name, libraryKey: r.libraryKey ?? null }));
}

export async function listTrialTastings(actor: Actor, trialId?: string): Promise<TrialTastingRow[]> {
  if (trialId !== undefined && !isUuid(trialId)) return [];
  // One statement (the trial page's): each tasting with its seats counted by PostgreSQL.
  const rows = await sql<{ id: string; trial_id: string; title: string; method: TastingMethod; state: TastingState; seats: number; submitted: number; created_at: Date }>(
    `select t.id, t.trial_id, t.title, t.method, t.state, c.seats, c.submitted, t.created_at
       from panel_sessions t
       cross join lateral (select count(*)::int as seats, count(s.submitted_at)::int as submitted
                             from panel_seats s where s.workspace_id = t.workspace_id and s.session_id = t.id) c
      where t.workspace_id = $1 and ($2::uuid is null or t.trial_id = $2::uuid)
      order by t.created_at desc, t.id`,
    [actor.workspaceId, trialId ?? null],
    'trial-tastings',
  );
  return rows.map((r) => ({ id: r.id, trialId: r.trial_id, title: r.title, method: r.method, state: r.state, seats: r.seats, submitted: r.submitted, createdAt: r.created_at.toISOString() }));
}

type JsonTimes<T, K extends keyof T> = Omit<T, K> & { [P in K]: string | null };
type RowsRecord = {
  id: string; trial_id: string; title: string; place: string | null; starts_at: Date | null; method: TastingMethod; state: TastingState;
  notice: string; join_code: string | null; attribute_ids: string[]; ranking_attribute_id: string | null;
  created_at: Date; opened_at: Date | null; closed_at: Date | null;
  samples: TastingRows['samples']; attrs: TastingRows['attrs'];
  seats: Array<JsonTimes<TastingRows['seats'][number], 'consentedAt' | 'submittedAt' | 'lastSeenAt'>>;
};
const iso = (d: Date | null) => (d ? d.toISOString() : null);
/** A time PostgreSQL wrote into JSON ("…+00:00") in the form every other time is sent in. */
const isoOfJson = (t: string | null) => (t ? new Date(t).toISOString() : null);

/**
 * The rows a session's views are built from, in one statement scoped to the workspace (its
 * answers are loaded by the caller: all of them for results, only their seats for progress). The
 * results page reads this on every load; as five ORM reads it was a fifth of that page's time.
 */
export async function loadTastingRows(actor: Actor, tastingId: string): Promise<TastingRows> {
  if (!isUuid(tastingId)) throw notFound('tasting');
  const [r] = await sql<RowsRecord>(
    `select t.id, t.trial_id, t.title, t.place, t.starts_at, t.method, t.state, t.notice, t.join_code, t.attribute_ids, t.ranking_attribute_id,
            t.created_at, t.opened_at, t.closed_at,
            coalesce((select json_agg(json_build_object('id', x.id, 'variantId', x.variant_id, 'code', x.code, 'variantLabel', v.label, 'variantDescription', v.description) order by x.position)
                        from panel_samples x join variants v on v.id = x.variant_id and v.workspace_id = x.workspace_id
                       where x.workspace_id = t.workspace_id and x.session_id = t.id), '[]') as samples,
            coalesce((select json_agg(json_build_object('id', a.id, 'name', a.name, 'scale', a.scale))
                        from sensory_attributes a
                       where a.workspace_id = t.workspace_id
                         and (t.attribute_ids ? a.id::text or a.id = t.ranking_attribute_id)), '[]') as attrs,
            coalesce((select json_agg(json_build_object('id', x.id, 'seatIndex', x.seat_index, 'kind', x.kind, 'displayName', x.display_name, 'servingOrder', x.serving_order,
                                                        'consentedAt', x.consented_at, 'submittedAt', x.submitted_at, 'lastSeenAt', x.last_seen_at) order by x.seat_index)
                        from panel_seats x where x.workspace_id = t.workspace_id and x.session_id = t.id), '[]') as seats
       from panel_sessions t
      where t.workspace_id = $1 and t.id = $2`,
    [actor.workspaceId, tastingId],
    'tasting-rows',
  );
  if (!r) throw notFound('tasting');
  return {
    s: {
      id: r.id, trialId: r.trial_id, title: r.title, place: r.place, startsAt: iso(r.starts_at), method: r.method, state: r.state, notice: r.notice,
      joinCode: r.join_code, attributeIds: r.attribute_ids, rankingAttributeId: r.ranking_attribute_id,
      createdAt: r.created_at.toISOString(), openedAt: iso(r.opened_at), closedAt: iso(r.closed_at),
    },
    samples: r.samples,
    attrs: r.attrs,
    seats: r.seats.map((x) => ({ ...x, consentedAt: isoOfJson(x.consentedAt), submittedAt: isoOfJson(x.submittedAt), lastSeenAt: isoOfJson(x.lastSeenAt) })),
  };
}

export async function getTasting(actor: Actor, tastingId: string): Promise<TastingView> {
  const rows = await loadTastingRows(actor, tastingId);
  const answers = await (await getEm()).find(TastingAnswer, { session: rows.s.id }, { fields: ['seat'] });
  return tastingView(rows, answers);
}

/** The organiser's view of a session from its rows; `answers` need only their seat. */
export function tastingView({ s, samples, attrs, seats }: TastingRows, answers: ReadonlyArray<{ seat: { id: string } }>): TastingView {
  const attrIds = [...s.attributeIds, ...(s.rankingAttributeId ? [s.rankingAttributeId] : [])];
  const countBySeat = new Map<string, number>();
  for (const a of answers) {
    const id = a.seat.id;
    countBySeat.set(id, (countBySeat.get(id) ?? 0) + 1);
  }
  const expectedFor = (cups: number) => (s.method === 'rated' ? cups * s.attributeIds.length : 1);
  return {
    id: s.id,
    trialId: s.trialId,
    title: s.title,
    place: s.place,
    startsAt: s.startsAt,
    method: s.method,
    state: s.state,
    notice: s.notice,
    joinCode: s.joinCode,
    samples: samples.map((x) => ({ sampleId: x.id, variantId: x.variantId, variantLabel: x.variantLabel, variantDescription: x.variantDescription, code: x.code })),
    attributes: attrIds.map((id) => attrs.find((a) => a.id === id)).filter((a): a is NonNullable<typeof a> => !!a).map((a) => ({ id: a.id, name: a.name })),
    ratedAttributeIds: s.attributeIds,
    rankingAttributeId: s.rankingAttributeId,
    seats: seats.map((seat) => {
      const answered = countBySeat.get(seat.id) ?? 0;
      const expected = expectedFor(seat.servingOrder.length);
      const status: SeatProgress['status'] = seat.submittedAt ? 'submitted' : s.state === 'closed' ? 'partial' : answered > 0 ? 'answering' : 'joined';
      return { seatIndex: seat.seatIndex, displayName: seat.displayName, kind: seat.kind, answered, expected, consented: !!seat.consentedAt, status, lastSeenAt: seat.lastSeenAt };
    }),
    createdAt: s.createdAt,
    openedAt: s.openedAt,
    closedAt: s.closedAt,
  };
}

/** Seat by seat: the codes in serving order and which variant each is. For the kitchen only. */
export async function getServingSheet(actor: Actor, tastingId: string) {
  const view = await getTasting(actor, tastingId);
  const em = await getEm();
  const seats = await em.find(TastingSeat, { session: tastingId }, { orderBy: { seatIndex: 'asc' } });
  const bySample = new Map(view.samples.map((x) => [x.sampleId, x]));
  return {
    session: { id: view.id, title: view.title, method: view.method, place: view.place, startsAt: view.startsAt },
    samples: view.samples,
    seats: seats.map((seat) => ({
      seatNumber: seat.seatIndex + 1,
      displayName: seat.displayName,
      designRow: seat.designRow,
      cups: seat.servingOrder.map((c, i) => ({ position: i + 1, code: c.code, variantLabel: bySample.get(c.sampleId)?.variantLabel ?? '?' })),
    })),
  };
}

/** The workspace's tastings, newest first; filters come from the URL (state, trial). */
export async function listTastings(actor: Actor, filter: { state?: TastingState; trialId?: string } = {}): Promise<TastingSummary[]> {
  // One plain statement with the seats counted by PostgreSQL: the home page of everyone who runs
  // tastings asks for this list, and the ORM's per-entity work was most of that page's time.
  const rows = await sql<{
    id: string; title: string; method: TastingSummary['method']; state: TastingState; place: string | null; starts_at: Date | null; created_at: Date;
    trial_id: string; trial_number: number; trial_title: string; seats: number; submitted: number;
  }>(
    `select t.id, t.title, t.method, t.state, t.place, t.starts_at, t.created_at, tr.id as trial_id, tr.number as trial_number, tr.title as trial_title,
            coalesce(c.seats, 0)::int as seats, coalesce(c.submitted, 0)::int as submitted
       from panel_sessions t
       join trials tr on tr.id = t.trial_id and tr.workspace_id = t.workspace_id
       left join lateral (
         select count(*) as seats, count(s.submitted_at) as submitted from panel_seats s where s.session_id = t.id and s.workspace_id = t.workspace_id
       ) c on true
      where t.workspace_id = $1 and ($2::text is null or t.state = $2) and ($3::uuid is null or t.trial_id = $3)
      order by t.created_at desc, t.id
      limit 500`,
    [actor.workspaceId, filter.state ?? null, filter.trialId ?? null],
    'list-tastings',
  );
  return rows.map((r) => ({
    id: r.id, title: r.title, method: r.method, state: r.state, place: r.place, startsAt: r.starts_at ? r.starts_at.toISOString() : null,
    trial: { id: r.trial_id, code: trialCode(r.trial_number), title: r.trial_title },
    seats: r.seats, submitted: r.submitted, createdAt: r.created_at.toISOString(),
  }));
}

/** The signed-in person's seats in this workspace: the ones still to answer first, then by date. Only what a taster may see. */
export async function listMySeats(actor: Actor): Promise<MySeat[]> {
  const rows = await sql<{ tasting_id: string; title: string; place: string | null; starts_at: Date | null; state: TastingState; submitted_at: Date | null }>(
    `select t.id as tasting_id, t.title, t.place, t.starts_at, t.state, s.submitted_at
       from panel_seats s
       join panel_sessions t on t.id = s.session_id and t.workspace_id = s.workspace_id
      where s.workspace_id = $1 and s.user_id = $2
      order by s.created_at desc, s.id
      limit 200`,
    [actor.workspaceId, actor.userId],
    'list-my-seats',
  );
  const view = rows.map((r) => ({
    tastingId: r.tasting_id, title: r.title, place: r.place, startsAt: r.starts_at ? r.starts_at.toISOString() : null,
    state: r.state, submitted: !!r.submitted_at, waiting: r.state === 'open' && !r.submitted_at,
  }));
  return [...view.filter((s) => s.waiting), ...view.filter((s) => !s.waiting)];
}
