/**
 * The thin Electron shell: one hardened window showing the renderer from our own protocol,
 * and the channel contract on IPC. Everything else is plain Node code shared with the browser host.
 * Started with a command (`tallyline plan ...`), the installed app runs the command line instead
 * and exits with its code, opening no window.
 */
import { app, BrowserWindow, dialog, ipcMain, Menu, nativeTheme, protocol, screen, session, shell } from 'electron';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { homedir, tmpdir } from 'node:os';
import { join } from 'node:path';
import { createDispatcher, type Dispatch } from '../api/dispatcher.js';
import { createHandlers } from '../api/handlers/index.js';
import { appRoot, rendererRoot } from '../appPaths.js';
import { isCommandLine, runCommandLine } from '../cli/commandLine.js';
import { createRunService, type RunService } from '../inspection/index.js';
import { resolveDataDirectory } from '../store/dataDirectory.js';
import { SettingsRepository, type Settings } from '../store/settings.js';
import { aboutMessage } from './about.js';
import { appOrigin, appScheme, isAllowedExternalUrl, isAppUrl, serveAppRequest } from './appProtocol.js';
import { registerIpcChannels } from './ipcAdapter.js';
import { contextMenuTemplate } from './contextMenu.js';
import { buildMenuTemplate } from './menu.js';
import { registerOpenRecordPdf } from './openRecordPdf.js';
import { saveDialogFor } from './saveDialogs.js';
import { fitWindowToDisplays, MINIMUM_WINDOW_SIZE, readWindowState, windowStateFile, writeWindowStateNow } from './windowState.js';

/** The window's background before the renderer paints: the renderer's --surface (src-renderer/src/styles/base.css). */
const windowBackground = { light: '#f4f5f2', dark: '#141816' } as const;

let started = false;
let closedForQuit = false;
let runService: RunService | null = null;
let printFolder: string | null = null;
let dataDirectory = '';

/** The user's arguments: after the executable in an installed app, after `electron <app folder>` in development. */
const userArguments = process.argv.slice(process.defaultApp ? 2 : 1);

if (isCommandLine(userArguments)) {
  runCommandLine(userArguments).then(
    (code) => app.exit(code),
    (error: unknown) => {
      console.error(error);
      app.exit(1);
    },
  );
} else {
  startDesktop();
}

function startDesktop(): void {
  protocol.registerSchemesAsPrivileged([{ scheme: appScheme, privileges: { standard: true, secure: true, supportFetchAPI: true } }]);
  if (!app.requestSingleInstanceLock()) {
    app.quit();
    return;
  }
  app.on('second-instance', () => {
    const [window] = BrowserWindow.getAllWindows();
    if (window) {
      if (window.isMinimized()) window.restore();
      window.focus();
    }
  });
  app
    .whenReady()
    .then(start)
    .catch((error: unknown) => {
      console.error(error);
      app.exit(1);
    });
  // macOS keeps an app running without windows; its Dock icon opens a new one (activate).
  app.on('window-all-closed', () => {
    if (process.platform !== 'darwin') app.quit();
  });
  app.on('activate', () => {
    if (started && BrowserWindow.getAllWindows().length === 0) void openWindow();
  });
  app.on('before-quit', (event) => {
    if (closedForQuit) return;
    // Close the run journals (and their lock files) and remove the private print folder first.
    event.preventDefault();
    void closeForQuit().finally(() => {
      closedForQuit = true;
      app.quit();
    });
  });
}

async function closeForQuit(): Promise<void> {
  try {
    await runService?.close();
  } catch (error) {
    console.error(error);
  }
  if (printFolder !== null) rmSync(printFolder, { recursive: true, force: true });
}

async function start(): Promise<void> {
  dataDirectory = resolveDataDirectory({ argv: process.argv, env: process.env, platform: process.platform, home: homedir() });
  protocol.handle(appScheme, (request) => serveAppRequest(rendererRoot, request.url));
  runService = createRunService({ dataDirectory });
  registerIpcChannels(ipcMain, followThemeSetting(createDispatcher(createHandlers({ dataDirectory, runService }))), isAppUrl);
  // Records opened for printing go to a private folder of this launch: mkdtemp makes it 0700 with an unguessable name.
  printFolder = mkdtempSync(join(tmpdir(), 'tallyline-records-'));
  registerOpenRecordPdf(ipcMain, { folder: printFolder, openPath: (path) => shell.openPath(path), isTrustedUrl: isAppUrl });
  // The app asks for no device, notification or other permission: every request is denied.
  session.defaultSession.setPermissionRequestHandler((_webContents, _permission, callback) => callback(false));
  session.defaultSession.setPermissionCheckHandler(() => false);
  // Files the window offers as downloads (plan file, CSV, decision record, backup) get the native Save dialog.
  session.defaultSession.on('will-download', (_event, item) => item.setSaveDialogOptions(saveDialogFor(item.getFilename(), app.getPath('documents'))));
  Menu.setApplicationMenu(Menu.buildFromTemplate(buildMenuTemplate(process.platform, { showAbout })));
  app.setAboutPanelOptions({ applicationName: app.getName(), applicationVersion: app.getVersion(), credits: aboutText().detail });
  nativeTheme.on('updated', () => {
    for (const window of BrowserWindow.getAllWindows()) window.setBackgroundColor(currentBackground());
  });
  applyTheme(await readThemeSetting());
  started = true;
  await openWindow();
}

