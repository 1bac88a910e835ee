/** New ids for stored things: a readable prefix, the UTC date, and random hex (file-name safe). */
import { randomBytes } from 'node:crypto';

export function newId(prefix: 'src' | 'plan' | 'run', now: Date = new Date()): string {
  const date = now.toISOString().slice(0, 10).replaceAll('-', '');
  return `${prefix}-${date}-${randomBytes(4).toString('hex')}`;
}
