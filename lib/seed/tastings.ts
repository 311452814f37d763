/**
 * Demo tastings, invented: a closed rated panel of 24 tasters on the apricot trial, a closed
 * triangle test on the blackcurrant trial, and one open session a newcomer can join from a
 * phone. Answers are made up around per-variant tendencies with tasters' own scatter.
 */
import { randomUUID } from 'node:crypto';
import { addSeat, createTasting, openTasting, closeTasting, joinAsGuest } from '@/lib/tastings/mutations';
import { getEm } from '@/lib/db';
import { User } from '@/entities';
import { listAttributes, getServingSheet } from '@/lib/tastings/queries';
import { recordAnswer, recordConsent, submitSeat, tasterView } from '@/lib/taster/seat';
import type { Actor } from '@/lib/permissions';
import type { SeededTrial } from './trials';

const TASTERS = [
  'Ada', 'Bram', 'Cleo', 'Dov', 'Esme', 'Finn', 'Gwen', 'Hale', 'Ivo', 'Juno', 'Kit', 'Lior',
  'Mael', 'Nell', 'Oren', 'Pia', 'Quin', 'Rue', 'Sami', 'Tove', 'Uma', 'Vale', 'Wynn', 'Yara',
];

/** Deterministic noise in [-1, 1] so every seed gives the same demo. */
function noise(seed: number): number {
  const x = Math.sin(seed * 78.233 + 12.9898) * 43758.5453;
  return (x - Math.floor(x)) * 2 - 1;
}

const clamp = (v: number, lo: number, hi: number) => Math.min(hi, Math.max(lo, v));

export async function seedDemoTastings(developer: Actor, trials: SeededTrial[]): Promise<void> {
  const [apricot, blackcurrant] = trials;
  const attrs = await listAttributes(developer);
  const key = (k: string) => attrs.find((a) => a.libraryKey === k)!.id;
  const liking = key('overall-liking');
  const firmness = key('set-firmness');
  const sweetness = key('sweetness');
  const notice =
    'These are fruit spreads from our development kitchen, with fruit, sugar and pectin; the crackers contain wheat (gluten). Do not taste if you have an allergy or intolerance to any of these. Taking part is voluntary and you can stop at any time. Your answers are stored under the name you give and used only to develop our products.';

  // Rated panel on the apricot trial: tendencies follow the cooks (B ran, E set firm).
  const labels = ['A', 'B', 'C', 'D', 'E'];
  const { tastingId } = await createTasting(developer, apricot.trialId, {
    title: 'Spread tasting, 19 November', place: 'Tasting room', startsAt: '2026-11-19T10:30:00Z', method: 'rated',
    variantIds: labels.map((l) => apricot.variantIds[l]), attributeIds: [liking, firmness, sweetness], notice,
  });
  const { joinCode } = await openTasting(developer, tastingId);
  const sheetLabels = new Map((await getServingSheet(developer, tastingId)).samples.map((s) => [s.code!, s.variantLabel]));
  const likingBy: Record<string, number> = { A: 6.6, B: 4.9, C: 6.1, D: 6.8, E: 7.2 };
  const firmBy: Record<string, number> = { A: 6.0, B: 2.4, C: 4.2, D: 6.6, E: 8.1 };
  const sweetBy: Record<string, number> = { A: 2.9, B: 2.2, C: 3.1, D: 2.3, E: 3.2 };
  for (const [t, name] of TASTERS.entries()) {
    const { seatToken } = await joinAsGuest({ joinCode, displayName: name });
    await recordConsent(seatToken);
    const view = await tasterView(seatToken);
    const bias = noise(t + 1) * 0.8; // some tasters score everything higher
    for (const s of view.samples) {
      const l = sheetLabels.get(s.code)!;
      // Keyed on the variant, not the serving position, so the demo is the same on every seed.
      const n = (k: number) => noise(t * 31 + l.charCodeAt(0) * 7 + k);
      await recordAnswer(seatToken, { idempotencyKey: randomUUID(), code: s.code, attributeId: liking, value: Math.round(clamp(likingBy[l] + bias + n(1) * 1.2, 1, 9)) });
      await recordAnswer(seatToken, { idempotencyKey: randomUUID(), code: s.code, attributeId: firmness, value: Math.round(clamp(firmBy[l] + n(2) * 1.3, 0, 10) * 10) / 10 });
      await recordAnswer(seatToken, { idempotencyKey: randomUUID(), code: s.code, attributeId: sweetness, value: Math.round(clamp(sweetBy[l] + n(3) * 0.9, 1, 5)) });
    }
    // Two tasters left early: their seats stay, marked partial.
    if (t < 22) await submitSeat(seatToken);
  }
  await closeTasting(developer, tastingId);
  await placeInTime(tastingId, '2026-11-19T10:30:00Z');

  // Triangle on the blackcurrant trial: does less added pectin (B) taste different from A?
  const triangle = await createTasting(developer, blackcurrant.trialId, {
    title: 'Three-cup test, 27 November', place: 'Tasting room', startsAt: '2026-11-27T14:00:00Z', method: 'triangle',
    variantIds: [blackcurrant.variantIds.A, blackcurrant.variantIds.B], attributeIds: [], notice,
  });
  const tri = await openTasting(developer, triangle.tastingId);
  for (const [t, name] of TASTERS.entries()) {
    const { seatToken } = await joinAsGuest({ joinCode: tri.joinCode, displayName: name });
    await recordConsent(seatToken);
    const view = await tasterView(seatToken);
    const sheet = await getServingSheet(developer, triangle.tastingId);
    const cups = sheet.seats.find((s) => s.displayName === name && s.seatNumber === t + 1)!.cups;
    const odd = cups.find((c) => cups.filter((x) => x.variantLabel === c.variantLabel).length === 1)!;
    // About half find the odd cup (a real but small difference); the rest guess.
    const finds = noise(t + 101) > -0.1;
    const pick = finds ? odd.code : view.samples[(t + 1) % 3].code;
    await recordAnswer(seatToken, { idempotencyKey: randomUUID(), oddCode: pick, confidence: finds ? 2 : 3 });
    await submitSeat(seatToken);
  }
  await closeTasting(developer, triangle.tastingId);
  await placeInTime(triangle.tastingId, '2026-11-27T14:00:00Z');

  // Open for newcomers: join from a phone with the code on the organiser's screen.
  const open = await createTasting(developer, apricot.trialId, {
    title: 'Second look: two spreads', place: 'Tasting room', method: 'rated',
    variantIds: [apricot.variantIds.A, apricot.variantIds.E], attributeIds: [liking, firmness], notice,
  });
  await openTasting(developer, open.tastingId);
  // Two staff tasters are seated at it, so their home pages and My tastings have a seat waiting.
  const em = await getEm();
  for (const email of SEATED_STAFF) {
    const user = await em.fork().findOneOrFail(User, { email });
    await em.fork().transactional((tx) => addSeat(tx, open.tastingId, { kind: 'staff', userId: user.id, displayName: user.name }));
  }
}

