import { mkdtemp, rm, writeFile } from 'node:fs/promises';
import { Agent, request } from 'node:http';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createDispatcher } from '../../src-main/api/dispatcher.js';
import { createHandlers } from '../../src-main/api/handlers/index.js';
import { startBrowserHost, type BrowserHost } from '../../src-main/host/browserHost.js';
import type * as RunnerModule from '../../src-main/api/design/designRunner.js';

// The design runner as the built app has it (designs in a worker thread; the global setup builds it).
const builtRunner = pathToFileURL(join(import.meta.dirname, '..', '..', 'build', 'main', 'api', 'design', 'designRunner.js')).href;
const { createDesignRunner } = (await import(builtRunner)) as typeof RunnerModule;
const designRunner = createDesignRunner();

let host: BrowserHost;
let rendererRoot: string;

beforeAll(async () => {
  rendererRoot = await mkdtemp(join(tmpdir(), 'tallyline-host-'));
  await writeFile(join(rendererRoot, 'index.html'), '<!doctype html><title>Tallyline</title>');
  const dispatch = createDispatcher(createHandlers({ dataDirectory: rendererRoot, designRunner }));
  host = await startBrowserHost({ rendererRoot, dispatch, token: 'a'.repeat(48) });
});

afterAll(async () => {
  await designRunner.close();
  await host.close();
  await rm(rendererRoot, { recursive: true, force: true });
});

/** A raw HTTP request, so the Host and Origin headers are exactly what a test sets. */
function call(path: string, options: { method?: string; headers?: Record<string, string>; body?: string } = {}) {
  return new Promise<{ status: number; body: string; headers: Record<string, unknown> }>((resolve, reject) => {
    const outgoing = request(
      { host: '127.0.0.1', port: host.port, path, method: options.method ?? 'GET', headers: { host: `127.0.0.1:${host.port}`, ...options.headers } },
      (response) => {
        let body = '';
        response.on('data', (chunk) => (body += chunk));
        response.on('end', () => resolve({ status: response.statusCode ?? 0, body, headers: response.headers }));
      },
    );
    outgoing.on('error', reject);
    outgoing.end(options.body);
  });
}

const authorized = { authorization: `Bearer ${'a'.repeat(48)}`, 'content-type': 'application/json' };
const nistExample = JSON.stringify({ model: 'passfail', p0: 0.01, p1: 0.1, alpha: 0.05, beta: 0.1 });

