/**
 * A recording stand-in for the `electron` module, so the BUILT main process
 * (build/main/electron/main.js) runs under plain Node where the Electron runtime cannot be had.
 * It keeps the parts of Electron's behaviour the shell relies on (whenReady resolves on the next
 * turn, app.quit emits before-quit and can be cancelled, closing the last window emits
 * window-all-closed, app.exit ends the process) and records every call the shell makes.
 *
 * The test drives it over the child-process IPC channel (`process.send`): it asks for the
 * recording, invokes IPC channels as the window would, calls the preload's bridges, fetches from
 * the app protocol, emits app, window and theme events, and clicks menu items. On exit (app.exit,
 * or a quit that went through) the recording is written to ELECTRON_STAND_IN_RECORDING.
 *
 * Environment: ELECTRON_STAND_IN_USER_DATA (app.getPath('userData')), ELECTRON_STAND_IN_DISPLAYS
 * (JSON list of work areas), ELECTRON_STAND_IN_DARK=1 (the OS is in dark mode),
 * ELECTRON_STAND_IN_PACKAGED=1 (argv as a packaged app sees it: no app folder argument).
 *
 * Loaded through electronStandInHooks.ts (a Node resolve hook mapping `electron` to this file),
 * compiled to JavaScript by electronStandInBuild.ts.
 */