/**
 * A closed demo tasting happened on its day, not when the seed ran: it was set up two days before,
 * seats arrive two minutes apart from its start, each answer 40 s after the last, submissions about
 * 18 minutes after a seat's arrival, and it closed 90 minutes after the start. The seed goes through
 * the app's own writes, which stamp the time of the run; this moves those stamps, keeping their order.
 */
async function placeInTime(tastingId: string, startsAt: string): Promise<void> {
  const conn = (await getEm()).getConnection();
  await conn.execute(
    `update panel_sessions set created_at = ?::timestamptz - interval '2 days', opened_at = ?::timestamptz - interval '10 minutes', closed_at = ?::timestamptz + interval '90 minutes' where id = ?`,
    [startsAt, startsAt, startsAt, tastingId],
  );
  await conn.execute(
    `update panel_seats set
        created_at = ?::timestamptz + seat_index * interval '2 minutes',
        consented_at = case when consented_at is null then null else ?::timestamptz + seat_index * interval '2 minutes' + interval '20 seconds' end,
        submitted_at = case when submitted_at is null then null else ?::timestamptz + seat_index * interval '2 minutes' + interval '18 minutes' end,
        last_seen_at = case when last_seen_at is null then null else ?::timestamptz + seat_index * interval '2 minutes' + interval '17 minutes' end
      where session_id = ?`,
    [startsAt, startsAt, startsAt, startsAt, tastingId],
  );
  await conn.execute(
    `update panel_answers a set created_at = s.created_at + interval '1 minute' + x.n * interval '40 seconds', updated_at = s.created_at + interval '1 minute' + x.n * interval '40 seconds'
       from panel_seats s, (select id, row_number() over (partition by seat_id order by created_at, id) - 1 as n from panel_answers where session_id = ?) x
      where a.id = x.id and s.id = a.seat_id`,
    [tastingId],
  );
}

/** The demo taster and the developer who also tastes (see DEMO_USERS in demo.ts). */
const SEATED_STAFF = ['sol.taster@hollowmere.example', 'tomas.dev@hollowmere.example'];
