import { existsSync, mkdtempSync, readdirSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { runCli } from '../cli/runCli.js';
import { buildIfStale } from '../support/buildIfStale.js';
import { buildElectronStandIn, startWithStandIn, type StandInProcess, type StandInRecording } from '../support/electronStandInDriver.js';

// The built main process (build/main/electron/main.js), run under plain Node with a recording
// stand-in for `electron`: what an installed app does on start-up, short of drawing the window.
let registerFile = '';
let dataFolder = '';
let app: StandInProcess;
let startup: StandInRecording;
let channelNames: readonly string[] = [];

beforeAll(async () => {
  buildIfStale(['main', 'renderer']);
  registerFile = await buildElectronStandIn();
  ({ channelNames } = await import('../../src-main/api/contract.js'));
  dataFolder = mkdtempSync(join(tmpdir(), 'tallyline-stand-in-data-'));
  app = startWithStandIn({ registerFile, env: { TALLYLINE_DATA: dataFolder, ELECTRON_STAND_IN_USER_DATA: mkdtempSync(join(tmpdir(), 'tallyline-stand-in-profile-')) } });
  await waitFor(async () => (await app.snapshot()).windows.length === 1);
  startup = await app.snapshot();
});
afterAll(() => app?.stop());

async function waitFor(condition: () => Promise<boolean>, timeoutMs = 15_000): Promise<void> {
  const until = Date.now() + timeoutMs;
  while (!(await condition())) {
    if (Date.now() > until) throw new Error('timed out waiting for the stand-in');
    await new Promise((resolve) => setTimeout(resolve, 50));
  }
}

describe('the built main process under the electron stand-in', () => {
  it('registers the tallyline scheme as privileged before ready and serves the built renderer from it', async () => {
    expect(startup.privilegedSchemes).toEqual([{ scheme: 'tallyline', privileges: { standard: true, secure: true, supportFetchAPI: true } }]);
    expect(startup.handledSchemes).toEqual(['tallyline']);
    const page = await app.send<{ status: number; contentType: string; start: string }>({ type: 'fetch', url: 'tallyline://app/index.html' });
    expect(page.status).toBe(200);
    expect(page.contentType).toMatch(/^text\/html/);
    expect(page.start).toMatch(/<!doctype html>/i);
    const outside = await app.send<{ status: number }>({ type: 'fetch', url: 'tallyline://app/../../package.json' });
    expect(outside.status).not.toBe(200);
  });

  it('asks for the single-instance lock', () => {
    expect(startup.singleInstanceLockRequested).toBe(true);
    expect(startup.appListeners).toContain('second-instance');
  });

  it('registers one IPC handler per channel of the contract, and the desktop-only ones', () => {
    expect(channelNames.length).toBeGreaterThanOrEqual(30);
    const contract = startup.ipcHandleChannels.filter((channel) => channel.startsWith('tallyline:')).sort();
    expect(contract).toEqual(channelNames.map((name) => `tallyline:${name}`).sort());
    expect(startup.ipcHandleChannels).toContain('tallyline-desktop:open-record-pdf');
    expect(startup.ipcOnChannels).toEqual(['tallyline:list-channels']);
  });

  it('sets an application menu with the File, Edit, View and Window menus', () => {
    const top = startup.applicationMenu!.map((item) => item.label ?? item.role);
    expect(top).toEqual(expect.arrayContaining(['fileMenu', 'editMenu', 'View', 'windowMenu']));
  });

  it('opens one window with context isolation, the sandbox, no Node integration and the built preload', () => {
    expect(startup.windows).toHaveLength(1);
    const preferences = startup.windows[0]!.options.webPreferences;
    expect(preferences).toMatchObject({ contextIsolation: true, sandbox: true, nodeIntegration: false, webSecurity: true });
    expect(existsSync(preferences.preload)).toBe(true);
    expect(startup.windows[0]!.loadedUrls).toEqual(['tallyline://app/index.html']);
    expect(startup.windows[0]!.webContentsListeners).toEqual(expect.arrayContaining(['will-navigate', 'will-redirect', 'will-frame-navigate']));
    expect(startup.windows[0]!.hasWindowOpenHandler).toBe(true);
    expect(startup.permissionRequestHandler && startup.permissionCheckHandler).toBe(true);
  });

  it('the preload exposes one method per channel, and a call through it is answered by the main side', async () => {
    expect([...startup.exposedInMainWorld.tallyline!].sort()).toEqual([...channelNames].sort());
    // Wald 1947 §5.4 limits for p0 0.01, p1 0.10, α 0.05, β 0.10: a = ln(0.9/0.05) ≈ 2.890 (computed with Math.log).
    const answer = await app.send<{ ok: boolean; value: { boundaries: Record<string, number> } }>({
      type: 'bridge',
      name: 'tallyline',
      method: 'plan.limits',
      args: [{ model: 'passfail', p0: 0.01, p1: 0.1, alpha: 0.05, beta: 0.1 }],
    });
    expect(answer.ok).toBe(true);
    expect(JSON.stringify(answer.value)).toContain('2.89');
  });

  it('refuses a channel request from a frame that is not the app', async () => {
    const answer = await app.send<{ ok: boolean; message: string }>({ type: 'invoke', channel: 'tallyline:plan.list', payload: null, frameUrl: 'https://attacker.example/' });
    expect(answer).toMatchObject({ ok: false, message: expect.stringMatching(/did not come from the Tallyline window/) });
  });

  it('on quit, closes the run service (its lock file goes) before the process ends', async () => {
    const started = await runCli(['run', 'start', '--model', 'passfail', '--p0', '0.01', '--p1', '0.1', '--alpha', '0.05', '--beta', '0.1', '--source', 'Stand-in Supplier', '--lot', 'L-1', '--data-dir', dataFolder, '--json']);
    expect(started.code).toBe(0);
    const { run } = JSON.parse(started.stdout) as { run: string };
    const step = await app.send<{ ok: boolean }>({ type: 'bridge', name: 'tallyline', method: 'inspection.record', args: [{ runId: run, result: 'pass' }] });
    expect(step.ok).toBe(true);
    const runsFolder = join(dataFolder, 'runs');
    expect(readdirSync(runsFolder)).toContain(`${run}.lock`);
    await app.send({ type: 'quit' });
    const ended = await app.exited;
    expect(ended.code).toBe(0);
    expect(ended.recording!.exitCode).toBe(0);
    // The first quit is held back by before-quit until the journals are closed, then quits again.
    expect(ended.recording!.quitRequests).toBe(2);
    expect(readdirSync(runsFolder)).not.toContain(`${run}.lock`);
  });
});
