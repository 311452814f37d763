import 'server-only';
/** The organiser's reads: sessions, live progress and the kitchen serving sheet (staff only). */
import { getEm } from '@/lib/db';
import { sql } from '@/lib/sql';
import { TastingAnswer, TastingSample, TastingSeat, Tasting, SensoryAttributeDef, Variant } from '@/entities';
import { inWorkspace, notFound, type Actor } from '@/lib/permissions';
import { trialCode } from '@/lib/trials/access';
import { isUuid } from '@/lib/ids';
import type { TastingMethod, TastingState } from './vocabulary';
import type { MySeat, SeatProgress, TastingSummary, TastingView, TrialTastingRow } from './schema';

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

/** The rows a session's views are built from (its answers are loaded by the caller: all of them for results, only their seats for progress). */
export async function loadTastingRows(actor: Actor, tastingId: string) {
  const em = await getEm();
  // Two waves of reads instead of five in a row: everything keyed by the session id goes at once
  // (each scoped to the workspace, so nothing of another workspace's session is read).
  const [found, samples, seats] = await Promise.all([
    em.findOne(Tasting, { ...inWorkspace(actor), id: tastingId }),
    em.find(TastingSample, { ...inWorkspace(actor), session: tastingId }, { orderBy: { position: 'asc' } }),
    em.find(TastingSeat, { ...inWorkspace(actor), session: tastingId }, { orderBy: { seatIndex: 'asc' } }),
  ]);
  const s = found;
  if (!s) throw notFound('tasting');
  const attrIds = [...s.attributeIds, ...(s.rankingAttributeId ? [s.rankingAttributeId] : [])];
  const [variants, attrs] = await Promise.all([
    em.find(Variant, { ...inWorkspace(actor), id: { $in: samples.map((x) => x.variant.id) } }),
    attrIds.length ? em.find(SensoryAttributeDef, { ...inWorkspace(actor), id: { $in: attrIds } }) : Promise.resolve([]),
  ]);
  return { s, samples, variants, attrs, seats };
}

export async function getTasting(actor: Actor, tastingId: string): Promise<TastingView> {
  const rows = await loadTastingRows(actor, tastingId);
  const answers = await (await getEm()).find(TastingAnswer, { session: rows.s.id }, { fields: ['seat'] });
  return tastingView(rows, answers);
}

/** The organiser's view of a session from its rows; `answers` need only their seat. */
export function tastingView({ s, samples, variants, attrs, seats }: Awaited<ReturnType<typeof loadTastingRows>>, answers: ReadonlyArray<{ seat: { id: string } }>): TastingView {
  const vById = new Map(variants.map((v) => [v.id, v]));
  const attrIds = [...s.attributeIds, ...(s.rankingAttributeId ? [s.rankingAttributeId] : [])];
  const countBySeat = new Map<string, number>();
  for (const a of answers) {
    const id = a.seat.id;
    countBySeat.set(id, (countBySeat.get(id) ?? 0) + 1);
  }
  const expectedFor = (cups: number) => (s.method === 'rated' ? cups * s.attributeIds.length : 1);
  return {
    id: s.id,
    trialId: s.trial.id,
    title: s.title,
    place: s.place ?? null,
    startsAt: s.startsAt ? s.startsAt.toISOString() : null,
    method: s.method,
    state: s.state,
    notice: s.notice,
    joinCode: s.joinCode ?? null,
    samples: samples.map((x) => {
      const v = vById.get(x.variant.id)!;
      return { sampleId: x.id, variantId: v.id, variantLabel: v.label, variantDescription: v.description, code: x.code ?? null };
    }),
    attributes: attrIds.map((id) => attrs.find((a) => a.id === id)).filter((a): a is NonNullable<typeof a> => !!a).map((a) => ({ id: a.id, name: a.name })),
    ratedAttributeIds: s.attributeIds,
    rankingAttributeId: s.rankingAttributeId ?? null,
    seats: seats.map((seat) => {
      const answered = countBySeat.get(seat.id) ?? 0;
      const expected = expectedFor(seat.servingOrder.length);
      const status: SeatProgress['status'] = seat.submittedAt ? 'submitted' : s.state === 'closed' ? 'partial' : answered > 0 ? 'answering' : 'joined';
      return {
        seatIndex: seat.seatIndex, displayName: seat.displayName, kind: seat.kind, answered, expected, consented: !!seat.consentedAt, status,
        lastSeenAt: seat.lastSeenAt ? seat.lastSeenAt.toISOString() : null,
      };
    }),
    createdAt: s.createdAt.toISOString(),
    openedAt: s.openedAt ? s.openedAt.toISOString() : null,
    closedAt: s.closedAt ? s.closedAt.toISOString() : null,
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
