/**
 * The invented demo scenario. Hollowmere Preserves is a fictional small jam kitchen;
 * Brackenfold Kitchen is a second fictional producer that exists to prove isolation.
 * Every person here is made up. Later features extend this file with their own demo data.
 */
import type { EntityManager } from '@mikro-orm/postgresql';
import { Invitation, Membership, User, Workspace } from '@/entities';
import { hashSecret, newSecret } from '@/lib/secrets';
import { hashPassword } from '@/lib/passwords';
import type { Actor, Role } from '@/lib/permissions';
import { addStarterLibrary } from '@/lib/ingredients/mutations';
import { addDefaultAttributes } from '@/lib/tastings/mutations';
import { seedDemoFormulas } from './formulas';
import { seedDemoPrices } from './prices';
import { seedDemoTrials } from './trials';
import { seedDemoNotebooks } from './notebook';
import { seedDemoTastings } from './tastings';
import { seedDemoProduction } from './production';
import { seedDemoModelHistory } from './model-history';

export const DEMO_PASSWORD = 'setwell-demo-2026';

export const DEMO_WORKSPACE = { name: 'Hollowmere Preserves', slug: 'hollowmere' };
export const OTHER_WORKSPACE = { name: 'Brackenfold Kitchen', slug: 'brackenfold' };

export const DEMO_USERS: Array<{ email: string; name: string; role: Role; alsoIn?: Role }> = [
  { email: 'ines.admin@hollowmere.example', name: 'Ines Calloway', role: 'admin' },
  { email: 'tomas.dev@hollowmere.example', name: 'Tomas Verrall', role: 'developer', alsoIn: 'taster' },
  { email: 'maren.head@hollowmere.example', name: 'Maren Ostwick', role: 'head_of_product' },
  { email: 'jory.kitchen@hollowmere.example', name: 'Jory Penhallow', role: 'production' },
  { email: 'sol.taster@hollowmere.example', name: 'Sol Ambry', role: 'taster' },
];

export const OTHER_ADMIN = { email: 'wren.admin@brackenfold.example', name: 'Wren Hatherley', role: 'admin' as Role };

export interface SeedReport {
  created: boolean;
  workspaceId: string;
  otherWorkspaceId: string;
}

/** Idempotent: a second run finds the demo workspace and changes nothing. */
export async function seedDemo(em: EntityManager): Promise<SeedReport> {
  const existing = await em.findOne(Workspace, { slug: DEMO_WORKSPACE.slug });
  const other = await em.findOne(Workspace, { slug: OTHER_WORKSPACE.slug });
  if (existing && other) return { created: false, workspaceId: existing.id, otherWorkspaceId: other.id };

  const passwordHash = await hashPassword(DEMO_PASSWORD);
  const report = await em.transactional(async (tx) => {
    const demo = tx.create(Workspace, DEMO_WORKSPACE);
    const brackenfold = tx.create(Workspace, OTHER_WORKSPACE);
    // A person's first membership is the workspace they land in without a choice. Created in one
    // flush, both would share a timestamp and the tie would fall to random ids, so the second
    // workspace is joined a day later, as it would have been.
    const joinedLater = new Date();
    const joinedHere = new Date(joinedLater.getTime() - 24 * 3600 * 1000);
    for (const u of DEMO_USERS) {
      const user = tx.create(User, { email: u.email, name: u.name, passwordHash });
      tx.create(Membership, { workspace: demo, user, role: u.role, createdAt: joinedHere });
      if (u.alsoIn) tx.create(Membership, { workspace: brackenfold, user, role: u.alsoIn, createdAt: joinedLater });
    }
    const otherAdmin = tx.create(User, { email: OTHER_ADMIN.email, name: OTHER_ADMIN.name, passwordHash });
    tx.create(Membership, { workspace: brackenfold, user: otherAdmin, role: 'admin' });
    await tx.flush();
    await addStarterLibrary(tx, demo.id);
    await addStarterLibrary(tx, brackenfold.id);
    await addDefaultAttributes(tx, demo.id);
    await addDefaultAttributes(tx, brackenfold.id);
    // One invitation not yet accepted, so the administrator's worklist has something in it. Its link was never sent.
    const admin = await tx.findOneOrFail(User, { email: DEMO_USERS[0].email });
    tx.create(Invitation, { workspace: demo, email: 'pip.taster@hollowmere.example', role: 'taster', tokenHash: hashSecret(newSecret()), invitedBy: admin, expiresAt: new Date(Date.now() + 14 * 86_400_000) });
    await tx.flush();
    return { created: true, workspaceId: demo.id, otherWorkspaceId: brackenfold.id };
  });
  const developer = await em.fork().findOneOrFail(User, { email: DEMO_USERS[1].email });
  const actor = demoActor(developer, report.workspaceId, 'developer');
  await seedDemoFormulas(em.fork(), actor);
  const trials = await seedDemoTrials(em.fork(), actor);
  await seedDemoNotebooks(actor, trials);
  await seedDemoTastings(actor, trials);
  const person = async (index: number, role: Role) => demoActor(await em.fork().findOneOrFail(User, { email: DEMO_USERS[index].email }), report.workspaceId, role);
  // Prices before production: approving a version freezes its cost and takes its formula's pack format.
  await seedDemoPrices(em.fork(), { admin: await person(0, 'admin'), production: await person(3, 'production'), developer: actor });
  await seedDemoProduction({ developer: actor, head: await person(2, 'head_of_product'), production: await person(3, 'production') }, trials);
  // Last, so the existing trials keep their numbers; dated earlier, so they sort after them.
  await seedDemoModelHistory(em.fork(), actor);
  return report;
}

function demoActor(user: { id: string; email: string; name: string }, workspaceId: string, role: Role): Actor {
  return {
    userId: user.id, email: user.email, name: user.name, workspaceId, workspaceName: DEMO_WORKSPACE.name,
    role, via: 'session', massUnits: 'metric', temperatureUnit: 'C',
  };
}
