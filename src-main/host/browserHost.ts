import { randomBytes } from 'node:crypto';
import { createServer, type IncomingMessage, type ServerResponse } from 'node:http';
import type { AddressInfo } from 'node:net';
import type { Dispatch } from '../api/dispatcher.js';
import { contentSecurityPolicy } from './contentSecurityPolicy.js';
import { checkAuthority, checkToken } from './requestGuard.js';
import { readStaticFile } from './staticFiles.js';

export interface BrowserHostOptions {
  /** The built renderer (index.html and its assets). */
  rendererRoot: string;
  dispatch: Dispatch;
  /** 0 picks a free port. */
  port?: number;
  /** Fixed only in tests; otherwise random per launch. */
  token?: string;
}

export interface BrowserHost {
  /** The address to open, with the token in the fragment (never sent to the server or logged). */
  url: string;
  port: number;
  token: string;
  close(): Promise<void>;
}

const maximumBodyBytes = 1_000_000;
const apiPrefix = '/api/';

/** Longer than Chromium keeps a used idle connection (300 s), so the browser is the one to close it. */
const KEEP_ALIVE_MS = 310_000;

/**
 * Serves the renderer and the channel contract over HTTP on 127.0.0.1 only: `POST /api/<channel>`
 * with a JSON body answers with the channel's result as JSON. No CORS headers are ever sent.
 */
export async function startBrowserHost(options: BrowserHostOptions): Promise<BrowserHost> {
  const token = options.token ?? randomBytes(24).toString('hex');
  const server = createServer((request, response) => {
    handle(request, response).catch((error: unknown) => {
      send(response, 500, 'application/json', JSON.stringify({ ok: false, code: 'internal', message: String(error) }));
    });
  });
  // The browser closes an idle kept-alive connection, not the host: if the host closed it first
  // (Node's default after 5 s), a request the browser sends on it at that moment fails to fetch,
  // and a POST is not retried. Chromium lets a used idle connection go after 300 s.
  server.keepAliveTimeout = KEEP_ALIVE_MS;
  server.headersTimeout = KEEP_ALIVE_MS + 10_000;

  async function handle(request: IncomingMessage, response: ServerResponse): Promise<void> {
    const authority = checkAuthority(request, port);
    if (!authority.allowed) return send(response, authority.status, 'text/plain', authority.reason);
    const path = new URL(request.url ?? '/', 'http://127.0.0.1').pathname;
    let decodedPath: string;
    try {
      decodedPath = decodeURIComponent(path);
    } catch {
      // A malformed % escape (e.g. "%E0%A4%A") is the client's mistake: 400, never a server error.
      const message = 'The address has a malformed % escape.';
      if (path.startsWith(apiPrefix)) return send(response, 400, 'application/json', JSON.stringify({ ok: false, code: 'invalid-payload', message }));
      return send(response, 400, 'text/plain', message);
    }
    if (path.startsWith(apiPrefix)) return serveChannel(request, response, decodedPath.slice(apiPrefix.length));
    if (request.method !== 'GET' && request.method !== 'HEAD') return send(response, 405, 'text/plain', 'Method not allowed.');
    const file = await readStaticFile(options.rendererRoot, path);
    if (!file) return send(response, 404, 'text/plain', 'Not found.');
    send(response, 200, file.contentType, file.body);
  }

  async function serveChannel(request: IncomingMessage, response: ServerResponse, channel: string): Promise<void> {
    const tokenVerdict = checkToken(request, token);
    if (!tokenVerdict.allowed) return send(response, tokenVerdict.status, 'text/plain', tokenVerdict.reason);
    if (request.method !== 'POST') return send(response, 405, 'text/plain', 'Channels take POST.');
    const body = await readBody(request);
    if (body === null) return send(response, 413, 'text/plain', `A request body may be at most ${maximumBodyBytes} bytes.`);
    let payload: unknown;
    try {
      payload = body.length === 0 ? undefined : JSON.parse(body);
    } catch {
      return send(response, 400, 'application/json', JSON.stringify({ ok: false, code: 'invalid-payload', message: 'The request body is not JSON.' }));
    }
    const result = await options.dispatch(channel, payload);
    send(response, 200, 'application/json', JSON.stringify(result));
  }

  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(options.port ?? 0, '127.0.0.1', () => resolve());
  });
  const port = (server.address() as AddressInfo).port;
  return {
    url: `http://127.0.0.1:${port}/#token=${token}`,
    port,
    token,
    // A browser keeps its connections open; end them so a stop (SIGTERM, window closed) finishes at once.
    close: () =>
      new Promise((resolve) => {
        server.close(() => resolve());
        server.closeAllConnections();
      }),
  };
}

function send(response: ServerResponse, status: number, contentType: string, body: string | Buffer): void {
  response.writeHead(status, {
    'content-type': contentType,
    'content-security-policy': contentSecurityPolicy,
    'x-content-type-options': 'nosniff',
    'referrer-policy': 'no-referrer',
    'cache-control': 'no-store',
  });
  response.end(body);
}

async function readBody(request: IncomingMessage): Promise<string | null> {
  const chunks: Buffer[] = [];
  let size = 0;
  for await (const chunk of request) {
    size += (chunk as Buffer).length;
    if (size > maximumBodyBytes) return null;
    chunks.push(chunk as Buffer);
  }
  return Buffer.concat(chunks).toString('utf8');
}
