import { readFileSync, readdirSync, statSync } from 'node:fs';
import { builtinModules } from 'node:module';
import path from 'node:path';
import { describe, expect, it } from 'vitest';

// Every declared runtime dependency earns its place: something the app, its build or its scripts
// load names it. Tests and tooling-only packages live in devDependencies, and the app itself never
// loads a devDependency (a production install may leave them out).

const ROOT = process.cwd();
const manifest = JSON.parse(readFileSync(path.join(ROOT, 'package.json'), 'utf8')) as {
  dependencies: Record<string, string>;
  devDependencies: Record<string, string>;
  scripts: Record<string, string>;
};

/** The app's code: what `next build` bundles and `next start` runs. */
const APP_DIRS = ['app', 'lib', 'components', 'entities'];
const APP_ROOT_FILES = /^(instrumentation[\w-]*\.ts|proxy\.ts|next\.config\.mjs|mikro-orm\.config\.ts|postcss\.config\.mjs|tailwind\.config\.ts)$/;
const SOURCE_FILE = /\.(ts|tsx|mts|mjs|js|css|sh)$/;

function filesUnder(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const full = path.join(dir, name);
    if (statSync(full).isDirectory()) return filesUnder(full);
    return SOURCE_FILE.test(name) ? [full] : [];
  });
}

const appFiles = [
  ...APP_DIRS.flatMap((dir) => filesUnder(path.join(ROOT, dir))),
  ...readdirSync(ROOT).filter((name) => APP_ROOT_FILES.test(name)).map((name) => path.join(ROOT, name)),
];
const scriptFiles = filesUnder(path.join(ROOT, 'scripts'));

/** The package a module specifier names, or null for relative, aliased and built-in modules. */
function packageOf(specifier: string): string | null {
  if (/^(\.|\/|@\/|node:|#)/.test(specifier) || builtinModules.includes(specifier.split('/')[0])) return null;
  const parts = specifier.split('/');
  return specifier.startsWith('@') ? parts.slice(0, 2).join('/') : parts[0];
}

const SPECIFIERS = [
  // import … from 'x', import 'x', export … from 'x', CSS @import "x" — not SQL's from "${table}" (no $ in a package name)
  /\b(?:from|import)\s*['"]([^'"\s$]+)['"]/g,
  /\b(?:import|require)\s*\(\s*['"]([^'"\s]+)['"]\s*\)/g, // import('x'), require('x')
  /@plugin\s+['"]([^'"\s]+)['"]/g, // Tailwind's CSS plugins
  /--import[= ]([^\s'"]+)/g, // node --import tsx
];
const TYPE_ONLY = /\b(?:import|export)\s+type\s[^;]*?from\s*['"][^'"]+['"]/gs;

/** Packages a text loads at run time (type-only imports are erased, so they do not count). */
function packagesIn(text: string): Set<string> {
  const code = text.replace(TYPE_ONLY, '');
  const found = new Set<string>();
  for (const pattern of SPECIFIERS) {
    for (const match of code.matchAll(pattern)) {
      const name = packageOf(match[1]);
      if (name) found.add(name);
    }
  }
  return found;
}

function packagesInFiles(files: readonly string[]): Map<string, string[]> {
  const users = new Map<string, string[]>();
  for (const file of files) {
    for (const name of packagesIn(readFileSync(file, 'utf8'))) users.set(name, [...(users.get(name) ?? []), path.relative(ROOT, file)]);
  }
  return users;
}

/** PostCSS plugins are named as keys of postcss.config.mjs, not imported. */
async function postcssPlugins(): Promise<string[]> {
  const config = (await import(path.join(ROOT, 'postcss.config.mjs'))) as { default: { plugins: Record<string, unknown> } };
  return Object.keys(config.default.plugins);
}

/** A peer dependency the package needs installed beside it (not marked optional). */
function requiredPeers(name: string): string[] {
  const own = JSON.parse(readFileSync(path.join(ROOT, 'node_modules', name, 'package.json'), 'utf8')) as {
    peerDependencies?: Record<string, string>;
    peerDependenciesMeta?: Record<string, { optional?: boolean }>;
  };
  return Object.keys(own.peerDependencies ?? {}).filter((peer) => !own.peerDependenciesMeta?.[peer]?.optional);
}

describe('declared dependencies', () => {
  it('every runtime dependency is loaded by the app, its build, its scripts or a package that needs it as a peer', async () => {
    const used = new Set<string>([
      ...packagesInFiles(appFiles).keys(),
      ...packagesInFiles(scriptFiles).keys(),
      ...packagesIn(Object.values(manifest.scripts).join('\n')),
      ...(await postcssPlugins()),
    ]);
    // The scan must see the obvious ones, or it is not scanning at all.
    expect([...used]).toEqual(expect.arrayContaining(['next', 'react', 'zod', '@mikro-orm/core', 'tailwindcss', 'tsx']));
    for (let grew = true; grew; ) {
      grew = false;
      for (const name of [...used]) {
        if (!(name in manifest.dependencies)) continue;
        for (const peer of requiredPeers(name)) if (!used.has(peer)) { used.add(peer); grew = true; }
      }
    }
    const unused = Object.keys(manifest.dependencies).filter((name) => !used.has(name));
    expect(unused, 'declared in dependencies but never loaded: remove them, or move them to devDependencies').toEqual([]);
  });

  it('the app never loads a devDependency, and everything it loads is declared', () => {
    const users = packagesInFiles(appFiles);
    const fromDev = [...users].filter(([name]) => name in manifest.devDependencies);
    expect(fromDev, 'the app loads these devDependencies: move them to dependencies').toEqual([]);
    const undeclared = [...users].filter(([name]) => !(name in manifest.dependencies));
    expect(undeclared, 'the app loads undeclared packages').toEqual([]);
  });
});
