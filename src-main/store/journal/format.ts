/**
 * The run journal's line format (`tallyline.journal/1`): one JSON object per line, keys in a fixed
 * order, each entry carrying the SHA-256 (hex) of the previous entry's line bytes. The hash of the
 * final line is the run's fingerprint.
 */
import { hash } from 'node:crypto';

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

/*
 * The three text shapes an entry must have, checked character by character (no regular expression
 * per line on the reload path). Each accepts exactly what its pattern says:
 *   time      ^\d{4}-\d\d-\d\dT\d\d:\d\d:\d\d\.\d{3}Z$    e.g. 2026-12-05T09:14:03.120Z
 *   offset    ^[+-]\d\d:\d\d$                              e.g. +01:00
 *   previous  ^[0-9a-f]{64}$                                 SHA-256 in lower-case hex
 * (\d being the ASCII digits 0-9.)
 */
const DIGIT = 0x44; // 'D' in a template: any of 0-9
const UTC_TIME_TEMPLATE = 'DDDD-DD-DDTDD:DD:DD.DDDZ';
const UTC_OFFSET_TEMPLATE = '+DD:DD';

function isDigit(code: number): boolean {
  return code >= 0x30 && code <= 0x39;
}

/** Whether `text` has the template's shape; characters before `from` are checked by the caller. */
function matchesTemplate(text: string, template: string, from = 0): boolean {
  if (text.length !== template.length) return false;
  for (let index = from; index < template.length; index += 1) {
    const wanted = template.charCodeAt(index);
    const code = text.charCodeAt(index);
    if (wanted === DIGIT ? !isDigit(code) : code !== wanted) return false;
  }
  return true;
}

export function isUtcTime(text: string): boolean {
  return matchesTemplate(text, UTC_TIME_TEMPLATE);
}

export function isUtcOffset(text: string): boolean {
  const sign = text.charCodeAt(0);
  return (sign === 0x2b || sign === 0x2d) && matchesTemplate(text, UTC_OFFSET_TEMPLATE, 1);
}

export function isSha256Hex(text: string): boolean {
  if (text.length !== 64) return false;
  for (let index = 0; index < 64; index += 1) {
    const code = text.charCodeAt(index);
    if (!(isDigit(code) || (code >= 0x61 && code <= 0x66))) return false;
  }
  return true;
}

/**
 * Why a parsed line is not a journal entry (naming the field), or null when it is one.
 * Hand-written rather than a zod schema: it runs once per line on every reload (10,000-entry runs).
 */
export function journalEntryProblem(value: unknown): string | null {
  if (typeof value !== 'object' || value === null || Array.isArray(value)) return 'not a JSON object';
  const entry = value as Record<string, unknown>;
  if (!Number.isSafeInteger(entry.seq) || (entry.seq as number) < 0) return 'field "seq": a whole number >= 0';
  if (typeof entry.time !== 'string' || !isUtcTime(entry.time)) return 'field "time": UTC ISO time with milliseconds';
  if (typeof entry.offset !== 'string' || !isUtcOffset(entry.offset)) return 'field "offset": UTC offset like +01:00';
  if (typeof entry.actor !== 'string' || entry.actor === '') return 'field "actor": a non-empty text';
  if (!KINDS.has(entry.kind)) return 'field "kind": one of open, result, void, override, close';
  if (typeof entry.previous !== 'string' || !isSha256Hex(entry.previous)) return 'field "previous": SHA-256 hex';
  return null;
}

/** Serialise an entry to its line (without the newline), keys in the canonical order. */
export function entryLine(entry: JournalEntry): string {
  const { seq, time, offset, actor, kind, payload, previous } = entry;
  return JSON.stringify({ seq, time, offset, actor, kind, payload, previous });
}

/** SHA-256 hex of a line's bytes, in one call: no hash object per line on a 10,000-line reload. */
export function lineHash(line: string | Uint8Array): string {
  return hash('sha256', line, 'hex');
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