/** The `theme` setting (system, light, dark) decides Electron's theme source; the renderer follows it through prefers-color-scheme. */
async function readThemeSetting(): Promise<Settings['theme']> {
  try {
    return (await new SettingsRepository(dataDirectory).get()).theme;
  } catch (error) {
    console.error(`Theme setting not read, following the system: ${(error as Error).message}`);
    return 'system';
  }
}

function applyTheme(theme: Settings['theme']): void {
  if (nativeTheme.themeSource !== theme) nativeTheme.themeSource = theme;
}

function currentBackground(): string {
  return nativeTheme.shouldUseDarkColors ? windowBackground.dark : windowBackground.light;
}

/** A changed `theme` setting takes effect in the window at once. */
function followThemeSetting(dispatch: Dispatch): Dispatch {
  return async (channel, payload) => {
    const result = await dispatch(channel, payload);
    if (channel === 'settings.update' && result.ok) applyTheme((result.value as Settings).theme);
    return result;
  };
}

function aboutText(): { title: string; message: string; detail: string } {
  let licence: string | undefined;
  try {
    licence = (JSON.parse(readFileSync(join(appRoot, 'package.json'), 'utf8')) as { license?: string }).license;
  } catch {
    licence = undefined;
  }
  return aboutMessage({ productName: app.getName(), version: app.getVersion(), dataDirectory, licence, electronVersion: process.versions.electron });
}

function showAbout(): void {
  const [window] = BrowserWindow.getAllWindows();
  const options = { type: 'info' as const, buttons: ['OK'], ...aboutText() };
  void (window ? dialog.showMessageBox(window, options) : dialog.showMessageBox(options));
}

async function openWindow(): Promise<void> {
  const stateFile = windowStateFile(app.getPath('userData'));
  const remembered = await readWindowState(stateFile, (line) => console.error(line));
  const bounds = fitWindowToDisplays(remembered, screen.getAllDisplays().map((display) => display.workArea));
  const window = new BrowserWindow({
    x: bounds.x,
    y: bounds.y,
    width: bounds.width,
    height: bounds.height,
    minWidth: MINIMUM_WINDOW_SIZE.width,
    minHeight: MINIMUM_WINDOW_SIZE.height,
    backgroundColor: currentBackground(),
    title: 'Tallyline',
    icon: join(appRoot, 'assets', 'icon.png'),
    show: false,
    webPreferences: {
      preload: join(appRoot, 'build', 'main', 'electron', 'preload.cjs'),
      contextIsolation: true,
      sandbox: true,
      nodeIntegration: false,
      webSecurity: true,
      spellcheck: false,
    },
  });
  // Navigation, redirects and frame navigation may only stay inside the app protocol.
  for (const eventName of ['will-navigate', 'will-redirect', 'will-frame-navigate'] as const) {
    window.webContents.on(eventName as 'will-navigate', (event, url) => {
      if (!isAppUrl(url)) event.preventDefault();
    });
  }
  window.webContents.setWindowOpenHandler(({ url }) => {
    // Only addresses on the allow-list open in the user's browser; nothing opens a new app window.
    if (isAllowedExternalUrl(url)) void shell.openExternal(url);
    return { action: 'deny' };
  });
  window.webContents.on('context-menu', (_event, parameters) => {
    const template = contextMenuTemplate(parameters);
    if (template !== null) Menu.buildFromTemplate(template).popup({ window });
  });
  if (bounds.maximized) window.maximize();
  // Size and position are remembered when the window closes, in the desktop profile. Written at
  // once (a few bytes): on quit the process may end right after the window closes.
  window.on('close', () => {
    try {
      writeWindowStateNow(stateFile, window.getNormalBounds(), window.isMaximized());
    } catch (error) {
      console.error(`Window position not saved: ${(error as Error).message}`);
    }
  });
  window.once('ready-to-show', () => window.show());
  void window.loadURL(`${appOrigin}/index.html`);
}
