/**
 * The thin Electron shell: one hardened window showing the renderer from our own protocol,
 * and the channel contract on IPC. Everything else is plain Node code shared with the browser host.
 * Started with a command (`tallyline plan ...`), the installed app runs the command line instead
 * and exits with its code, opening no window.
 */
import { app, BrowserWindow, ipcMain, Menu, protocol, session, shell } from 'electron';
import { mkdtempSync, rmSync } from 'node:fs';
import { homedir, tmpdir } from 'node:os';
import { join } from 'node:path';
import { createDispatcher } from '../api/dispatcher.js';
import { createHandlers } from '../api/handlers/index.js';
import { appRoot, rendererRoot } from '../appPaths.js';
import { isCommandLine, runCommandLine } from '../cli/commandLine.js';
import { createRunService, type RunService } from '../inspection/index.js';
import { resolveDataDirectory } from '../store/dataDirectory.js';
import { appOrigin, appScheme, isAllowedExternalUrl, isAppUrl, serveAppRequest } from './appProtocol.js';
import { registerIpcChannels } from './ipcAdapter.js';
import { buildMenuTemplate } from './menu.js';
import { registerOpenRecordPdf } from './openRecordPdf.js';

let started = false;
let closedForQuit = false;
let runService: RunService | null = null;
let printFolder: string | null = null;

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
  app.whenReady().then(start, (error: unknown) => {
    console.error(error);
    app.exit(1);
  });
  // macOS keeps an app running without windows; its Dock icon opens a new one (activate).
  app.on('window-all-closed', () => {
    if (process.platform !== 'darwin') app.quit();
  });
  app.on('activate', () => {
    if (started && BrowserWindow.getAllWindows().length === 0) openWindow();
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

function start(): void {
  const dataDirectory = resolveDataDirectory({ argv: process.argv, env: process.env, platform: process.platform, home: homedir() });
  protocol.handle(appScheme, (request) => serveAppRequest(rendererRoot, request.url));
  runService = createRunService({ dataDirectory });
  registerIpcChannels(ipcMain, createDispatcher(createHandlers({ dataDirectory, runService })), isAppUrl);
  // Records opened for printing go to a private folder of this launch: mkdtemp makes it 0700 with an unguessable name.
  printFolder = mkdtempSync(join(tmpdir(), 'tallyline-records-'));
  registerOpenRecordPdf(ipcMain, { folder: printFolder, openPath: (path) => shell.openPath(path), isTrustedUrl: isAppUrl });
  // The app asks for no device, notification or other permission: every request is denied.
  session.defaultSession.setPermissionRequestHandler((_webContents, _permission, callback) => callback(false));
  session.defaultSession.setPermissionCheckHandler(() => false);
  Menu.setApplicationMenu(Menu.buildFromTemplate(buildMenuTemplate(process.platform)));
  started = true;
  openWindow();
}

function openWindow(): void {
  const window = new BrowserWindow({
    width: 1280,
    height: 800,
    minWidth: 960,
    minHeight: 640,
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
  window.once('ready-to-show', () => window.show());
  void window.loadURL(`${appOrigin}/index.html`);
}
