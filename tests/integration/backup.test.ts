/**
 * Backups round-trip: the demo seed in a database of the test cluster → scripts/backup.sh →
 * scripts/restore.sh into a fresh database; every table's row count and a content checksum of
 * key tables must match. Also: a non-empty target is refused unchanged, --force keeps a safety
 * backup, and a file that is not a dump creates nothing.
 */
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { randomUUID } from 'node:crypto';
import { Client } from 'pg';

const ROOT = path.resolve(__dirname, '../..');
const BASE_URL = process.env.DATABASE_URL!;
const tag = randomUUID().slice(0, 8).replace(/-/g, '');
const SOURCE = `setwell_bk_src_${tag}`;
const TARGET = `setwell_bk_dst_${tag}`;
const urlFor = (db: string) => {
  const u = new URL(BASE_URL);
  u.pathname = `/${db}`;
  return u.toString();
};
let dir: string;

function run(cmd: string, args: string[], env: Record<string, string> = {}) {
  const r = spawnSync(cmd, args, { cwd: ROOT, env: { ...process.env, ...env }, encoding: 'utf8', timeout: 240_000 });
  return { status: r.status, stdout: r.stdout.trim(), stderr: r.stderr };
}

async function withDb<T>(db: string, fn: (c: Client) => Promise<T>): Promise<T> {
  const c = new Client({ connectionString: urlFor(db) });
  await c.connect();
  try {
    return await fn(c);
  } finally {
    await c.end();
  }
}

async function tableCounts(db: string): Promise<Record<string, number>> {
  return withDb(db, async (c) => {
    const tables = (await c.query<{ t: string }>(`select table_name as t from information_schema.tables where table_schema = 'public' and table_type = 'BASE TABLE' order by 1`)).rows.map((r) => r.t);
    const out: Record<string, number> = {};
    for (const t of tables) out[t] = Number((await c.query(`select count(*) as n from "${t}"`)).rows[0].n);
    return out;
  });
}

const KEY_TABLES = ['users', 'formula_revisions', 'panel_answers', 'trials', 'notebook_entries', 'mikro_orm_migrations'];

async function checksums(db: string): Promise<Record<string, string>> {
  return withDb(db, async (c) => {
    const out: Record<string, string> = {};
    for (const t of KEY_TABLES) out[t] = (await c.query(`select md5(coalesce(string_agg(x::text, E'\\n' order by x::text), '')) as h from "${t}" x`)).rows[0].h;
    return out;
  });
}

async function databaseExists(db: string): Promise<boolean> {
  return withDb('postgres', async (c) => (await c.query('select 1 from pg_database where datname = $1', [db])).rowCount === 1);
}

beforeAll(async () => {
  dir = fs.mkdtempSync(path.join(os.tmpdir(), 'setwell-backup-'));
  await withDb('postgres', (c) => c.query(`create database ${SOURCE}`));
  const env = { DATABASE_URL: urlFor(SOURCE), LOG_LEVEL: 'silent' };
  for (const script of ['scripts/migrate.ts', 'scripts/seed.ts']) {
    const r = run('node', ['--require', './scripts/outside-next.cjs', '--import', 'tsx', script], env);
    if (r.status !== 0) throw new Error(`${script} failed: ${r.stderr}`);
  }
}, 240_000);

afterAll(async () => {
  await withDb('postgres', async (c) => {
    const { rows } = await c.query<{ datname: string }>(`select datname from pg_database where datname like $1`, [`setwell_bk_%${tag}%`]);
    for (const r of rows) await c.query(`drop database "${r.datname}" with (force)`);
  });
  fs.rmSync(dir, { recursive: true, force: true });
});

