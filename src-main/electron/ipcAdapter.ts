import type { Dispatch } from '../api/dispatcher.js';
import { channelNames } from '../api/contract.js';

/** The part of Electron's ipcMain the adapter needs; tests pass a fake. */
export interface IpcRegistrar {
  handle(channel: string, listener: (event: IpcInvokeEvent, payload: unknown) => Promise<unknown>): void;
  on(channel: string, listener: (event: IpcSyncEvent) => void): void;
}

export interface IpcInvokeEvent {
  senderFrame: { url: string } | null;
}

export interface IpcSyncEvent extends IpcInvokeEvent {
  returnValue: unknown;
}

/** Prefix of every Electron IPC channel name, so ours never collide with Electron's own. */
export const ipcPrefix = 'tallyline:';
/** Asked once by the preload, synchronously, to learn which methods to expose. */
export const listChannelsMessage = `${ipcPrefix}list-channels`;

/**
 * Serves the contract over Electron IPC. Every request must come from a frame showing our own
 * app protocol; anything else is refused without running a handler.
 */
export function registerIpcChannels(ipc: IpcRegistrar, dispatch: Dispatch, isTrustedUrl: (url: string) => boolean): void {
  const trusted = (event: IpcInvokeEvent) => event.senderFrame !== null && isTrustedUrl(event.senderFrame.url);
  for (const name of channelNames) {
    ipc.handle(ipcPrefix + name, async (event, payload) => {
      if (!trusted(event)) {
        return { ok: false, code: 'internal', message: 'Request refused: it did not come from the Tallyline window.' };
      }
      return dispatch(name, payload);
    });
  }
  ipc.on(listChannelsMessage, (event) => {
    event.returnValue = trusted(event) ? channelNames : [];
  });
}
