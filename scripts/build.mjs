#!/usr/bin/env node
// @ts-check
/**
 * Builds the main side (tsc → build/main) and the renderer (Vite → build/renderer), each only when
 * its inputs changed since its last build, so `npm start`, `npm test` and the CLI scripts reuse an
 * up-to-date build instead of rebuilding every time. Says nothing when nothing needs building.
 *
 *   node scripts/build.mjs main renderer     build what is stale
 *   node scripts/build.mjs main --force      build even when up to date
 *
 * "Changed" is decided by content, not mtimes (a checkout or a copy touches every mtime): after a
 * build, `<out>/.build-inputs.json` records one SHA-256 over the inputs that made it.
 * - main: every file under src-main/, and package-lock.json (the compiler and type versions).
 * - renderer: every file under src-renderer/, package-lock.json, and the files outside src-renderer
 *   the bundle imported (Vite lists them; src-renderer/vite.config.ts writes `.bundle-modules.json`).
 * The hash is taken from the contents read before the build starts, so an edit made during a build
 * makes the next check stale rather than being recorded as built.
 */
import { spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { existsSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join, relative, sep } from 'node:path';
import { fileURLToPath } from 'node:url';

const appRoot = fileURLToPath(new URL('..', import.meta.url));
const stampName = '.build-inputs.json';
/** Written by src-renderer/vite.config.ts: the repo-relative files the renderer bundle is made of. */
export const bundleModulesName = '.bundle-modules.json';

/** Every file below `folder` (repo-relative, forward slashes), sorted. */
function filesBelow(folder) {
  const absolute = join(appRoot, folder);
  if (!existsSync(absolute)) return [];
  return readdirSync(absolute, { recursive: true, withFileTypes: true })
    .filter((entry) => entry.isFile())
    .map((entry) => relative(appRoot, join(entry.parentPath, entry.name)).split(sep).join('/'))
    .sort();
}

/** SHA-256 over the names and contents of `files` (repo-relative); a missing file counts as such. */
function hashFiles(files, readContent) {
  const hash = createHash('sha256');
  for (const file of [...new Set(files)].sort()) {
    hash.update(`${file}\0`);
    const content = readContent(file);
    hash.update(content === null ? '\0missing\0' : content);
    hash.update('\0');
  }
  return hash.digest('hex');
}

/** Reads each file once, so the hash recorded after a build is of what the build read. */
function snapshotReader() {
  const contents = new Map();
  return (file) => {
    if (!contents.has(file)) {
      const path = join(appRoot, file);
      contents.set(file, existsSync(path) ? readFileSync(path) : null);
    }
    return contents.get(file);
  };
}

function readJson(path) {
  try {
    return JSON.parse(readFileSync(path, 'utf8'));
  } catch {
    return null;
  }
}

function run(command, args) {
  const outcome = spawnSync(command, args, { cwd: appRoot, stdio: ['ignore', 'inherit', 'inherit'] });
  if (outcome.status !== 0) {
    process.stderr.write(`build: ${args.join(' ')} failed\n`);
    process.exit(outcome.status ?? 1);
  }
}

function localBin(name) {
  return join(appRoot, 'node_modules', '.bin', process.platform === 'win32' ? `${name}.cmd` : name);
}

const targets = {
  main: {
    out: join(appRoot, 'build', 'main'),
    inputs: () => [...filesBelow('src-main'), 'package-lock.json'],
    build() {
      // A clean output folder: a renamed or deleted source must not leave its old .js behind.
      rmSync(this.out, { recursive: true, force: true });
      run(process.execPath, [join(appRoot, 'node_modules', 'typescript', 'bin', 'tsc'), '-p', 'src-main/tsconfig.build.json']);
    },
  },
  renderer: {
    out: join(appRoot, 'build', 'renderer'),
    inputs(out = this.out) {
      const bundled = readJson(join(out, bundleModulesName));
      return [...filesBelow('src-renderer'), 'package-lock.json', ...(Array.isArray(bundled) ? bundled : [])];
    },
    build() {
      run(process.execPath, [join(appRoot, 'node_modules', 'vite', 'bin', 'vite.js'), 'build', '--logLevel', 'warn', '--config', 'src-renderer/vite.config.ts']);
    },
  },
};

/** Whether a target's last build was made from the inputs as they are now. */
export function isUpToDate(name) {
  const target = targets[name];
  const stamp = readJson(join(target.out, stampName));
  if (stamp === null || typeof stamp.hash !== 'string') return false;
  return stamp.hash === hashFiles(target.inputs(), snapshotReader());
}

/** Builds the named targets that are stale (all of them with `force`). Returns the ones built. */
export function ensureBuilt(names, { force = false } = {}) {
  const built = [];
  for (const name of names) {
    const target = targets[name];
    if (!force && isUpToDate(name)) continue;
    const read = snapshotReader();
    // Read every candidate input now; the renderer's bundle list is only known after the build.
    for (const file of [...filesBelow('src-main'), ...filesBelow('src-renderer'), 'package-lock.json']) read(file);
    process.stderr.write(`build: ${name} (${force ? 'asked for' : 'sources changed'})\n`);
    target.build();
    writeFileSync(join(target.out, stampName), `${JSON.stringify({ hash: hashFiles(target.inputs(), read) })}\n`);
    built.push(name);
  }
  return built;
}

if (process.argv[1] !== undefined && fileURLToPath(import.meta.url) === process.argv[1]) {
  const args = process.argv.slice(2);
  const names = args.filter((argument) => !argument.startsWith('--'));
  const unknown = names.filter((name) => !Object.hasOwn(targets, name));
  if (names.length === 0 || unknown.length > 0 || args.some((argument) => argument.startsWith('--') && argument !== '--force')) {
    process.stderr.write('Usage: node scripts/build.mjs main|renderer ... [--force]\n');
    process.exit(2);
  }
  ensureBuilt(names, { force: args.includes('--force') });
}
