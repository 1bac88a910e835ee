import { test as base } from '@playwright/test';
import { spawn, type ChildProcess } from 'node:child_process';
import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { seedDemo } from '../../../src-main/demo/index.js';

const appRoot = fileURLToPath(new URL('../../..', import.meta.url));

export interface RunningHost {
  /** The address the host printed, with its token. */
  url: string;
  /** The same address without the token. */
  origin: string;
  token: string;
  dataDirectory: string;
}

/** Starts the real browser host (`src-main/host/serve.ts`) on a free port with an empty data folder. */
export async function startHost(dataDirectory: string): Promise<{ host: RunningHost; process: ChildProcess }> {
  const child = spawn(process.execPath, ['--import', 'tsx', 'src-main/host/serve.ts', '--port', '0', '--data-dir', dataDirectory], {
    cwd: appRoot,
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  const url = await new Promise<string>((resolve, reject) => {
    let output = '';
    const timer = setTimeout(() => reject(new Error(`The browser host did not start in 30 s:\n${output}`)), 30_000);
    const collect = (chunk: Buffer) => {
      output += chunk.toString();
      const match = /served at (http:\/\/\S+)/.exec(output);
      if (match) {
        clearTimeout(timer);
        resolve(match[1]);
      }
    };
    child.stdout!.on('data', collect);
    child.stderr!.on('data', collect);
    child.on('exit', (code) => reject(new Error(`The browser host exited with ${code}:\n${output}`)));
  });
  const parsed = new URL(url);
  const token = /token=([0-9a-f]+)/.exec(parsed.hash)![1];
  return { host: { url, origin: parsed.origin, token, dataDirectory }, process: child };
}

/** A Playwright test with a fresh browser host per test; `test.use({ hostData: 'demo' })` fills it with the invented demo first. */
export const test = base.extend<{ host: RunningHost; hostData: 'empty' | 'demo' }>({
  hostData: ['empty', { option: true }],
  host: async ({ hostData }, use) => {
    const dataDirectory = await mkdtemp(join(tmpdir(), 'tallyline-e2e-'));
    if (hostData === 'demo') await seedDemo(dataDirectory);
    const { host, process: child } = await startHost(dataDirectory);
    await use(host);
    child.kill('SIGTERM');
    await rm(dataDirectory, { recursive: true, force: true });
  },
});

export { expect } from '@playwright/test';
