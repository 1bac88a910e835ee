import { spawn, spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync, statSync } from 'node:fs';
import { createRequire } from 'node:module';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildIfStale } from '../support/buildIfStale.js';
import { buildElectronStandIn, type StandInRecording } from '../support/electronStandInDriver.js';
import { assembleStandInElectronDist } from '../support/electronStandInDist.js';

// An unpacked Linux build (`electron-builder --linux dir`) of the real configuration, made with a
// stand-in Electron folder because the Electron runtime cannot be downloaded everywhere this runs
// (test/support/electronStandInDist.ts). Its `tallyline` executable runs the packed app under the
// recording electron stand-in, so what is checked is what the package holds and what its command
// does, not Chromium.
const repoRoot = fileURLToPath(new URL('../..', import.meta.url));
const require = createRequire(import.meta.url);
const asar = require('@electron/asar') as { listPackage(archive: string, options: object): string[] };
const fuses = require('@electron/fuses') as { getCurrentFuseWire(path: string): Promise<Record<string, number | string>> };

let work = '';
let output = '';
let packed: string[] = [];
let executable = '';

beforeAll(async () => {
  buildIfStale(['main', 'renderer']);
  work = mkdtempSync(join(tmpdir(), 'tallyline-unpacked-'));
  const registerFile = await buildElectronStandIn(join(work, 'stand-in'));
  const electronVersion = JSON.parse(readFileSync(join(repoRoot, 'node_modules', 'electron', 'package.json'), 'utf8')).version as string;
  assembleStandInElectronDist(join(work, 'electron-dist'), registerFile, electronVersion);
  output = join(work, 'release');
  const builder = spawnSync(
    process.execPath,
    [require.resolve('electron-builder/cli.js'), '--linux', 'dir', '--config', 'electron.config.ts', `-c.electronDist=${join(work, 'electron-dist')}`, `-c.directories.output=${output}`],
    { cwd: repoRoot, encoding: 'utf8', timeout: 240_000 },
  );
  if (builder.status !== 0) throw new Error(`electron-builder failed (${builder.status}): ${builder.stderr}\n${builder.stdout}`);
  executable = join(output, 'linux-unpacked', 'tallyline');
  packed = asar.listPackage(join(output, 'linux-unpacked', 'resources', 'app.asar'), {}).map((path) => path.replaceAll('\\', '/'));
}, 300_000);
afterAll(() => {
  if (work !== '') rmSync(work, { recursive: true, force: true });
});

function runPackaged(args: string[], dataFolder: string): Promise<{ code: number | null; stdout: string; stderr: string; recording: StandInRecording }> {
  const recordingFile = join(mkdtempSync(join(work, 'run-')), 'recording.json');
  return new Promise((resolve, reject) => {
    const child = spawn(executable, args, { env: { ...process.env, TALLYLINE_DATA: dataFolder, ELECTRON_STAND_IN_RECORDING: recordingFile, TMPDIR: work }, stdio: ['ignore', 'pipe', 'pipe'] });
    let stdout = '';
    let stderr = '';
    child.stdout.on('data', (chunk) => (stdout += chunk));
    child.stderr.on('data', (chunk) => (stderr += chunk));
    child.on('error', reject);
    child.on('close', (code) => resolve({ code, stdout, stderr, recording: JSON.parse(readFileSync(recordingFile, 'utf8')) }));
  });
}

describe('the unpacked Linux build', () => {
  it('holds the tallyline executable, with the Electron fuses of electron.config.ts flipped', async () => {
    expect(statSync(executable).mode & 0o111).not.toBe(0);
    // FuseState bytes (@electron/fuses): 48 off, 49 on; order RunAsNode, cookie encryption, NODE_OPTIONS, --inspect, asar integrity, only asar, V8 snapshot, file:// privileges.
    const wire = await fuses.getCurrentFuseWire(executable);
    expect([0, 1, 2, 3, 4, 5, 7].map((fuse) => String.fromCharCode(Number(wire[fuse])))).toEqual(['0', '1', '0', '0', '1', '1', '0']);
  });

  it('packs the CLI entry, the Electron entry and preload, the renderer and the record fonts', () => {
    for (const file of [
      '/package.json',
      '/build/main/cli.js',
      '/build/main/electron/main.js',
      '/build/main/electron/preload.cjs',
      '/build/renderer/index.html',
      '/assets/fonts/DejaVuSans.ttf',
      '/assets/fonts/DejaVuSans-Bold.ttf',
      '/assets/fonts/DejaVuSansMono.ttf',
      '/assets/fonts/LICENSE',
      '/assets/icon.png',
      '/node_modules/pdfkit/js/pdfkit.js',
      '/node_modules/zod/package.json',
    ]) {
      expect(packed, file).toContain(file);
    }
  });

  it('packs no dev files: no sources, tests, build stamps, source maps, TypeScript or dev dependencies', () => {
    const devFile =
      /^\/(src-main|src-renderer|test|scripts|\.ci|release)\/|^\/(electron\.config\.ts|tsconfig.*\.json|package-lock\.json|README\.md|DEVELOPERS\.md)$|\.map$|\.build-inputs\.json$|\.bundle-modules\.json$|\.(ts|mts|cts)$|^\/build\/(?!main$|renderer$)[^/]+$|^\/assets\/(icon\.svg|make-icon\.sh)$/;
    expect(packed.filter((path) => devFile.test(path))).toEqual([]);
    const topModules = new Set(packed.filter((path) => /^\/node_modules\/(@[^/]+\/)?[^/@]+$/.test(path)).map((path) => path.slice('/node_modules/'.length)));
    for (const devDependency of ['electron', 'electron-builder', 'vitest', 'typescript', 'vite', 'svelte', 'tsx', 'esbuild', '@playwright/test', 'pdfjs-dist', 'jstat', 'fast-check']) {
      expect(topModules.has(devDependency), devDependency).toBe(false);
    }
  });

  it('runs `tallyline plan --help` as the command line: help on stdout, exit 0, no window, no single-instance lock', async () => {
    const run = await runPackaged(['plan', '--help'], mkdtempSync(join(work, 'data-')));
    expect(run.code).toBe(0);
    expect(run.stdout).toMatch(/^Usage: tallyline plan --model passfail/);
    expect(run.recording.windows).toEqual([]);
    expect(run.recording.singleInstanceLockRequested).toBe(false);
    expect(run.recording.exitCode).toBe(0);
  });

  it('runs a whole command from the package, writing a decision record with the packed fonts', async () => {
    const data = mkdtempSync(join(work, 'data-'));
    const started = await runPackaged(['run', 'start', '--model', 'passfail', '--p0', '0.01', '--p1', '0.1', '--alpha', '0.05', '--beta', '0.1', '--source', 'Packaged Supplier', '--lot', 'P-1', '--json'], data);
    expect(started.code, started.stderr).toBe(0);
    const { run } = JSON.parse(started.stdout) as { run: string };
    const pdf = join(data, 'record.pdf');
    const recorded = await runPackaged(['record', '--run', run, '--out', pdf], data);
    expect(recorded.code, recorded.stderr).toBe(0);
    expect(readFileSync(pdf).subarray(0, 5).toString('latin1')).toBe('%PDF-');
    expect(recorded.recording.windows).toEqual([]);
  });

  it('refuses a bad flag from the package with exit code 2 and one line', async () => {
    const run = await runPackaged(['plan', '--model', 'passfail', '--p0', 'lots'], mkdtempSync(join(work, 'data-')));
    expect(run.code).toBe(2);
    expect(run.stderr.trim().split('\n')).toHaveLength(1);
    expect(existsSync(executable)).toBe(true);
  });
});
