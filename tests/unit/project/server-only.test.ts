/**
 * Modules that reach the database, secrets, mail or storage are marked `server-only`, so a client
 * component that imports one fails the build instead of shipping server code to a browser (issue 18,
 * part 1). Scripts and tests run outside Next.js and map the marker to its empty module
 * (scripts/outside-next.cjs; the vitest configs alias it).
 */
import { existsSync, readdirSync, readFileSync, statSync } from 'node:fs';
import { spawnSync } from 'node:child_process';
import path from 'node:path';
import { describe, expect, it } from 'vitest';

const ROOT = process.cwd();
const LIB = path.join(ROOT, 'lib');
const INFRA = ['db', 'mail', 'storage', 'secrets', 'passwords', 'page-guard', 'outbox', 'rate-limit', 'auth'].map((name) => `lib/${name}.ts`);
const features = readdirSync(LIB).filter((name) => statSync(path.join(LIB, name)).isDirectory());
const featureFiles = features.flatMap((feature) => ['queries.ts', 'mutations.ts'].map((file) => `lib/${feature}/${file}`)).filter((file) => existsSync(path.join(ROOT, file)));

describe('server-only markers', () => {
  it('finds the feature reads and writes', () => {
    expect(featureFiles.length).toBeGreaterThan(20);
  });

  it.each([...featureFiles, ...INFRA])('%s is marked server-only', (file) => {
    expect(readFileSync(path.join(ROOT, file), 'utf8').split('\n')[0]).toBe("import 'server-only';");
  });

  it('the marker throws outside a server bundle, and the scripts’ preload maps it to the empty module', () => {
    const bare = spawnSync(process.execPath, ['-e', "require('server-only')"], { cwd: ROOT, encoding: 'utf8' });
    expect(bare.status).not.toBe(0);
    expect(bare.stderr).toMatch(/Server Component/);
    const preloaded = spawnSync(process.execPath, ['--require', './scripts/outside-next.cjs', '-e', "require('server-only'); console.log('ok')"], { cwd: ROOT, encoding: 'utf8' });
    expect(preloaded.stdout.trim()).toBe('ok');
  });
});