import { EventEmitter } from 'node:events';
import { existsSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';

type Listener = (...args: any[]) => unknown;
export interface Rectangle {
  x: number;
  y: number;
  width: number;
  height: number;
}
export interface MenuItemSummary {
  label?: string;
  role?: string;
  type?: string;
  accelerator?: string;
  enabled?: boolean;
  clickable: boolean;
  submenu?: MenuItemSummary[];
}
export interface WindowSummary {
  options: Record<string, any>;
  loadedUrls: string[];
  listeners: string[];
  webContentsListeners: string[];
  hasWindowOpenHandler: boolean;
  shown: boolean;
  closed: boolean;
  bounds: Rectangle;
  maximized: boolean;
  backgroundColors: string[];
  sent: Array<{ channel: string; args: unknown[] }>;
}
export interface StandInRecording {
  calls: string[];
  privilegedSchemes: Array<{ scheme: string; privileges: Record<string, boolean> }>;
  handledSchemes: string[];
  singleInstanceLockRequested: boolean;
  appListeners: string[];
  ipcHandleChannels: string[];
  ipcOnChannels: string[];
  applicationMenu: MenuItemSummary[] | null;
  poppedUpMenus: MenuItemSummary[][];
  windows: WindowSummary[];
  permissionRequestHandler: boolean;
  permissionCheckHandler: boolean;
  sessionListeners: string[];
  downloads: Array<{ fileName: string; saveDialogOptions: Record<string, any> | null }>;
  messageBoxes: Array<Record<string, any>>;
  saveDialogs: Array<Record<string, any>>;
  openDialogs: Array<Record<string, any>>;
  openedPaths: string[];
  openedExternally: string[];
  themeSources: string[];
  aboutPanelOptions: Record<string, any> | null;
  exposedInMainWorld: Record<string, string[]>;
  quitRequests: number;
  exitCode: number | null;
}

const recording: StandInRecording = {
  calls: [],
  privilegedSchemes: [],
  handledSchemes: [],
  singleInstanceLockRequested: false,
  appListeners: [],
  ipcHandleChannels: [],
  ipcOnChannels: [],
  applicationMenu: null,
  poppedUpMenus: [],
  windows: [],
  permissionRequestHandler: false,
  permissionCheckHandler: false,
  sessionListeners: [],
  downloads: [],
  messageBoxes: [],
  saveDialogs: [],
  openDialogs: [],
  openedPaths: [],
  openedExternally: [],
  themeSources: [],
  aboutPanelOptions: null,
  exposedInMainWorld: {},
  quitRequests: 0,
  exitCode: null,
};

const environment = process.env;
if (environment.ELECTRON_STAND_IN_PACKAGED === '1') {
  // A packaged app's argv is [executable, ...user arguments]: drop the script path Node put there.
  process.argv.splice(1, 1);
} else {
  // `electron <app folder> ...`: Electron marks the development launch with process.defaultApp.
  (process as { defaultApp?: boolean }).defaultApp = true;
}
const mainScript = environment.ELECTRON_STAND_IN_MAIN ?? process.argv[1] ?? process.cwd();

function findPackage(start: string): { folder: string; manifest: Record<string, any> } {
  for (let folder = dirname(start); ; folder = dirname(folder)) {
    const path = join(folder, 'package.json');
    if (existsSync(path)) return { folder, manifest: JSON.parse(readFileSync(path, 'utf8')) };
    if (dirname(folder) === folder) return { folder: process.cwd(), manifest: {} };
  }
}
const appPackage = findPackage(mainScript);

function record(call: string): void {
  recording.calls.push(call);
}

function saveRecording(): void {
  const path = environment.ELECTRON_STAND_IN_RECORDING;
  if (path) writeFileSync(path, JSON.stringify(recording));
}

function summariseMenu(items: readonly any[]): MenuItemSummary[] {
  return items.map((item) => {
    const summary: MenuItemSummary = { clickable: typeof item.click === 'function' };
    for (const key of ['label', 'role', 'type', 'accelerator', 'enabled'] as const) if (item[key] !== undefined) (summary as any)[key] = item[key];
    const submenu = item.submenu instanceof Menu ? item.submenu.items : item.submenu;
    if (Array.isArray(submenu)) summary.submenu = summariseMenu(submenu);
    return summary;
  });
}

// ---------------------------------------------------------------------------------------------- app

let quitting = false;
const userDataFolder = environment.ELECTRON_STAND_IN_USER_DATA ?? mkdtempSync(join(tmpdir(), 'electron-stand-in-profile-'));

class App extends EventEmitter {
  isPackaged = environment.ELECTRON_STAND_IN_PACKAGED === '1';
  private readyPromise: Promise<void>;
  private ready = false;

  constructor() {
    super();
    // Electron becomes ready after the main script's first turn.
    this.readyPromise = new Promise((resolve) =>
      setTimeout(() => {
        this.ready = true;
        this.emit('ready');
        resolve();
      }, 0),
    );
  }

  override on(event: string, listener: Listener): this {
    recording.appListeners.push(event);
    return super.on(event, listener);
  }
  whenReady(): Promise<void> {
    record('app.whenReady');
    return this.readyPromise;
  }
  isReady(): boolean {
    return this.ready;
  }
  requestSingleInstanceLock(): boolean {
    recording.singleInstanceLockRequested = true;
    return environment.ELECTRON_STAND_IN_SECOND_INSTANCE !== '1';
  }
  getVersion(): string {
    return String(appPackage.manifest.version ?? '0.0.0');
  }
  getName(): string {
    return String(appPackage.manifest.productName ?? appPackage.manifest.name ?? 'Electron');
  }
  getAppPath(): string {
    return appPackage.folder;
  }
  getPath(name: string): string {
    record(`app.getPath(${name})`);
    if (name === 'userData') return userDataFolder;
    if (name === 'documents' || name === 'home' || name === 'downloads') return join(tmpdir(), name);
    if (name === 'temp') return tmpdir();
    throw new Error(`stand-in: app.getPath('${name}') is not modelled`);
  }
  setAboutPanelOptions(options: Record<string, any>): void {
    recording.aboutPanelOptions = options;
  }
  quit(): void {
    recording.quitRequests += 1;
    const event = cancellableEvent();
    this.emit('before-quit', event);
    if (event.defaultPrevented) return;
    quitting = true;
    for (const window of [...openWindows]) window.close();
    const willQuit = cancellableEvent();
    this.emit('will-quit', willQuit);
    if (willQuit.defaultPrevented) return;
    this.emit('quit', cancellableEvent(), 0);
    this.exit(0);
  }
  exit(code = 0): void {
    recording.exitCode = code;
    saveRecording();
    // Let stdout drain (a CLI's output) before the process ends, as Electron does.
    process.stdout.write('', () => process.exit(code));
  }
}

function cancellableEvent(): { defaultPrevented: boolean; preventDefault(): void } {
  const event = {
    defaultPrevented: false,
    preventDefault() {
      event.defaultPrevented = true;
    },
  };
  return event;
}

export const app = new App();

// ---------------------------------------------------------------------------------------- windows

const openWindows: BrowserWindow[] = [];
let nextWebContentsId = 1;

class WebContents extends EventEmitter {
  readonly id = nextWebContentsId++;
  windowOpenHandler: Listener | null = null;
  constructor(private readonly summary: WindowSummary) {
    super();
  }
  override on(event: string, listener: Listener): this {
    this.summary.webContentsListeners.push(event);
    return super.on(event, listener);
  }
  override once(event: string, listener: Listener): this {
    this.summary.webContentsListeners.push(event);
    return super.once(event, listener);
  }
  setWindowOpenHandler(handler: Listener): void {
    this.summary.hasWindowOpenHandler = true;
    this.windowOpenHandler = handler;
  }
  send(channel: string, ...args: unknown[]): void {
    this.summary.sent.push({ channel, args });
  }
  getURL(): string {
    return this.summary.loadedUrls.at(-1) ?? '';
  }
}

export class BrowserWindow extends EventEmitter {
  static getAllWindows(): BrowserWindow[] {
    return [...openWindows];
  }
  static getFocusedWindow(): BrowserWindow | null {
    return openWindows[0] ?? null;
  }
  static fromWebContents(webContents: WebContents): BrowserWindow | null {
    return openWindows.find((window) => window.webContents === webContents) ?? null;
  }

  readonly summary: WindowSummary;
  readonly webContents: WebContents;
  private minimized = false;

  constructor(options: Record<string, any> = {}) {
    super();
    if (!app.isReady()) throw new Error('stand-in: BrowserWindow made before the app was ready (Electron refuses this)');
    const bounds = { x: options.x ?? 100, y: options.y ?? 100, width: options.width ?? 800, height: options.height ?? 600 };
    this.summary = {
      options: JSON.parse(JSON.stringify(options)),
      loadedUrls: [],
      listeners: [],
      webContentsListeners: [],
      hasWindowOpenHandler: false,
      shown: false,
      closed: false,
      bounds,
      maximized: false,
      backgroundColors: options.backgroundColor ? [options.backgroundColor] : [],
      sent: [],
    };
    recording.windows.push(this.summary);
    this.webContents = new WebContents(this.summary);
    openWindows.push(this);
  }

  override on(event: string, listener: Listener): this {
    this.summary.listeners.push(event);
    return super.on(event, listener);
  }
  override once(event: string, listener: Listener): this {
    this.summary.listeners.push(event);
    return super.once(event, listener);
  }
  async loadURL(url: string): Promise<void> {
    this.summary.loadedUrls.push(url);
    const preload = this.summary.options.webPreferences?.preload;
    if (typeof preload === 'string') runPreload(preload, this);
    setTimeout(() => this.emit('ready-to-show'), 0);
  }
  show(): void {
    this.summary.shown = true;
  }
  focus(): void {}
  restore(): void {
    this.minimized = false;
  }
  isMinimized(): boolean {
    return this.minimized;
  }
  isDestroyed(): boolean {
    return this.summary.closed;
  }
  getBounds(): Rectangle {
    return { ...this.summary.bounds };
  }
  getNormalBounds(): Rectangle {
    return { ...this.summary.bounds };
  }
  setBounds(bounds: Partial<Rectangle>): void {
    this.summary.bounds = { ...this.summary.bounds, ...bounds };
  }
  isMaximized(): boolean {
    return this.summary.maximized;
  }
  maximize(): void {
    this.summary.maximized = true;
  }
  setBackgroundColor(colour: string): void {
    this.summary.backgroundColors.push(colour);
  }
  close(): void {
    if (this.summary.closed) return;
    const event = cancellableEvent();
    this.emit('close', event);
    if (event.defaultPrevented && !quitting) return;
    this.summary.closed = true;
    openWindows.splice(openWindows.indexOf(this), 1);
    this.emit('closed');
    if (openWindows.length === 0 && !quitting) app.emit('window-all-closed');
  }
}

// ------------------------------------------------------------------------------- menus and dialogs

export class Menu {
  static buildFromTemplate(template: any[]): Menu {
    return new Menu(template);
  }
  static setApplicationMenu(menu: Menu | null): void {
    recording.applicationMenu = menu === null ? null : summariseMenu(menu.items);
    applicationMenu = menu;
  }
  static getApplicationMenu(): Menu | null {
    return applicationMenu;
  }
  constructor(readonly items: any[] = []) {}
  popup(options: { window?: BrowserWindow } = {}): void {
    recording.poppedUpMenus.push(summariseMenu(this.items));
    lastPopup = { menu: this, window: options.window ?? null };
  }
}
let applicationMenu: Menu | null = null;
let lastPopup: { menu: Menu; window: BrowserWindow | null } | null = null;

const dialogAnswers: Record<string, unknown> = {
  showMessageBox: { response: 0, checkboxChecked: false },
  showSaveDialog: { canceled: true, filePath: '' },
  showOpenDialog: { canceled: true, filePaths: [] },
};

function dialogOptions(args: unknown[]): Record<string, any> {
  const options = (args[0] instanceof BrowserWindow ? args[1] : args[0]) as Record<string, any>;
  return { ...JSON.parse(JSON.stringify(options ?? {})), parentWindow: args[0] instanceof BrowserWindow };
}

export const dialog = {
  async showMessageBox(...args: unknown[]) {
    recording.messageBoxes.push(dialogOptions(args));
    return dialogAnswers.showMessageBox;
  },
  async showSaveDialog(...args: unknown[]) {
    recording.saveDialogs.push(dialogOptions(args));
    return dialogAnswers.showSaveDialog;
  },
  async showOpenDialog(...args: unknown[]) {
    recording.openDialogs.push(dialogOptions(args));
    return dialogAnswers.showOpenDialog;
  },
  showErrorBox(title: string, content: string) {
    recording.messageBoxes.push({ type: 'error', title, message: content });
  },
};

// ------------------------------------------------------------------------------ ipc, protocol, etc.

const invokeHandlers = new Map<string, Listener>();
const messageListeners = new Map<string, Listener[]>();

export const ipcMain = {
  handle(channel: string, listener: Listener) {
    if (invokeHandlers.has(channel)) throw new Error(`stand-in: a second handler for '${channel}' (Electron refuses this)`);
    recording.ipcHandleChannels.push(channel);
    invokeHandlers.set(channel, listener);
  },
  on(channel: string, listener: Listener) {
    recording.ipcOnChannels.push(channel);
    messageListeners.set(channel, [...(messageListeners.get(channel) ?? []), listener]);
  },
};

const protocolHandlers = new Map<string, (request: Request) => Response | Promise<Response>>();

export const protocol = {
  registerSchemesAsPrivileged(schemes: Array<{ scheme: string; privileges: Record<string, boolean> }>) {
    if (app.isReady()) throw new Error('stand-in: registerSchemesAsPrivileged after ready (Electron ignores it then)');
    recording.privilegedSchemes.push(...schemes);
  },
  handle(scheme: string, handler: (request: Request) => Response | Promise<Response>) {
    recording.handledSchemes.push(scheme);
    protocolHandlers.set(scheme, handler);
  },
};

const sessionEvents = new EventEmitter();
export const session = {
  defaultSession: {
    setPermissionRequestHandler() {
      recording.permissionRequestHandler = true;
    },
    setPermissionCheckHandler() {
      recording.permissionCheckHandler = true;
    },
    on(event: string, listener: Listener) {
      recording.sessionListeners.push(event);
      sessionEvents.on(event, listener);
    },
  },
};

export const shell = {
  async openExternal(url: string) {
    recording.openedExternally.push(url);
  },
  async openPath(path: string) {
    recording.openedPaths.push(path);
    return '';
  },
};

const osDark = environment.ELECTRON_STAND_IN_DARK === '1';
class NativeTheme extends EventEmitter {
  private source: 'system' | 'light' | 'dark' = 'system';
  osDark = osDark;
  get themeSource() {
    return this.source;
  }
  set themeSource(value: 'system' | 'light' | 'dark') {
    recording.themeSources.push(value);
    const before = this.shouldUseDarkColors;
    this.source = value;
    if (this.shouldUseDarkColors !== before) this.emit('updated');
  }
  get shouldUseDarkColors(): boolean {
    return this.source === 'system' ? this.osDark : this.source === 'dark';
  }
}
export const nativeTheme = new NativeTheme();

const displays: Rectangle[] = environment.ELECTRON_STAND_IN_DISPLAYS ? JSON.parse(environment.ELECTRON_STAND_IN_DISPLAYS) : [{ x: 0, y: 0, width: 1920, height: 1040 }];
function display(workArea: Rectangle, index: number) {
  return { id: index + 1, bounds: workArea, workArea, scaleFactor: 1 };
}
export const screen = {
  getAllDisplays: () => displays.map(display),
  getPrimaryDisplay: () => display(displays[0]!, 0),
  getDisplayMatching(rectangle: Rectangle) {
    let best = 0;
    let bestOverlap = -1;
    displays.forEach((area, index) => {
      const width = Math.max(0, Math.min(area.x + area.width, rectangle.x + rectangle.width) - Math.max(area.x, rectangle.x));
      const height = Math.max(0, Math.min(area.y + area.height, rectangle.y + rectangle.height) - Math.max(area.y, rectangle.y));
      if (width * height > bestOverlap) {
        bestOverlap = width * height;
        best = index;
      }
    });
    return display(displays[best]!, best);
  },
};

// ----------------------------------------------------------------------- the renderer side (preload)

const exposed: Record<string, Record<string, Listener>> = {};

/** Runs the window's (CommonJS, sandboxed) preload with the renderer half of the stand-in. */
function runPreload(path: string, window: BrowserWindow): void {
  const frameEvent = () => ({ sender: window.webContents, senderFrame: { url: window.webContents.getURL() } });
  const rendererElectron = {
    contextBridge: {
      exposeInMainWorld(name: string, api: Record<string, Listener>) {
        recording.exposedInMainWorld[name] = Object.keys(api);
        exposed[name] = api;
      },
    },
    ipcRenderer: {
      sendSync(channel: string, ...args: unknown[]) {
        const event = { ...frameEvent(), returnValue: undefined as unknown };
        for (const listener of messageListeners.get(channel) ?? []) listener(event, ...args);
        return event.returnValue;
      },
      async invoke(channel: string, ...args: unknown[]) {
        const handler = invokeHandlers.get(channel);
        if (!handler) throw new Error(`Error invoking remote method '${channel}': No handler registered for '${channel}'`);
        return handler(frameEvent(), ...args);
      },
    },
  };
  const source = readFileSync(path, 'utf8');
  const module = { exports: {} as unknown };
  const requireInSandbox = (name: string) => {
    if (name === 'electron') return rendererElectron;
    throw new Error(`stand-in: a sandboxed preload cannot require '${name}'`);
  };
  new Function('require', 'module', 'exports', source)(requireInSandbox, module, module.exports);
}

// ------------------------------------------------------------------------------ the test's controls

type Command =
  | { type: 'snapshot' }
  | { type: 'invoke'; channel: string; payload: unknown; frameUrl: string }
  | { type: 'bridge'; name: string; method: string; args: unknown[] }
  | { type: 'fetch'; url: string }
  | { type: 'app-event'; event: string; args?: unknown[] }
  | { type: 'window-event'; window: number; event: string; args?: unknown[] }
  | { type: 'web-contents-event'; window: number; event: string; args?: unknown[] }
  | { type: 'window-set-bounds'; window: number; bounds: Partial<Rectangle>; maximized?: boolean }
  | { type: 'window-close'; window: number }
  | { type: 'menu-click'; path: string[]; popup?: boolean }
  | { type: 'dialog-answer'; method: 'showMessageBox' | 'showSaveDialog' | 'showOpenDialog'; answer: unknown }
  | { type: 'os-theme'; dark: boolean }
  | { type: 'download'; fileName: string }
  | { type: 'quit' };

async function perform(command: Command): Promise<unknown> {
  switch (command.type) {
    case 'snapshot':
      return recording;
    case 'invoke': {
      const handler = invokeHandlers.get(command.channel);
      if (!handler) throw new Error(`no handler for ${command.channel}`);
      return handler({ senderFrame: { url: command.frameUrl } }, command.payload);
    }
    case 'bridge': {
      const method = exposed[command.name]?.[command.method];
      if (!method) throw new Error(`the preload exposed no ${command.name}.${command.method}`);
      return method(...command.args);
    }
    case 'fetch': {
      const scheme = new URL(command.url).protocol.slice(0, -1);
      const handler = protocolHandlers.get(scheme);
      if (!handler) throw new Error(`no handler for the ${scheme} protocol`);
      const response = await handler(new Request(command.url));
      const body = Buffer.from(await response.arrayBuffer());
      return { status: response.status, contentType: response.headers.get('content-type'), length: body.length, start: body.subarray(0, 200).toString('utf8') };
    }
    case 'app-event': {
      const event = cancellableEvent();
      app.emit(command.event, event, ...(command.args ?? []));
      return { prevented: event.defaultPrevented };
    }
    case 'window-event': {
      const event = cancellableEvent();
      recordedWindow(command.window).emit(command.event, event, ...(command.args ?? []));
      return { prevented: event.defaultPrevented };
    }
    case 'web-contents-event': {
      const event = cancellableEvent();
      recordedWindow(command.window).webContents.emit(command.event, event, ...(command.args ?? []));
      return { prevented: event.defaultPrevented };
    }
    case 'window-set-bounds': {
      const window = recordedWindow(command.window);
      window.setBounds(command.bounds);
      if (command.maximized !== undefined) window.summary.maximized = command.maximized;
      window.emit('resize');
      window.emit('move');
      return window.getBounds();
    }
    case 'window-close':
      recordedWindow(command.window).close();
      return null;
    case 'menu-click': {
      const items = command.popup ? lastPopup?.menu.items : applicationMenu?.items;
      const item = findMenuItem(items ?? [], command.path);
      if (typeof item.click !== 'function') throw new Error(`menu item ${command.path.join(' > ')} has no click handler`);
      await item.click(item, command.popup ? lastPopup?.window : openWindows[0], {});
      return null;
    }
    case 'dialog-answer':
      dialogAnswers[command.method] = command.answer;
      return null;
    case 'os-theme': {
      const before = nativeTheme.shouldUseDarkColors;
      nativeTheme.osDark = command.dark;
      if (nativeTheme.shouldUseDarkColors !== before || nativeTheme.themeSource === 'system') nativeTheme.emit('updated');
      return nativeTheme.shouldUseDarkColors;
    }
    case 'download': {
      const entry = { fileName: command.fileName, saveDialogOptions: null as Record<string, any> | null };
      recording.downloads.push(entry);
      const item = {
        getFilename: () => command.fileName,
        getMimeType: () => '',
        setSaveDialogOptions: (options: Record<string, any>) => (entry.saveDialogOptions = JSON.parse(JSON.stringify(options))),
      };
      sessionEvents.emit('will-download', cancellableEvent(), item, openWindows[0]?.webContents);
      return entry;
    }
    case 'quit':
      app.quit();
      return null;
  }
}

function recordedWindow(index: number): BrowserWindow {
  const window = openWindows[index];
  if (!window) throw new Error(`no open window ${index}`);
  return window;
}

function findMenuItem(items: any[], path: string[]): any {
  const [label, ...rest] = path;
  const item = items.find((candidate) => candidate.label === label || candidate.role === label);
  if (!item) throw new Error(`no menu item '${label}' among ${items.map((candidate) => candidate.label ?? candidate.role).join(', ')}`);
  if (rest.length === 0) return item;
  const submenu = item.submenu instanceof Menu ? item.submenu.items : item.submenu;
  return findMenuItem(submenu ?? [], rest);
}

if (typeof process.send === 'function') {
  process.on('message', (message: { id: number; command: Command }) => {
    perform(message.command).then(
      (value) => process.send!({ id: message.id, ok: true, value }),
      (error: unknown) => process.send!({ id: message.id, ok: false, message: error instanceof Error ? error.message : String(error) }),
    );
  });
  // The test ends the child by disconnecting; nothing else keeps a quiet stand-in alive.
  process.on('disconnect', () => process.exit(0));
}

const electron = { app, BrowserWindow, Menu, dialog, ipcMain, protocol, session, shell, nativeTheme, screen };
export default electron;
