/** Loads the invented demo scenario (`npm run db:seed`). Running it again changes nothing. */
import { getOrm, closeOrm } from '../lib/db';
import { seedDemo, DEMO_USERS, DEMO_PASSWORD, OTHER_ADMIN } from '../lib/seed/demo';

async function main() {
  const orm = await getOrm();
  try {
    const report = await seedDemo(orm.em.fork());
    console.log(report.created ? 'demo data loaded' : 'demo data already present; nothing changed');
    for (const u of [...DEMO_USERS, OTHER_ADMIN]) console.log(`  ${u.role.padEnd(16)} ${u.email}`);
    console.log(`  password for all: ${DEMO_PASSWORD}`);
  } finally {
    await closeOrm();
  }
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
