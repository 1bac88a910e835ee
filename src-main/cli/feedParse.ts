/**
 * One `feed` or `replay` input line as a result of the run's plan: blank and # comment lines are
 * skipped; the rest is read by the plan's model (`parseEntryText`): passfail `pass`/`fail` or 1/0;
 * count a whole number; measurement a number; lifetime `time T`, `fail` or `fail T`; graded a
 * class name or its 0-based index.
 */
import type { EntryText, SequentialPlan } from '../engine/index.js';
import type { ItemResult } from '../inspection/index.js';

export type FeedLine = EntryText<ItemResult> | null;

/** The result on one input line of a plan (`planOf(spec)`, made once per run), null for a blank or # comment line, or a sentence saying what is wrong. */
export function parseFeedLine(plan: SequentialPlan, line: string): FeedLine {
  const text = line.trim();
  if (text === '' || text.startsWith('#')) return null;
  return plan.parseEntryText(text);
}
