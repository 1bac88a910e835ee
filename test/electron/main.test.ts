import { beforeAll, describe, expect, it, vi } from 'vitest';

// Electron's runtime is not loaded in tests (importing it would try a download); the shell is
// checked against a recording fake of the few APIs it uses.
const recorded = vi.hoisted(() => ({
  windowOptions: [] as Array<Record<string, any>>,
  webContentsListeners: new Map<string, (...args: any[]) => void>(),
  windowOpenHandler: null as null | ((details: { url: string }) => { action: string }),
  handledProtocols: [] as string[],
  invokeChannels: [] as string[],
  loadedUrls: [] as string[],
  openedExternally: [] as string[],
  appListeners: new Map<string, (...args: any[]) => void>(),
  permissionRequestHandler: null as null | ((webContents: unknown, permission: string, callback: (granted: boolean) => void) => void),
  permissionCheckHandler: null as null | ((...args: unknown[]) => boolean),
  quitCalls: 0,
}));

vi.mock('electron', () => {
  class BrowserWindow {
    static getAllWindows = () => [];
    webContents = {
      on: (event: string, listener: (...args: any[]) => void) => recorded.webContentsListeners.set(event, listener),
      setWindowOpenHandler: (handler: (details: { url: string }) => { action: string }) => (recorded.windowOpenHandler = handler),
    };
    constructor(options: Record<string, any>) {
      recorded.windowOptions.push(options);
    }
    once() {}
    on() {}
    maximize() {}
    loadURL(url: string) {
      recorded.loadedUrls.push(url);
      return Promise.resolve();
    }
  }
  const electron = {
    app: {
      requestSingleInstanceLock: () => true,
      getPath: () => '/tmp/tallyline-electron-shell-test-profile',
      getName: () => 'Tallyline',
      getVersion: () => '0.0.0',
      setAboutPanelOptions: () => undefined,
      on: (event: string, listener: (...args: any[]) => void) => recorded.appListeners.set(event, listener),
      whenReady: () => Promise.resolve(),
      quit: () => (recorded.quitCalls += 1),
      exit: vi.fn(),
    },
    session: {
      defaultSession: {
        setPermissionRequestHandler: (handler: any) => (recorded.permissionRequestHandler = handler),
        setPermissionCheckHandler: (handler: any) => (recorded.permissionCheckHandler = handler),
        on: () => undefined,
      },
    },
    BrowserWindow,
    dialog: { showMessageBox: async () => ({ response: 0 }) },
    nativeTheme: { themeSource: 'system', shouldUseDarkColors: false, on: () => undefined },
    screen: { getAllDisplays: () => [{ workArea: { x: 0, y: 0, width: 1920, height: 1040 } }] },
    ipcMain: { handle: (channel: string) => recorded.invokeChannels.push(channel), on: () => undefined },
    Menu: { setApplicationMenu: () => undefined, buildFromTemplate: (template: unknown) => template },
    protocol: { registerSchemesAsPrivileged: () => undefined, handle: (scheme: string) => recorded.handledProtocols.push(scheme) },
    shell: { openExternal: (url: string) => recorded.openedExternally.push(url), openPath: async () => '' },
  };
  return { ...electron, default: electron };
});

beforeAll(async () => {
  process.env.TALLYLINE_DATA = '/tmp/tallyline-electron-shell-test';
  await import('../../src-main/electron/main.js');
  await vi.waitFor(() => expect(recorded.windowOptions).toHaveLength(1));
});

