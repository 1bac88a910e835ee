import { timingSafeEqual } from 'node:crypto';
import type { IncomingMessage } from 'node:http';

export type GuardVerdict = { allowed: true } | { allowed: false; status: 401 | 403; reason: string };

/**
 * DNS-rebinding guard: a page on another site that rebinds its name to 127.0.0.1 still sends
 * its own Host and Origin, so only our exact loopback authority is served.
 */
export function checkAuthority(request: IncomingMessage, port: number): GuardVerdict {
  const allowedHosts = new Set([`127.0.0.1:${port}`, `localhost:${port}`]);
  const host = request.headers.host ?? '';
  if (!allowedHosts.has(host)) return { allowed: false, status: 403, reason: `Host "${host}" is not served.` };
  const origin = request.headers.origin;
  if (origin !== undefined && !allowedHosts.has(origin.replace(/^http:\/\//, ''))) {
    return { allowed: false, status: 403, reason: `Origin "${origin}" is not allowed.` };
  }
  return { allowed: true };
}

/** Every API request carries the per-launch token as `Authorization: Bearer <token>`. */
export function checkToken(request: IncomingMessage, token: string): GuardVerdict {
  const header = request.headers.authorization ?? '';
  const offered = Buffer.from(header.replace(/^Bearer\s+/i, ''));
  const expected = Buffer.from(token);
  if (offered.length !== expected.length || !timingSafeEqual(offered, expected)) {
    return { allowed: false, status: 401, reason: 'Missing or wrong access token.' };
  }
  return { allowed: true };
}
