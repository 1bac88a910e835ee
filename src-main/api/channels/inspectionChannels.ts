/**
 * The Inspect place's channels. Shapes per plan model (the run's `plan.spec.model`):
 *
 * `inspection.record` `result`:
 *   passfail 'pass' | 'fail'; count a whole number >= 0; measurement `{ value: number }`;
 *   lifetime `{ time: number }` (a reading of accumulated test time, never below the last one) or
 *   `{ failure: true, time?: number }` (time first, when given, then one failure);
 *   graded `{ grade: string }` (one of the plan's class names).
 *
 * `state` (RunState, inspection/runTypes.ts): `{ decision, rule, llr, n, total }` and the model's own
 *   fields, as its evidence state type in engine/models/<model>/ says: passfail/count none and no
 *   `model` field (total = nonconforming items / nonconformities); measurement `sum, mean`
 *   (total = sum); lifetime `time, failures` (n = counted entries, total = failures); graded
 *   `counts, demerits` (total = demerits). Every other model carries its name in `model`.
 *
 * `live` (InspectionLive): the model's live state (`liveState` of its SequentialModel), e.g.
 *   `linearCountLiveState` for passfail/count (no `model` field).
 *
 * `frame` (InspectionFrame): what the evidence chart draws the run against, the model's `frame`
 *   (LinearCountFrame, MeasurementFrame, LifetimeFrame, GradedFrame in its folder); `horizon`,
 *   `limits`, `lnA`, `lnB`, `truncation` mean what they mean in the pass/fail frame:
 *   passfail/count: limits `{ n, accept, reject }` in nonconforming items/nonconformities;
 *   measurement: limits `{ n, accept, reject }` of the running sum (plan unit) vs n, `rejectWhen`, `unit`;
 *   lifetime: limits `{ failures, acceptTime, rejectTime }` (accumulated test time per failure count,
 *     null where that line does not apply), horizon = last failure count drawn, `maxTime`,
 *     `maxFailures`, `unit`, truncation always null;
 *   graded: limits `{ n, accept, reject }` in demerits vs n, `demerits` per class.
 *
 * An entry's `after` is `{ n, total, llr }` (the chart point: n vs total), and for lifetime also
 * `time` (the point is failures = total vs time).
 */
import { z } from 'zod';
import { idSchema } from '../../store/ids.js';
import { shortText } from '../../store/textFields.js';
import {
  itemResultSchema,
  type InspectionEntry,
  type InspectionFrame,
  type InspectionLive,
  type RunRow,
  type RunState,
  type RunView,
} from '../../inspection/index.js';

export type { EvidenceFrame, GradedFrame, InspectionEntry, InspectionFrame, InspectionLive, LifetimeFrame, MeasurementFrame } from '../../inspection/index.js';

/** Run ids become file names: the same characters the store allows. */
const runId = idSchema('run');
const optionalText = (limit: number) => z.string().max(limit).nullable().optional();
/** Who made an entry; the run's inspector when left out. */
const actor = shortText('The name of who made the entry').optional();

/** Channels of the Inspect place. Sources and plan versions for the start form come from the plan channels. */
export const inspectionChannels = {
  /** Starts a run of one plan version on one lot of a source. */
  'inspection.start': {
    input: z.object({
      planId: idSchema('plan'),
      planVersion: z.number().int().positive().optional(),
      sourceId: z.string().min(1, 'Choose the source of the lot.').pipe(idSchema('source')),
      lot: shortText('A lot or batch id', 'A run needs a lot or batch id.'),
      lotSize: z.number().int('The lot size is a whole number of items.').positive('The lot size is at least 1 item.').nullable().optional(),
      inspector: optionalText(120),
      note: optionalText(2000),
    }),
  },
  /** Every run in the data folder, newest first, from the run catalogue (a damaged journal is one damaged row). */
  'inspection.list': { input: z.null().optional() },
  /** One run with its entries, state and live look-ahead: an unfinished run continues from here. */
  'inspection.open': { input: z.object({ runId }) },
  /** Whether another program (e.g. a `feed`) holds the run's journal now; cheap, for polling a read-only view. */
  'inspection.held': { input: z.object({ runId }) },
  /** Appends one result; answers once it is written and fsync'd. */
  'inspection.record': {
    input: z.object({
      runId,
      itemId: optionalText(200),
      result: itemResultSchema,
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

/** A run as the Inspect place shows it. */
export interface InspectionRunView extends Omit<RunView, 'entries'> {
  readonly entries: InspectionEntry[];
  readonly live: InspectionLive;
  readonly frame: InspectionFrame;
}

/** The answer to an append (result, void, override): only what changed, so a long run stays cheap. */
export interface InspectionStep {
  readonly seq: number;
  readonly kind: 'result' | 'void' | 'override';
  /** The entry taken (result) or the entry voided, as it now reads. */
  readonly entry: InspectionEntry | null;
  readonly run: Pick<InspectionRunView['run'], 'status' | 'decision' | 'rule' | 'closedAt'>;
  readonly state: RunState;
  readonly live: InspectionLive;
  readonly frame: InspectionFrame;
}

export interface InspectionChannelOutputs {
  'inspection.start': InspectionRunView;
  'inspection.list': RunRow[];
  'inspection.open': InspectionRunView;
  'inspection.held': { held: boolean };
  'inspection.record': InspectionStep;
  'inspection.void': InspectionStep;
  'inspection.override': InspectionStep;
}
