/**
 * The renderer's one way to the main side. Under Electron the preload exposes one method per
 * channel as `window.tallyline`; in the browser host the same channels answer `POST /api/<name>`.
 * Callers cannot tell which is behind it.
 */
import type { ChannelInput, ChannelName, ChannelOutput } from '../../../src-main/api/contract';
import type { ChannelResult } from '../../../src-main/api/result';

type PreloadBridge = Record<string, (payload: unknown) => Promise<ChannelResult<unknown>>>;

/** Only in the desktop window: what the shell can do beyond the channel contract. */
interface DesktopBridge {
  openRecordPdf(fileName: string, base64: string): Promise<ChannelResult<string>>;
}

declare global {
  interface Window {
    tallyline?: PreloadBridge;
    tallylineDesktop?: DesktopBridge;
  }
}

const tokenKey = 'tallyline.token';

/** The browser host hands its per-launch token in the address fragment; keep it for reloads. */
function hostToken(): string {
  const match = /(?:^|[#&])token=([0-9a-f]+)/.exec(window.location.hash);
  if (match) {
    sessionStorage.setItem(tokenKey, match[1]);
    history.replaceState(null, '', window.location.pathname + window.location.search);
  }
  return sessionStorage.getItem(tokenKey) ?? '';
}

async function overHttp(channel: string, payload: unknown): Promise<ChannelResult<unknown>> {
  const response = await fetch(`./api/${encodeURIComponent(channel)}`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', authorization: `Bearer ${hostToken()}` },
    body: JSON.stringify(payload ?? null),
  });
  if (response.status === 401) {
    return { ok: false, code: 'internal', message: 'This page lost its access token: open the address that Tallyline printed when it started.' };
  }
  if (!response.ok) return { ok: false, code: 'internal', message: `The host answered ${response.status}: ${await response.text()}` };
  return (await response.json()) as ChannelResult<unknown>;
}

if (!window.tallyline) hostToken();

/** Sends one request on a channel of the contract. Never throws: failures come back as results. */
export async function request<C extends ChannelName>(channel: C, payload: ChannelInput<C>): Promise<ChannelResult<ChannelOutput<C>>> {
  try {
    const bridge = window.tallyline;
    const result = bridge ? await bridge[channel](payload) : await overHttp(channel, payload);
    return result as ChannelResult<ChannelOutput<C>>;
  } catch (error) {
    return { ok: false, code: 'internal', message: `Tallyline's main side did not answer: ${String(error)}` };
  }
}
