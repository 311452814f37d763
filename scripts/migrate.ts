/** Applies every pending migration in migrations/ (`npm run db:migrate`). Safe to run repeatedly. */
import { MikroORM } from '@mikro-orm/postgresql';
import config from '../mikro-orm.config';

async function main() {
  const orm = await MikroORM.init(config);
  try {
    const applied = await orm.getMigrator().up();
    console.log(applied.length ? `applied ${applied.length} migration(s): ${applied.map((m) => m.name).join(', ')}` : 'database is up to date');
  } finally {
    await orm.close(true);
  }
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
