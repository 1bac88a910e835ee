/**
 * Bench cases for start-up, each a whole process of the compiled app (built first if stale):
 * - cli-plan-wall: `tallyline plan ... --json` from process start to exit;
 * - host-start: the browser host from process start until it prints its address (renderer already built).
 */
import { spawn, spawnSync } from 'node:child_process';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { buildIfStale } from '../../support/buildIfStale.js';
import { benchCase } from '../benchCase.js';

const repoRoot = fileURLToPath(new URL('../../..', import.meta.url));

function hostStartsOnce(dataDirectory: string): Promise<void> {
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, [join(repoRoot, 'build', 'main', 'host', 'serve.js'), '--port', '0', '--data-dir', dataDirectory], { stdio: ['ignore', 'pipe', 'inherit'] });
    let output = '';
    child.stdout.on('data', (chunk: Buffer) => {
      output += chunk.toString();
      if (output.includes('served at')) {
        child.once('exit', () => resolve());
        child.kill('SIGTERM');
      }
    });
    child.on('exit', (code) => (output.includes('served at') ? undefined : reject(new Error(`the host exited with ${code} before printing its address`))));
  });
}

export const cases = [
  benchCase({
    name: 'cli-plan-wall',
    description: 'a whole `tallyline plan --model passfail ... --json` process of the compiled CLI, start to exit (NIST §6.2.6 example plan)',
    setup: () => buildIfStale(['main']),
    run: () => {
      const outcome = spawnSync(process.execPath, [join(repoRoot, 'build', 'main', 'cli.js'), 'plan', '--model', 'passfail', '--p0', '0.01', '--p1', '0.10', '--alpha', '0.05', '--beta', '0.10', '--json'], { stdio: ['ignore', 'pipe', 'inherit'] });
      if (outcome.status !== 0) throw new Error(`tallyline plan exited with ${outcome.status}`);
      return outcome.stdout.length;
    },
    repeat: 11,
    warmup: 1,
  }),
  benchCase({
    name: 'host-start',
    description: 'the compiled browser host from process start until it prints its address (renderer built beforehand)',
    setup: () => {
      buildIfStale(['main', 'renderer']);
      return join(repoRoot, 'build', 'bench-host-data');
    },
    run: (dataDirectory) => hostStartsOnce(dataDirectory),
    repeat: 11,
    warmup: 1,
  }),
];
