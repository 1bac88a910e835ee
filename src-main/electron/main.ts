/**
 * The thin Electron shell: one hardened window showing the renderer from our own protocol,
 * and the channel contract on IPC. Everything else is plain Node code shared with the browser host.
 */
import { app, BrowserWindow, ipcMain, Menu, protocol, shell } from 'electron';
import { homedir, tmpdir } from 'node:os';
import { join } from 'node:path';
import { createDispatcher } from '../api/dispatcher.js';
import { createHandlers } from '../api/handlers/index.js';
import { appRoot, rendererRoot } from '../appPaths.js';
import { resolveDataDirectory } from '../store/dataDirectory.js';
import { appOrigin, appScheme, isAppUrl, serveAppRequest } from './appProtocol.js';
import { registerIpcChannels } from './ipcAdapter.js';
import { buildMenuTemplate } from './menu.js';
import { registerOpenRecordPdf } from './openRecordPdf.js';

protocol.registerSchemesAsPrivileged([{ scheme: appScheme, privileges: { standard: true, secure: true, supportFetchAPI: true } }]);

if (!app.requestSingleInstanceLock()) {
  app.quit();
} else {
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
  app.on('window-all-closed', () => app.quit());
}

function start(): void {
  const dataDirectory = resolveDataDirectory({ argv: process.argv, env: process.env, platform: process.platform, home: homedir() });
  protocol.handle(appScheme, (request) => serveAppRequest(rendererRoot, request.url));
  registerIpcChannels(ipcMain, createDispatcher(createHandlers({ dataDirectory })), isAppUrl);
  registerOpenRecordPdf(ipcMain, { folder: join(tmpdir(), 'Tallyline records'), openPath: (path) => shell.openPath(path), isTrustedUrl: isAppUrl });
  Menu.setApplicationMenu(Menu.buildFromTemplate(buildMenuTemplate(process.platform)));
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
  window.webContents.on('will-navigate', (event, url) => {
    if (!isAppUrl(url)) event.preventDefault();
  });
  window.webContents.setWindowOpenHandler(({ url }) => {
    // Links to documents outside the app open in the user's browser, never in a new app window.
    if (url.startsWith('https://')) void shell.openExternal(url);
    return { action: 'deny' };
  });
  window.once('ready-to-show', () => window.show());
  void window.loadURL(`${appOrigin}/index.html`);
}
