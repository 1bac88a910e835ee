/** Words and numbers as the Records place prints them. */
import { OUTCOME_WORDS, type RunOutcome } from '../../../../src-main/inspection/runOutcome';

/** The outcome word as a heading or a table cell: "Accepted", "Reopened after a decision". */
export function outcomeTitle(outcome: RunOutcome): string {
  const word = OUTCOME_WORDS[outcome];
  return `${word[0].toUpperCase()}${word.slice(1)}`;
}

