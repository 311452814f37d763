/**
 * Load-benchmark set-up (part of `npm run bench`): an invented kitchen with one open rated tasting
 * and SEATS guest seats that have accepted the notice, made through the same feature functions the
 * app uses. Writes the seat tokens, codes and attribute ids to the file named by argv[2], and
 * creates the floor route's table.
 */
import fs from 'node:fs';
import { randomUUID } from 'node:crypto';
import { getOrm, closeOrm } from '../lib/db';
import { Membership, User, Workspace } from '../entities';
import { addStarterLibrary } from '../lib/ingredients/mutations';
import { addDefaultAttributes, createTasting, joinAsGuest, openTasting } from '../lib/tastings/mutations';
import { listAttributes } from '../lib/tastings/queries';
import { recordConsent, tasterView } from '../lib/taster/seat';
import { createFormula } from '../lib/formulas/mutations';
import { createTrial, planVariants } from '../lib/trials/mutations';
import { listVariants } from '../lib/trials/queries';
import { starterIdsByKey } from '../lib/ingredients/queries';
import type { Actor } from '../lib/permissions';

const SEATS = Number(process.env.BENCH_SEATS ?? 100);

async function main() {
  const out = process.argv[2];
  const orm = await getOrm();
  const em = orm.em.fork();
  const tag = randomUUID().slice(0, 8);
  const ws = em.create(Workspace, { name: `Bench kitchen ${tag}`, slug: `bench-${tag}` });
  const user = em.create(User, { email: `bench.dev.${tag}@bench.example`, name: 'Bench developer', passwordHash: null });
  em.create(Membership, { workspace: ws, user, role: 'developer' });
  await em.flush();
  await addStarterLibrary(em, ws.id);
  await addDefaultAttributes(em, ws.id);
  const actor: Actor = { userId: user.id, email: '', name: 'Bench developer', workspaceId: ws.id, workspaceName: ws.name, role: 'developer', via: 'session', massUnits: 'metric', temperatureUnit: 'C' };
  const ids = await starterIdsByKey(em, ws.id);
  const { formulaId } = await createFormula(actor, {
    name: 'Bench jam', settings: { productClass: 'jam', ruleSet: 'eu', ruleDate: '2026-03-01', targetSolidsPct: 65, jarNetFillG: 340 },
    lines: [{ ingredientId: ids.strawberry, quantity: 1000, unit: 'g' }, { ingredientId: ids.sucrose, quantity: 1000, unit: 'g' }, { ingredientId: ids.pectin_hm_rapid_150, quantity: 6, unit: 'g' }],
  });
  const { trialId } = await createTrial(actor, { title: 'Bench trial', question: 'Load', formulaId });
  await planVariants(actor, trialId, { kind: 'full_factorial', factors: [{ factor: 'sugar_ratio', low: 0.8, high: 1.2 }, { factor: 'pectin_dose', low: 4, high: 8 }], centrePoint: false });
  const variants = await listVariants(actor, trialId);
  const attrs = await listAttributes(actor);
  const attributeIds = ['overall-liking', 'set-firmness', 'sweetness'].map((k) => attrs.find((a) => a.libraryKey === k)!.id);
  const { tastingId } = await createTasting(actor, trialId, {
    title: 'Bench tasting', method: 'rated', variantIds: variants.map((v) => v.id), attributeIds, notice: 'Invented benchmark tasting.',
  });
  const { joinCode } = await openTasting(actor, tastingId);
  const seats: Array<{ token: string; codes: string[] }> = [];
  for (let i = 0; i < SEATS; i++) {
    const { seatToken } = await joinAsGuest({ joinCode, displayName: `Bench taster ${i + 1}` });
    await recordConsent(seatToken);
    seats.push({ token: seatToken, codes: (await tasterView(seatToken)).samples.map((s) => s.code) });
  }
  // Values every default attribute scale accepts (the hedonic 1–9, the 0–10 line, the JAR 1–5).
  const values: Record<string, number[]> = Object.fromEntries(attributeIds.map((id) => [id, [1, 2, 3, 4, 5]]));
  await orm.em.getConnection().execute('create table if not exists bench_floor (id uuid primary key default gen_random_uuid(), seat text not null, body jsonb not null, created_at timestamptz not null default now())');
  fs.writeFileSync(out, JSON.stringify({ tastingId, joinCode, attributeIds, values, seats }, null, 2));
  console.log(`bench set-up: ${seats.length} seats, ${seats[0].codes.length} samples, ${attributeIds.length} attributes`);
  await closeOrm();
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
