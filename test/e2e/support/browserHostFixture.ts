import { test as base } from '@playwright/test';
import { spawn, type ChildProcess } from 'node:child_process';
import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { seedDemo } from '../../../src-main/demo/index.js';

const appRoot = fileURLToPath(new URL('../../..', import.meta.url));
/** The compiled browser host, as `npm run serve` runs it (built by playwrightGlobalSetup.ts). */
const compiledHost = join(appRoot, 'build', 'main', 'host', 'serve.js');

export interface RunningHost {
  /** The address the host printed, with its token. */
  url: string;
  /** The same address without the token. */
  origin: string;
  token: string;
  dataDirectory: string;
}

type HostData = 'empty' | 'demo';

/** Starts the real browser host (compiled `host/serve.js`) on a free port with the given data folder. */
export async function startHost(dataDirectory: string): Promise<{ host: RunningHost; process: ChildProcess }> {
  const child = spawn(process.execPath, [compiledHost, '--port', '0', '--data-dir', dataDirectory], {
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

interface OwnedHost {
  host: RunningHost;
  stop(): Promise<void>;
}

/** A host on a fresh data folder (filled with the invented demo for 'demo'), and how to stop it and remove the folder. */
async function startOwnedHost(hostData: HostData): Promise<OwnedHost> {
  const dataDirectory = await mkdtemp(join(tmpdir(), 'tallyline-e2e-'));
  if (hostData === 'demo') await seedDemo(dataDirectory);
  const { host, process: child } = await startHost(dataDirectory);
  return {
    host,
    async stop() {
      if (child.exitCode === null) {
        const exited = new Promise((resolve) => child.once('exit', resolve));
        child.kill('SIGTERM');
        await exited;
      }
      await rm(dataDirectory, { recursive: true, force: true });
    },
  };
}

/**
 * The hosts shared by the tests of one file (per data kind). A worker runs files one after another,
 * so a host is stopped as soon as a test of another file asks for one, and the last at the end.
 */
class SharedHosts {
  private file: string | null = null;
  private readonly hosts = new Map<HostData, Promise<OwnedHost>>();

  async forFile(file: string, hostData: HostData): Promise<RunningHost> {
    if (file !== this.file) {
      await this.stopAll();
      this.file = file;
    }
    let owned = this.hosts.get(hostData);
    if (owned === undefined) {
      owned = startOwnedHost(hostData);
      this.hosts.set(hostData, owned);
    }
    return (await owned).host;
  }

  async stopAll(): Promise<void> {
    const running = [...this.hosts.values()];
    this.hosts.clear();
    await Promise.all(running.map(async (owned) => (await owned).stop()));
  }
}

/**
 * A Playwright test with the real browser host. By default each test gets a fresh host and data
 * folder; `test.use({ hostSharing: 'file' })` lets the tests of a file (or describe block) that
 * only read share one host, which saves a start per test. `test.use({ hostData: 'demo' })` fills
 * the folder with the invented demo first.
 */
export const test = base.extend<{ host: RunningHost; hostData: HostData; hostSharing: 'none' | 'file' }, { sharedHosts: SharedHosts }>({
  hostData: ['empty', { option: true }],
  hostSharing: ['none', { option: true }],
  sharedHosts: [
    async ({}, use) => {
      const shared = new SharedHosts();
      await use(shared);
      await shared.stopAll();
    },
    { scope: 'worker' },
  ],
  host: async ({ hostData, hostSharing, sharedHosts }, use, testInfo) => {
    if (hostSharing === 'file') {
      await use(await sharedHosts.forFile(testInfo.file, hostData));
      return;
    }
    const owned = await startOwnedHost(hostData);
    await use(owned.host);
    await owned.stop();
  },
});

export { expect } from '@playwright/test';
