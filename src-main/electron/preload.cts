/**
 * Runs sandboxed before the renderer: exposes exactly the channel contract as
 * `window.tallyline`, one method per channel, never ipcRenderer itself; and, as
 * `window.tallylineDesktop`, the one thing only the desktop shell can do: open a record PDF in
 * the system viewer for printing.
 */
import electron = require('electron');

const { contextBridge, ipcRenderer } = electron;

const prefix = 'tallyline:';
const names = ipcRenderer.sendSync(`${prefix}list-channels`) as string[];
const methods: Record<string, (payload: unknown) => Promise<unknown>> = {};
for (const name of names) {
  methods[name] = (payload: unknown) => ipcRenderer.invoke(prefix + name, payload);
}
contextBridge.exposeInMainWorld('tallyline', Object.freeze(methods));
contextBridge.exposeInMainWorld(
  'tallylineDesktop',
  Object.freeze({
    openRecordPdf: (fileName: string, base64: string) => ipcRenderer.invoke('tallyline-desktop:open-record-pdf', { fileName, base64 }),
  }),
);
