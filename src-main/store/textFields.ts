/**
 * The one rule for text a person types into a stored record (lot, source and plan names, inspector,
 * category, actor): trimmed, printable, at most 120 characters. The channels and the command line
 * both check it with `shortText`; `visibleText` escapes what older records hold before printing it.
 */
import { z } from 'zod';

/** Longest short text field, in characters. */
export const SHORT_TEXT_LIMIT = 120;

/**
 * Characters that are not printable text: C0 and C1 controls (NUL, ESC, DEL ...), the line and
 * paragraph separators, and the bidirectional overrides and isolates that can reorder what a
 * reader sees. Tabs and newlines are allowed in notes only (`noteText`).
 */
const NOT_PRINTABLE = /[\p{Cc}\u2028\u2029\u202A-\u202E\u2066-\u2069]/u;
const NOT_PRINTABLE_IN_NOTES = /[^\P{Cc}\t\n\r]|[\u2028\u2029\u202A-\u202E\u2066-\u2069]/u;
const NOT_PRINTABLE_ALL = /[\p{Cc}\u2028\u2029\u202A-\u202E\u2066-\u2069]/gu;

/** True when the text holds no control or reordering characters. */
export function isPrintable(text: string): boolean {
  return !NOT_PRINTABLE.test(text);
}

/** A short text field: trimmed, non-empty, printable, at most `limit` characters; messages name `what`. */
export function shortText(what: string, emptyMessage = `${what} cannot be empty.`, limit: number = SHORT_TEXT_LIMIT) {
  return z
    .string()
    .trim()
    .min(1, emptyMessage)
    .max(limit, `${what} is at most ${limit} characters.`)
    .refine(isPrintable, `${what} may not hold control characters (such as ESC or NUL).`);
}

/** A free-text note: printable apart from tabs and line breaks, at most `limit` characters. */
export function noteText(what: string, limit: number) {
  return z
    .string()
    .max(limit, `${what} is at most ${limit} characters.`)
    .refine((text) => !NOT_PRINTABLE_IN_NOTES.test(text), `${what} may not hold control characters other than tabs and line breaks.`);
}

/** JSON text whose strings cannot drive a terminal either: C1 controls and reordering characters as \u escapes (C0 ones JSON escapes itself). */
export function visibleJson(value: unknown): string {
  return JSON.stringify(value).replace(/[\u007F-\u009F\u2028\u2029\u202A-\u202E\u2066-\u2069]/g, (character) => `\\u${character.charCodeAt(0).toString(16).padStart(4, '0')}`);
}

/**
 * Text from a stored record made safe to print on a terminal: every control or reordering
 * character becomes a visible \u{XX} escape, so an old record cannot move the cursor, clear the
 * screen or reorder a line.
 */
export function visibleText(text: string): string {
  return text.replace(NOT_PRINTABLE_ALL, (character) => `\\u{${character.codePointAt(0)!.toString(16).toUpperCase()}}`);
}
