/**
 * The run journal's line format (`tallyline.journal/1`): one JSON object per line, keys in a fixed
 * order, each entry carrying the SHA-256 (hex) of the previous entry's line bytes. The hash of the
 * final line is the run's fingerprint.
 */
import { createHash } from 'node:crypto';
import { z } from 'zod';

export const JOURNAL_FORMAT = 'tallyline.journal/1';

/** The `previous` value of seq 0: there is no earlier line. */
export const GENESIS_HASH = '0'.repeat(64);

export type JournalKind = 'open' | 'result' | 'void' | 'override' | 'close';

export interface JournalEntry<Payload = unknown> {
  readonly seq: number;
  /** UTC, ISO 8601 with milliseconds. */
  readonly time: string;
  /** The writer's local UTC offset at `time`, e.g. `+01:00`. */
  readonly offset: string;
  readonly actor: string;
  readonly kind: JournalKind;
  readonly payload: Payload;
  /** SHA-256 hex of the previous entry's line, or GENESIS_HASH for seq 0. */
  readonly previous: string;
}

export const journalEntrySchema = z.object({
  seq: z.number().int().nonnegative(),
  time: z.string().regex(/^\d{4}-\d\d-\d\dT\d\d:\d\d:\d\d\.\d{3}Z$/, 'UTC ISO time with milliseconds'),
  offset: z.string().regex(/^[+-]\d\d:\d\d$/, 'UTC offset like +01:00'),
  actor: z.string().min(1),
  kind: z.enum(['open', 'result', 'void', 'override', 'close']),
  payload: z.unknown(),
  previous: z.string().regex(/^[0-9a-f]{64}$/, 'SHA-256 hex'),
});

/** Serialise an entry to its line (without the newline), keys in the canonical order. */
export function entryLine(entry: JournalEntry): string {
  const { seq, time, offset, actor, kind, payload, previous } = entry;
  return JSON.stringify({ seq, time, offset, actor, kind, payload, previous });
}

export function lineHash(line: string | Uint8Array): string {
  return createHash('sha256').update(line).digest('hex');
}

/** Local UTC offset of `date`, formatted `+HH:MM`. */
export function localOffset(date: Date): string {
  const minutesEast = -date.getTimezoneOffset();
  const sign = minutesEast >= 0 ? '+' : '-';
  const absolute = Math.abs(minutesEast);
  const hours = String(Math.floor(absolute / 60)).padStart(2, '0');
  const minutes = String(absolute % 60).padStart(2, '0');
  return `${sign}${hours}:${minutes}`;
}
