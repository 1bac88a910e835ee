import { z } from 'zod';
import type { LimitRow, LiveState } from '../../engine/index.js';
import type { RunEntryView, RunState, RunSummary, RunView } from '../../inspection/index.js';

/** Run ids become file names: the same characters the store allows. */
const runId = z.string().regex(/^[A-Za-z0-9][A-Za-z0-9._-]{0,79}$/, 'A run id is letters, digits, ".", "_" or "-".');
const optionalText = (limit: number) => z.string().max(limit).nullable().optional();
/** Who made an entry; the run's inspector when left out. */
const actor = z.string().trim().min(1).max(120).optional();

/** Channels of the Inspect place. Sources and plan versions for the start form come from the plan channels. */
export const inspectionChannels = {
  /** Starts a run of one plan version on one lot of a source. */
  'inspection.start': {
    input: z.object({
      planId: z.string().min(1).max(80),
      planVersion: z.number().int().positive().optional(),
      sourceId: z.string().min(1, 'Choose the source of the lot.').max(80),
      lot: z.string().trim().min(1, 'A run needs a lot or batch id.').max(120),
      lotSize: z.number().int('The lot size is a whole number of items.').positive('The lot size is at least 1 item.').nullable().optional(),
      inspector: optionalText(120),
      note: optionalText(2000),
    }),
  },
  /** Every run in the data folder, newest first, each journal verified. */
  'inspection.list': { input: z.null().optional() },
  /** One run with its entries, state and live look-ahead: an unfinished run continues from here. */
  'inspection.open': { input: z.object({ runId }) },
  /** Appends one result; answers once it is written and fsync'd. */
  'inspection.record': {
    input: z.object({
      runId,
      itemId: optionalText(200),
      result: z.union([z.literal('pass'), z.literal('fail'), z.number().int('A count is a whole number.').nonnegative('A count is 0 or more.')]),
      category: optionalText(120),
      note: optionalText(2000),
      actor,
    }),
  },
  /** Voids the last counted result with a reason; the entry stays in the journal, struck through. */
  'inspection.void': { input: z.object({ runId, reason: z.string().trim().min(1, 'Say why the entry is voided.').max(2000), actor }) },
  /** Records the reason for entering more after the run closed with a decision; the next entry is then taken. */
  'inspection.override': {
    input: z.object({ runId, reason: z.string().trim().min(1, 'Say why more entries are needed after the decision.').max(2000), actor }),
  },
} as const;

/** A result with the statistics after it, for the evidence path; `after` is null for a voided entry. */
export interface InspectionEntry extends RunEntryView {
  readonly after: { readonly n: number; readonly total: number; readonly llr: number } | null;
}

/**
 * What the evidence chart draws the run against: the acceptance and rejection numbers for item
 * counts 1..horizon (a row at the truncation holds the truncation rule) and the LLR limits of the
 * lines in use.
 */
export interface EvidenceFrame {
  readonly horizon: number;
  readonly limits: LimitRow[];
  readonly lnA: number;
  readonly lnB: number;
  readonly truncation: number | null;
}

/** A run as the Inspect place shows it. */
export interface InspectionRunView extends Omit<RunView, 'entries'> {
  readonly entries: InspectionEntry[];
  readonly live: LiveState;
  readonly frame: EvidenceFrame;
}

/** The answer to an append (result, void, override): only what changed, so a long run stays cheap. */
export interface InspectionStep {
  readonly seq: number;
  readonly kind: 'result' | 'void' | 'override';
  /** The entry taken (result) or the entry voided, as it now reads. */
  readonly entry: InspectionEntry | null;
  readonly run: Pick<InspectionRunView['run'], 'status' | 'decision' | 'rule' | 'closedAt'>;
  readonly state: RunState;
  readonly live: LiveState;
  readonly frame: EvidenceFrame;
}

export interface InspectionChannelOutputs {
  'inspection.start': InspectionRunView;
  'inspection.list': RunSummary[];
  'inspection.open': InspectionRunView;
  'inspection.record': InspectionStep;
  'inspection.void': InspectionStep;
  'inspection.override': InspectionStep;
}
