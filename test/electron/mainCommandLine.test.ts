import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';

// The installed app's executable is the Electron binary: started with a command it must run the
// command line and exit, never open a window. Checked against a recording fake of `electron`.
const recorded = vi.hoisted(() => ({ windows: 0, exitCodes: [] as number[], singleInstanceAsked: false, stdout: '' }));

vi.mock('electron', () => {
  class BrowserWindow {
    static getAllWindows = () => [];
    constructor() {
      recorded.windows += 1;
    }
  }
  const electron = {
    app: {
      requestSingleInstanceLock: () => ((recorded.singleInstanceAsked = true), true),
      on: () => undefined,
      whenReady: () => Promise.resolve(),
      quit: () => undefined,
      exit: (code: number) => recorded.exitCodes.push(code),
    },
    BrowserWindow,
    ipcMain: { handle: () => undefined, on: () => undefined },
    Menu: { setApplicationMenu: () => undefined, buildFromTemplate: (template: unknown) => template },
    protocol: { registerSchemesAsPrivileged: () => undefined, handle: () => undefined },
    session: { defaultSession: { setPermissionRequestHandler: () => undefined, setPermissionCheckHandler: () => undefined } },
    shell: { openExternal: () => undefined, openPath: async () => '' },
  };
  return { ...electron, default: electron };
});

const savedArgv = process.argv;
beforeAll(async () => {
  // As the packaged executable sees it: `tallyline plan --help` (no app folder argument).
  process.argv = ['/opt/Tallyline/tallyline', 'plan', '--help'];
  const spy = vi.spyOn(process.stdout, 'write').mockImplementation((chunk: string | Uint8Array) => ((recorded.stdout += String(chunk)), true));
  await import('../../src-main/electron/main.js');
  await vi.waitFor(() => expect(recorded.exitCodes).toHaveLength(1));
  spy.mockRestore();
});
afterAll(() => {
  process.argv = savedArgv;
});

describe('the installed app started with a command', () => {
  it('prints the command help and exits 0 without a window or the single-instance lock', () => {
    expect(recorded.stdout).toMatch(/^Usage: tallyline plan --model passfail/);
    expect(recorded.exitCodes).toEqual([0]);
    expect(recorded.windows).toBe(0);
    expect(recorded.singleInstanceAsked).toBe(false);
  });
});
