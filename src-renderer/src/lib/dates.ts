/**
 * One way of writing dates and times on screen: the operating system's locale, medium date and
 * short time ("5 Dec 2026, 12:20" or "Dec 5, 2026, 12:20 PM" as the locale has it). Files carry
 * ISO 8601 (journals, plan files, CSV, the record); only the screens use this.
 */
const dateTime = new Intl.DateTimeFormat(undefined, { dateStyle: 'medium', timeStyle: 'short' });
const dateOnly = new Intl.DateTimeFormat(undefined, { dateStyle: 'medium' });
const timeOnly = new Intl.DateTimeFormat(undefined, { timeStyle: 'medium' });

function parsed(iso: string | null | undefined): Date | null {
  if (!iso) return null;
  const date = new Date(iso);
  return Number.isNaN(date.getTime()) ? null : date;
}

/** Date and time of an ISO 8601 instant, in this computer's locale and time zone; a dash for none. */
export function dateTimeText(iso: string | null | undefined): string {
  const date = parsed(iso);
  return date === null ? '–' : dateTime.format(date);
}

/** The date alone. */
export function dateText(iso: string | null | undefined): string {
  const date = parsed(iso);
  return date === null ? '–' : dateOnly.format(date);
}

/** The time of day alone, with seconds (entries of one run). */
export function timeText(iso: string | null | undefined): string {
  const date = parsed(iso);
  return date === null ? '–' : timeOnly.format(date);
}
