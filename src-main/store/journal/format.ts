/**
 * The run journal's line format (`tallyline.journal/1`): one JSON object per line, keys in a fixed
 * order, each entry carrying the SHA-256 (hex) of the previous entry's line bytes. The hash of the
 * final line is the run's fingerprint.
 */
import { createHash } from 'node:crypto';

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

const KINDS: ReadonlySet<unknown> = new Set<JournalKind>(['open', 'result', 'void', 'override', 'close']);
const UTC_TIME = /^\d{4}-\d\d-\d\dT\d\d:\d\d:\d\d\.\d{3}Z$/;
const UTC_OFFSET = /^[+-]\d\d:\d\d$/;
const SHA256_HEX = /^[0-9a-f]{64}$/;

/**
 * Why a parsed line is not a journal entry (naming the field), or null when it is one.
 * Hand-written rather than a zod schema: it runs once per line on every reload (10,000-entry runs).
 */
export function journalEntryProblem(value: unknown): string | null {
  if (typeof value !== 'object' || value === null || Array.isArray(value)) return 'not a JSON object';
  const entry = value as Record<string, unknown>;
  if (!Number.isSafeInteger(entry.seq) || (entry.seq as number) < 0) return 'field "seq": a whole number >= 0';
  if (typeof entry.time !== 'string' || !UTC_TIME.test(entry.time)) return 'field "time": UTC ISO time with milliseconds';
  if (typeof entry.offset !== 'string' || !UTC_OFFSET.test(entry.offset)) return 'field "offset": UTC offset like +01:00';
  if (typeof entry.actor !== 'string' || entry.actor === '') return 'field "actor": a non-empty text';
  if (!KINDS.has(entry.kind)) return 'field "kind": one of open, result, void, override, close';
  if (typeof entry.previous !== 'string' || !SHA256_HEX.test(entry.previous)) return 'field "previous": SHA-256 hex';
  return null;
}

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
