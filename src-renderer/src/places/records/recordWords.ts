/** Words and numbers as the Records place prints them. */
import type { HistoryDecision } from '../../../../src-main/record/runHistory';

export const DECISION_WORDS: Record<HistoryDecision, string> = { accept: 'Accepted', reject: 'Rejected', undecided: 'Undecided' };