describe('the Electron shell', () => {
  it('opens one window with context isolation, the sandbox and no Node integration', () => {
    expect(recorded.windowOptions).toHaveLength(1);
    expect(recorded.windowOptions[0].webPreferences).toMatchObject({ contextIsolation: true, sandbox: true, nodeIntegration: false, webSecurity: true });
    expect(recorded.windowOptions[0].webPreferences.preload).toMatch(/preload\.cjs$/);
  });

  it('serves the renderer from its own protocol, not file://', () => {
    expect(recorded.handledProtocols).toEqual(['tallyline']);
    expect(recorded.loadedUrls).toEqual(['tallyline://app/index.html']);
  });

  it('blocks navigation away from the app', () => {
    const willNavigate = recorded.webContentsListeners.get('will-navigate')!;
    const away = { preventDefault: vi.fn() };
    willNavigate(away, 'https://attacker.example/');
    expect(away.preventDefault).toHaveBeenCalled();
    const inside = { preventDefault: vi.fn() };
    willNavigate(inside, 'tallyline://app/index.html');
    expect(inside.preventDefault).not.toHaveBeenCalled();
  });

  it('denies every new window and opens no address off the (empty) allow-list in the browser', () => {
    expect(recorded.windowOpenHandler!({ url: 'https://example.org/standard' })).toEqual({ action: 'deny' });
    expect(recorded.windowOpenHandler!({ url: 'tallyline://app/index.html' })).toEqual({ action: 'deny' });
    expect(recorded.windowOpenHandler!({ url: 'file:///etc/passwd' })).toEqual({ action: 'deny' });
    expect(recorded.openedExternally).toEqual([]);
  });

  it('blocks redirects and frame navigation away from the app', () => {
    for (const eventName of ['will-redirect', 'will-frame-navigate']) {
      const guard = recorded.webContentsListeners.get(eventName)!;
      const away = { preventDefault: vi.fn() };
      guard(away, 'https://attacker.example/');
      expect(away.preventDefault).toHaveBeenCalled();
      const inside = { preventDefault: vi.fn() };
      guard(inside, 'tallyline://app/index.html');
      expect(inside.preventDefault).not.toHaveBeenCalled();
    }
  });

  it('denies every permission request and check', () => {
    const answers: boolean[] = [];
    for (const permission of ['media', 'geolocation', 'notifications', 'clipboard-read']) recorded.permissionRequestHandler!(null, permission, (granted) => answers.push(granted));
    expect(answers).toEqual([false, false, false, false]);
    expect(recorded.permissionCheckHandler!(null, 'media')).toBe(false);
  });

  it('quits when the last window closes on Linux and Windows', () => {
    const before = recorded.quitCalls;
    recorded.appListeners.get('window-all-closed')!();
    expect(recorded.quitCalls).toBe(before + (process.platform === 'darwin' ? 0 : 1));
  });

  it('on quit, first closes the run journals and removes the private print folder, then quits', async () => {
    const { existsSync } = await import('node:fs');
    const printFolders = (await import('node:fs')).readdirSync((await import('node:os')).tmpdir()).filter((name) => name.startsWith('tallyline-records-'));
    expect(printFolders.length).toBeGreaterThan(0);
    const before = recorded.quitCalls;
    const event = { preventDefault: vi.fn() };
    recorded.appListeners.get('before-quit')!(event);
    expect(event.preventDefault).toHaveBeenCalled();
    await vi.waitFor(() => expect(recorded.quitCalls).toBe(before + 1));
    const { join } = await import('node:path');
    const { tmpdir } = await import('node:os');
    expect(printFolders.some((name) => !existsSync(join(tmpdir(), name)))).toBe(true);
    // The second before-quit (from that quit) goes through.
    const second = { preventDefault: vi.fn() };
    recorded.appListeners.get('before-quit')!(second);
    expect(second.preventDefault).not.toHaveBeenCalled();
  });

  it('serves every channel of the contract on IPC', async () => {
    const { channelNames } = await import('../../src-main/api/contract.js');
    const contractChannels = recorded.invokeChannels.filter((channel) => channel.startsWith('tallyline:'));
    expect(contractChannels.sort()).toEqual(channelNames.map((name) => `tallyline:${name}`).sort());
  });

  it('offers the desktop-only way to open a record PDF for printing', () => {
    expect(recorded.invokeChannels).toContain('tallyline-desktop:open-record-pdf');
  });
});
