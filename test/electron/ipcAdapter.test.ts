import { describe, expect, it } from 'vitest';
import { channelNames } from '../../src-main/api/contract.js';
import { ipcPrefix, listChannelsMessage, registerIpcChannels, type IpcInvokeEvent, type IpcSyncEvent } from '../../src-main/electron/ipcAdapter.js';
import { isAppUrl } from '../../src-main/electron/appProtocol.js';

function fakeIpc() {
  const invokeHandlers = new Map<string, (event: IpcInvokeEvent, payload: unknown) => Promise<unknown>>();
  const syncHandlers = new Map<string, (event: IpcSyncEvent) => void>();
  return {
    invokeHandlers,
    syncHandlers,
    handle: (channel: string, listener: (event: IpcInvokeEvent, payload: unknown) => Promise<unknown>) => void invokeHandlers.set(channel, listener),
    on: (channel: string, listener: (event: IpcSyncEvent) => void) => void syncHandlers.set(channel, listener),
  };
}

describe('the Electron IPC adapter', () => {
  it('registers exactly one handler per channel of the contract', () => {
    const ipc = fakeIpc();
    registerIpcChannels(ipc, async () => ({ ok: true, value: null }), isAppUrl);
    expect([...ipc.invokeHandlers.keys()].sort()).toEqual(channelNames.map((name) => ipcPrefix + name).sort());
  });

  it('passes a request from the app frame to the dispatcher', async () => {
    const ipc = fakeIpc();
    const seen: unknown[] = [];
    registerIpcChannels(ipc, async (channel, payload) => (seen.push([channel, payload]), { ok: true, value: 1 }), isAppUrl);
    const answer = await ipc.invokeHandlers.get(`${ipcPrefix}plan.limits`)!({ senderFrame: { url: 'tallyline://app/index.html' } }, { x: 1 });
    expect(answer).toEqual({ ok: true, value: 1 });
    expect(seen).toEqual([['plan.limits', { x: 1 }]]);
  });

  it('refuses a request from any other frame without running a handler', async () => {
    const ipc = fakeIpc();
    let ran = false;
    registerIpcChannels(ipc, async () => ((ran = true), { ok: true, value: 1 }), isAppUrl);
    const answer = await ipc.invokeHandlers.get(`${ipcPrefix}plan.limits`)!({ senderFrame: { url: 'https://attacker.example/' } }, {});
    expect(answer).toMatchObject({ ok: false });
    expect(ran).toBe(false);
  });

  it('tells the preload the channel names only when asked from the app frame', () => {
    const ipc = fakeIpc();
    registerIpcChannels(ipc, async () => ({ ok: true, value: null }), isAppUrl);
    const trusted: IpcSyncEvent = { senderFrame: { url: 'tallyline://app/index.html' }, returnValue: undefined };
    const stranger: IpcSyncEvent = { senderFrame: { url: 'file:///tmp/page.html' }, returnValue: undefined };
    ipc.syncHandlers.get(listChannelsMessage)!(trusted);
    ipc.syncHandlers.get(listChannelsMessage)!(stranger);
    expect(trusted.returnValue).toEqual(channelNames);
    expect(stranger.returnValue).toEqual([]);
  });

  it('counts only our own protocol and host as the app', () => {
    expect(isAppUrl('tallyline://app/index.html')).toBe(true);
    expect(isAppUrl('tallyline://app.attacker/index.html')).toBe(false);
    expect(isAppUrl('https://app/')).toBe(false);
  });
});
