import { mkdirSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { buildIfStale } from '../support/buildIfStale.js';
import { buildElectronStandIn, startWithStandIn, type StandInProcess } from '../support/electronStandInDriver.js';

// Desktop conventions of the built main process, run under plain Node with the recording
// electron stand-in (test/support/electronStandIn.ts).
let registerFile = '';
const running: StandInProcess[] = [];
/** One launch shared by the tests that only look at it (each start costs a second or more). */
let shared: { app: StandInProcess; place: { data: string; profile: string } };

beforeAll(async () => {
  buildIfStale(['main']);
  registerFile = await buildElectronStandIn();
  const place = folders();
  shared = { app: await launch(place, {}, false), place };
});
afterEach(() => {
  for (const app of running.splice(0)) app.stop();
});
afterAll(() => shared?.app.stop());

function folders(): { data: string; profile: string } {
  return { data: mkdtempSync(join(tmpdir(), 'tallyline-manners-data-')), profile: mkdtempSync(join(tmpdir(), 'tallyline-manners-profile-')) };
}

async function launch(place: { data: string; profile: string }, env: Record<string, string> = {}, stopAfterTest = true): Promise<StandInProcess> {
  const app = startWithStandIn({ registerFile, env: { TALLYLINE_DATA: place.data, ELECTRON_STAND_IN_USER_DATA: place.profile, ...env } });
  if (stopAfterTest) running.push(app);
  const until = Date.now() + 15_000;
  while ((await app.snapshot()).windows.length === 0) {
    if (Date.now() > until) throw new Error('no window opened');
    await new Promise((resolve) => setTimeout(resolve, 50));
  }
  return app;
}

const version = JSON.parse(readFileSync(new URL('../../package.json', import.meta.url), 'utf8')).version as string;

describe('the Help menu on Windows and Linux', () => {
  it.runIf(process.platform !== 'darwin')('has About Tallyline, which shows the version, the data folder and the licence', async () => {
    const { app, place } = shared;
    const menu = (await app.snapshot()).applicationMenu!;
    expect(menu.at(-1)).toMatchObject({ role: 'help', submenu: [{ label: 'About Tallyline', clickable: true }] });
    await app.send({ type: 'menu-click', path: ['help', 'About Tallyline'] });
    const about = (await app.snapshot()).messageBoxes.at(-1);
    expect(about).toMatchObject({ title: 'About Tallyline', message: `Tallyline ${version}`, parentWindow: true });
    expect(about!.detail).toContain(`Data folder: ${place.data}`);
    expect(about!.detail).toMatch(/^Licence: /m);
  });
});

describe('the context menu', () => {
  it('offers cut, copy, paste and select all in a text field, each enabled only when it can act', async () => {
    const { app } = shared;
    const editFlags = { canCut: false, canCopy: false, canPaste: true, canSelectAll: true };
    await app.send({ type: 'web-contents-event', window: 0, event: 'context-menu', args: [{ isEditable: true, selectionText: '', editFlags }] });
    const menu = (await app.snapshot()).poppedUpMenus.at(-1);
    expect(menu!.filter((item) => item.role).map((item) => [item.role, item.enabled])).toEqual([
      ['cut', false],
      ['copy', false],
      ['paste', true],
      ['selectAll', true],
    ]);
  });

  it('offers copy on selected text outside a field, and nothing on a plain click', async () => {
    const { app } = shared;
    const editFlags = { canCut: false, canCopy: true, canPaste: false, canSelectAll: true };
    const before = (await app.snapshot()).poppedUpMenus.length;
    await app.send({ type: 'web-contents-event', window: 0, event: 'context-menu', args: [{ isEditable: false, selectionText: '', editFlags }] });
    expect((await app.snapshot()).poppedUpMenus).toHaveLength(before);
    await app.send({ type: 'web-contents-event', window: 0, event: 'context-menu', args: [{ isEditable: false, selectionText: 'accept at 42', editFlags }] });
    expect((await app.snapshot()).poppedUpMenus.slice(before)).toEqual([[{ role: 'copy', enabled: true, clickable: false }]]);
  });
});

describe('the window size and position', () => {
  it('are remembered when the window closes and used at the next start', async () => {
    const place = folders();
    const first = await launch(place);
    // First start: the default size, centred on the (only) 1920 x 1040 work area.
    expect((await first.snapshot()).windows[0]!.options).toMatchObject({ x: 320, y: 120, width: 1280, height: 800 });
    await first.send({ type: 'window-set-bounds', window: 0, bounds: { x: 40, y: 30, width: 1500, height: 900 } });
    await first.send({ type: 'quit' });
    expect((await first.exited).code).toBe(0);
    const saved = JSON.parse(readFileSync(join(place.profile, 'window-state.json'), 'utf8'));
    expect(saved).toEqual({ format: 'tallyline.window/1', x: 40, y: 30, width: 1500, height: 900, maximized: false });
    const second = await launch(place);
    expect((await second.snapshot()).windows[0]!.options).toMatchObject({ x: 40, y: 30, width: 1500, height: 900 });
  });

  it('are moved onto a display that exists when the remembered one is gone', async () => {
    const place = folders();
    const state = { format: 'tallyline.window/1', x: 2100, y: 50, width: 1400, height: 900, maximized: true };
    writeFileSync(join(place.profile, 'window-state.json'), JSON.stringify(state));
    const displays = JSON.stringify([{ x: 0, y: 0, width: 1366, height: 728 }]);
    const app = await launch(place, { ELECTRON_STAND_IN_DISPLAYS: displays });
    const window = (await app.snapshot()).windows[0]!;
    // Nowhere on the laptop's screen: default size clamped to the work area, centred, still maximized as left.
    expect(window.options).toMatchObject({ x: 43, y: 0, width: 1280, height: 728 });
    expect(window.maximized).toBe(true);
  });

  it('are ignored, with one line saying why, when the saved state is not valid', async () => {
    const place = folders();
    writeFileSync(join(place.profile, 'window-state.json'), JSON.stringify({ format: 'tallyline.window/1', x: 0, y: 0, width: 'wide', height: 900, maximized: false }));
    const app = await launch(place);
    expect((await app.snapshot()).windows[0]!.options).toMatchObject({ x: 320, y: 120, width: 1280, height: 800 });
    app.stop();
    const { stderr } = await app.exited;
    expect(stderr).toMatch(/^Window position not restored: .*window-state\.json: field "width"/m);
  });
});

describe('the theme', () => {
  it('follows the theme setting at start and when it is changed, and paints the window to match', async () => {
    const place = folders();
    mkdirSync(place.data, { recursive: true });
    writeFileSync(join(place.data, 'settings.json'), JSON.stringify({ format: 'tallyline.settings/1', organisationName: '', site: '', confidenceLevel: 0.9, theme: 'dark' }));
    const app = await launch(place);
    let recording = await app.snapshot();
    expect(recording.themeSources).toEqual(['dark']);
    expect(recording.windows[0]!.options.backgroundColor).toBe('#141816');
    const answer = await app.send<{ ok: boolean }>({ type: 'bridge', name: 'tallyline', method: 'settings.update', args: [{ theme: 'light' }] });
    expect(answer.ok).toBe(true);
    recording = await app.snapshot();
    expect(recording.themeSources).toEqual(['dark', 'light']);
    expect(recording.windows[0]!.backgroundColors.at(-1)).toBe('#f4f5f2');
  });

  it("with the 'system' setting follows the operating system when it switches between light and dark", async () => {
    const app = await launch(folders());
    expect((await app.snapshot()).windows[0]!.options.backgroundColor).toBe('#f4f5f2');
    await app.send({ type: 'os-theme', dark: true });
    expect((await app.snapshot()).windows[0]!.backgroundColors.at(-1)).toBe('#141816');
    await app.send({ type: 'os-theme', dark: false });
    expect((await app.snapshot()).windows[0]!.backgroundColors.at(-1)).toBe('#f4f5f2');
  });

  it('refuses a theme other than system, light or dark', async () => {
    const { app } = shared;
    const answer = await app.send({ type: 'bridge', name: 'tallyline', method: 'settings.update', args: [{ theme: 'sepia' }] });
    expect(answer).toMatchObject({ ok: false, code: 'invalid-payload', field: 'theme' });
  });
});

describe('files the window offers', () => {
  it('are saved through the native Save dialog with a title and filter for plan files, CSV, records and backups', async () => {
    const { app } = shared;
    const cases = [
      ['incoming-resin-v2.tallyline-plan.json', 'Save plan file', 'json'],
      ['run-7-entries.csv', 'Save CSV', 'csv'],
      ['decision-record-run-7.pdf', 'Save decision record', 'pdf'],
      ['tallyline-backup-2026-12-05.tallyline-archive', 'Save backup', 'tallyline-archive'],
    ] as const;
    for (const [fileName, title, extension] of cases) {
      const { saveDialogOptions } = await app.send<{ saveDialogOptions: { title: string; defaultPath: string; filters: Array<{ extensions: string[] }> } }>({ type: 'download', fileName });
      expect(saveDialogOptions.title).toBe(title);
      expect(saveDialogOptions.defaultPath).toBe(join(tmpdir(), 'documents', fileName));
      expect(saveDialogOptions.filters[0]!.extensions).toEqual([extension]);
    }
  });
});