describe('the browser host', () => {
  it('listens on 127.0.0.1 and prints an address carrying the token in the fragment', () => {
    expect(host.url).toBe(`http://127.0.0.1:${host.port}/#token=${'a'.repeat(48)}`);
  });

  it('serves the renderer page with a strict content security policy and no CORS header', async () => {
    const response = await call('/');
    expect(response.status).toBe(200);
    expect(response.body).toContain('<title>Tallyline</title>');
    expect(response.headers['content-security-policy']).toContain("script-src 'self'");
    expect(response.headers['access-control-allow-origin']).toBeUndefined();
  });

  it('refuses a channel request without the token with 401', async () => {
    const response = await call('/api/plan.limits', { method: 'POST', body: nistExample });
    expect(response.status).toBe(401);
  });

  it('refuses a channel request with a wrong token with 401', async () => {
    const response = await call('/api/plan.limits', { method: 'POST', headers: { authorization: `Bearer ${'b'.repeat(48)}` }, body: nistExample });
    expect(response.status).toBe(401);
  });

  it('answers a channel request with the token as JSON', async () => {
    const response = await call('/api/plan.limits', { method: 'POST', headers: authorized, body: nistExample });
    expect(response.status).toBe(200);
    expect(JSON.parse(response.body)).toMatchObject({ ok: true, value: { boundaries: { lnA: expect.any(Number) } } });
  });

  it('refuses another Host name (a DNS-rebinding page) with 403', async () => {
    const response = await call('/', { headers: { host: `attacker.example:${host.port}` } });
    expect(response.status).toBe(403);
  });

  it('refuses a request whose Origin is another site with 403, even with the token', async () => {
    const response = await call('/api/plan.limits', { method: 'POST', headers: { ...authorized, origin: 'http://attacker.example' }, body: nistExample });
    expect(response.status).toBe(403);
  });

  it('answers a body that is not JSON with an invalid-payload result', async () => {
    const response = await call('/api/plan.limits', { method: 'POST', headers: authorized, body: '{not json' });
    expect(response.status).toBe(400);
    expect(JSON.parse(response.body)).toMatchObject({ ok: false, code: 'invalid-payload' });
  });

  it('does not serve files outside the renderer folder', async () => {
    const response = await call('/..%2f..%2fetc%2fpasswd');
    expect(response.body).not.toContain('root:');
  });

  it('answers a missing asset with 404 and an unknown screen path with the page', async () => {
    expect((await call('/assets/missing.js')).status).toBe(404);
    expect((await call('/inspect')).body).toContain('<title>Tallyline</title>');
  });

  it('answers a path with a malformed % escape with 400, not a server error', async () => {
    const page = await call('/%E0%A4%A');
    expect(page.status).toBe(400);
    expect(page.body).toBe('The address has a malformed % escape.');
    const channel = await call('/api/plan.limits%E0%A4%A', { method: 'POST', headers: authorized, body: nistExample });
    expect(channel.status).toBe(400);
    expect(JSON.parse(channel.body)).toMatchObject({ ok: false, code: 'invalid-payload' });
  });

  it('refuses a design whose work has no bound with one invalid-parameter line, and keeps answering', { timeout: 10_000 }, async () => {
    // A truncation of 1e9 items used to take the host past 2 GB of memory.
    const spec = { model: 'passfail', p0: 0.01, p1: 0.1, alpha: 0.05, beta: 0.1, truncation: 1e9 };
    const refused = await call('/api/plan.design', { method: 'POST', headers: authorized, body: JSON.stringify({ spec }) });
    expect(JSON.parse(refused.body)).toMatchObject({ ok: false, code: 'invalid-parameter', field: 'truncation' });
    const next = await call('/api/plan.limits', { method: 'POST', headers: authorized, body: nistExample });
    expect(JSON.parse(next.body)).toMatchObject({ ok: true });
  });

  it('answers other channels while a long design computes', { timeout: 30_000 }, async () => {
    expect(designRunner.inWorker).toBe(true);
    // A three-class graded plan over 31 curve points takes the engine a while (invented qualities).
    const spec = { model: 'graded', classes: ['ok', 'minor', 'major'], p0: [0.92, 0.06, 0.02], p1: [0.8, 0.14, 0.06], alpha: 0.05, beta: 0.1 };
    const order: string[] = [];
    const design = call('/api/plan.design', { method: 'POST', headers: authorized, body: JSON.stringify({ spec, curvePoints: 31 }) }).then((answer) => {
      order.push('plan.design');
      return answer;
    });
    await new Promise((resolve) => setTimeout(resolve, 50));
    const settings = await call('/api/settings.get', { method: 'POST', headers: authorized, body: 'null' });
    order.push('settings.get');
    expect(JSON.parse(settings.body)).toMatchObject({ ok: true });
    expect(JSON.parse((await design).body)).toMatchObject({ ok: true, value: { superseded: false, design: { model: 'graded' } } });
    expect(order).toEqual(['settings.get', 'plan.design']);
  });

  it('keeps an idle connection open longer than the 5 s that made requests fail to fetch', { timeout: 20_000 }, async () => {
    const agent = new Agent({ keepAlive: true, maxSockets: 1 });
    const post = () =>
      new Promise<{ status: number; socket: unknown }>((resolve, reject) => {
        const outgoing = request(
          { host: '127.0.0.1', port: host.port, path: '/api/plan.limits', method: 'POST', agent, headers: { host: `127.0.0.1:${host.port}`, ...authorized } },
          (response) => {
            response.resume();
            response.on('end', () => resolve({ status: response.statusCode ?? 0, socket: outgoing.socket }));
          },
        );
        outgoing.on('error', reject);
        outgoing.end(nistExample);
      });
    try {
      const first = await post();
      await new Promise((resolve) => setTimeout(resolve, 6_000));
      const second = await post();
      expect([first.status, second.status]).toEqual([200, 200]);
      expect(second.socket).toBe(first.socket);
    } finally {
      agent.destroy();
    }
  });
});