describe('backup and restore', () => {
  let dump: string;

  it('backs up the seeded demo and restores it into a fresh database with every row and the same content', async () => {
    const b = run('bash', ['scripts/backup.sh', '--dir', dir], { DATABASE_URL: urlFor(SOURCE) });
    expect(b.status, b.stderr).toBe(0);
    dump = b.stdout.split('\n').at(-1)!;
    expect(path.dirname(dump)).toBe(dir);
    expect(path.basename(dump)).toMatch(new RegExp(`^${SOURCE}-\\d{8}T\\d{6}Z\\.dump$`));
    expect(fs.statSync(dump).mode & 0o077).toBe(0); // it holds password hashes
    expect(fs.readdirSync(dir).filter((f) => f.endsWith('.partial'))).toEqual([]);

    const r = run('bash', ['scripts/restore.sh', dump, TARGET], { DATABASE_URL: urlFor(SOURCE) });
    expect(r.status, r.stderr).toBe(0);
    expect(r.stdout.split('\n').at(-1)).toBe(TARGET);

    const [before, after] = [await tableCounts(SOURCE), await tableCounts(TARGET)];
    expect(Object.keys(before).length).toBeGreaterThan(15);
    expect(after).toEqual(before);
    // The demo really is in there: people, revisions and the invented tasters' answers.
    expect(before.users).toBeGreaterThanOrEqual(6);
    expect(before.formula_revisions).toBeGreaterThan(0);
    expect(before.panel_answers).toBeGreaterThan(300);
    expect(await checksums(TARGET)).toEqual(await checksums(SOURCE));
    // The immutability trigger on revisions came along.
    const triggers = await withDb(TARGET, async (c) => (await c.query(`select tgname from pg_trigger where tgname = 'formula_revisions_no_change'`)).rowCount);
    expect(triggers).toBe(1);
  });

  it('refuses to restore over a database that holds data, and changes nothing', async () => {
    await withDb(TARGET, (c) => c.query(`insert into workspaces (id, name, slug, created_at) values ($1, 'Kept kitchen', $2, now())`, [randomUUID(), `kept-${tag}`]));
    const before = await tableCounts(TARGET);
    const r = run('bash', ['scripts/restore.sh', dump, TARGET], { DATABASE_URL: urlFor(SOURCE) });
    expect(r.status).not.toBe(0);
    expect(r.stderr).toContain('is not empty');
    expect(await tableCounts(TARGET)).toEqual(before);
  });

  it('with --force keeps a backup of what it replaces first', async () => {
    const kept = await withDb(TARGET, async (c) => (await c.query(`select count(*)::int as n from workspaces where slug = $1`, [`kept-${tag}`])).rows[0].n);
    expect(kept).toBe(1);
    const r = run('bash', ['scripts/restore.sh', dump, TARGET, '--force'], { DATABASE_URL: urlFor(SOURCE), SETWELL_BACKUP_DIR: dir });
    expect(r.status, r.stderr).toBe(0);
    const safety = r.stderr.match(/previous contents of \S+ are in (\S+)/)?.[1];
    expect(safety && fs.existsSync(safety)).toBe(true);
    expect(await tableCounts(TARGET)).toEqual(await tableCounts(SOURCE));
    // The replaced contents (with the extra workspace) can be restored from the safety backup.
    const back = run('bash', ['scripts/restore.sh', safety!, `setwell_bk_safety_${tag}`], { DATABASE_URL: urlFor(SOURCE) });
    expect(back.status, back.stderr).toBe(0);
    const again = await withDb(`setwell_bk_safety_${tag}`, async (c) => (await c.query(`select count(*)::int as n from workspaces where slug = $1`, [`kept-${tag}`])).rows[0].n);
    expect(again).toBe(1);
  });

  it('a file that is not a dump, or a bad database name, is refused and creates nothing', async () => {
    const junk = path.join(dir, 'not-a-dump.dump');
    fs.writeFileSync(junk, 'hello');
    const name = `setwell_bk_junk_${tag}`;
    const r = run('bash', ['scripts/restore.sh', junk, name], { DATABASE_URL: urlFor(SOURCE) });
    expect(r.status).not.toBe(0);
    expect(r.stderr).toContain('is not a custom-format pg_dump file');
    expect(await databaseExists(name)).toBe(false);
    const bad = run('bash', ['scripts/restore.sh', dump, 'Robert"; drop table users;--'], { DATABASE_URL: urlFor(SOURCE) });
    expect(bad.status).not.toBe(0);
    expect(bad.stderr).toContain('is not allowed');
  });
});
