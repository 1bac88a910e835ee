/**
 * Ids of stored things: new ones (a readable prefix, the UTC date, random hex) and the one pattern
 * every id must match, because ids become file names.
 */
import { randomBytes } from 'node:crypto';
import { z } from 'zod';

/** Letters, digits, ".", "_" or "-", starting with a letter or digit, at most 80, never "..": cannot leave its folder. */
export const ID_PATTERN = /^(?!.*\.\.)[A-Za-z0-9][A-Za-z0-9._-]{0,79}$/;

/** What an id may be, in words, for messages. */
export const ID_ALLOWED = 'letters, digits, ".", "_" or "-" (at most 80, starting with a letter or digit)';

/** The zod schema of an id where one enters (channels, CLI flags): the pattern with a message naming the kind. */
export function idSchema(kind: 'run' | 'plan' | 'source'): z.ZodString {
  return z.string().regex(ID_PATTERN, `A ${kind} id is ${ID_ALLOWED}.`);
}

export function newId(prefix: 'src' | 'plan' | 'run', now: Date = new Date()): string {
  const date = now.toISOString().slice(0, 10).replaceAll('-', '');
  return `${prefix}-${date}-${randomBytes(4).toString('hex')}`;
}
