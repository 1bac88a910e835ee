/** Words and numbers as the Records place prints them. */
import type { HistoryDecision } from '../../../../src-main/record/runHistory';

export const DECISION_WORDS: Record<HistoryDecision, string> = { accept: 'Accepted', reject: 'Rejected', undecided: 'Undecided' };

/** "2025-03-14 08:02" from "2025-03-14T08:02:11+01:00": the inspector's clock, as recorded. */
export function recordedTime(iso: string | null): string {
  return iso === null ? '–' : `${iso.slice(0, 10)} ${iso.slice(11, 16)}`;
}
