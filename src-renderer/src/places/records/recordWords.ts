/** Words and numbers as the Records place prints them. */
import { OUTCOME_WORDS, type RunOutcome } from '../../../../src-main/inspection/runOutcome';

/** The outcome word as a heading or a table cell: "Accepted", "Reopened after a decision". */
export function outcomeTitle(outcome: RunOutcome): string {
  const word = OUTCOME_WORDS[outcome];
  return `${word[0].toUpperCase()}${word.slice(1)}`;
}

/** "2025-03-14 08:02" from "2025-03-14T08:02:11+01:00": the inspector's clock, as recorded. */
export function recordedTime(iso: string | null): string {
  return iso === null ? '–' : `${iso.slice(0, 10)} ${iso.slice(11, 16)}`;
}

/** A figure with up to four significant digits and no exponent for everyday sizes. */
export function significant(value: number): string {
  if (value === 0) return '0';
  return Math.abs(value) < 1e-4 ? value.toExponential(2) : String(Number(value.toPrecision(4)));
}
