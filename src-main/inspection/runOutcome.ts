/**
 * Where a run stands, in one word every place of the app and every document uses. Pure, with no
 * imports, so the renderer can take the words as they are.
 *
 * - open: no decision has been reached yet.
 * - accepted / rejected: the run closed with that decision and it stands.
 * - reopened: the run reached a decision, then an override with a reason reopened it, and it has
 *   not closed again; no decision stands.
 * - damaged: the journal does not verify or does not replay; its good entries can be read, never written.
 */
export type RunOutcome = 'open' | 'accepted' | 'rejected' | 'reopened' | 'damaged';

export const RUN_OUTCOMES: readonly RunOutcome[] = ['open', 'accepted', 'rejected', 'reopened', 'damaged'];

/** The outcome as it is printed, on screens, in the CLI and in the decision record. */
export const OUTCOME_WORDS: Readonly<Record<RunOutcome, string>> = {
  open: 'open',
  accepted: 'accepted',
  rejected: 'rejected',
  reopened: 'reopened after a decision',
  damaged: 'damaged',
};

/** The state shape a screen draws for an outcome: a standing decision, or still going. */
export function outcomeShape(outcome: RunOutcome): 'accept' | 'reject' | 'continue' {
  if (outcome === 'accepted') return 'accept';
  if (outcome === 'rejected') return 'reject';
  return 'continue';
}
