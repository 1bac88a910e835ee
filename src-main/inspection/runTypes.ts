/**
 * The shapes of a run: what its journal entries carry (checked with zod on replay) and what the
 * run service hands out.
 */
import { z } from 'zod';
import type { RunOutcome } from './runOutcome.js';
import type { EvidenceState, Observation } from '../engine/index.js';
import { JOURNAL_FORMAT, planVersionSchema, type JournalProblem, type PlanVersion, type QuarantineRecord } from '../store/index.js';

import type { Decision } from '../engine/index.js';
export type { Decision };
export type { MeasurementObservation as MeasurementResult, LifetimeObservation as LifetimeResult, GradedObservation as GradedResult } from '../engine/index.js';
/**
 * One entry's result, per model: passfail 'pass' | 'fail'; count a whole number >= 0; measurement
 * `{value}`; lifetime `{time}` or `{failure: true, time?}`; graded `{grade}`.
 */
export type ItemResult = Observation;

const finiteNumber = z.number().finite();
/** The shape of a result, any model; which one a run takes is checked against its plan (resultProblem). */
export const itemResultSchema = z.union(
  [
    z.literal('pass'),
    z.literal('fail'),
    z.number().int('A count is a whole number.').nonnegative('A count is 0 or more.'),
    z.strictObject({ value: finiteNumber }),
    z.strictObject({ time: finiteNumber.nonnegative('A test time is 0 or more.') }),
    z.strictObject({ failure: z.literal(true), time: finiteNumber.nonnegative('A test time is 0 or more.').optional() }),
    z.strictObject({ grade: z.string().trim().min(1, 'A grade names a class.').max(120) }),
  ],
  { error: 'A result is "pass" or "fail", a whole number of 0 or more, {value}, {time}, {failure: true, time?} or {grade}.' },
);

export const runRecordSchema = z.object({
  id: z.string().min(1),
  planId: z.string().min(1),
  planVersion: z.number().int().positive(),
  sourceId: z.string().min(1),
  lot: z.string().min(1),
  lotSize: z.number().int().positive().nullable(),
  inspector: z.string().nullable(),
  note: z.string().nullable(),
  createdAt: z.string(),
});
export type RunRecord = z.infer<typeof runRecordSchema>;

export const runHeaderSchema = z.object({
  format: z.literal(JOURNAL_FORMAT),
  run: runRecordSchema,
  plan: planVersionSchema,
  source: z.object({ id: z.string(), name: z.string() }),
});
export interface RunHeader {
  readonly format: typeof JOURNAL_FORMAT;
  readonly run: RunRecord;
  readonly plan: PlanVersion;
  readonly source: { readonly id: string; readonly name: string };
}

export const resultPayloadSchema = z.object({
  itemId: z.string().nullable(),
  result: itemResultSchema,
  category: z.string().nullable(),
  note: z.string().nullable(),
});
export type ResultPayload = z.infer<typeof resultPayloadSchema>;

export const voidPayloadSchema = z.object({ target: z.number().int().positive(), reason: z.string().min(1) });
export type VoidPayload = z.infer<typeof voidPayloadSchema>;

export const overridePayloadSchema = z.object({ reason: z.string().min(1) });
export type OverridePayload = z.infer<typeof overridePayloadSchema>;

export const closePayloadSchema = z.object({
  decision: z.enum(['accept', 'reject']),
  rule: z.string(),
  n: z.number().int().nonnegative(),
  /** Nonconforming items, nonconformities, the sum of measurements (may be negative), failures or demerits. */
  total: z.number(),
  llr: z.number(),
});
export type ClosePayload = z.infer<typeof closePayloadSchema>;

/** One result as a reader sees it: voided entries stay, marked. */
export interface RunEntryView {
  readonly seq: number;
  readonly time: string;
  readonly offset: string;
  readonly itemId: string | null;
  readonly result: ItemResult;
  readonly category: string | null;
  readonly note: string | null;
  readonly actor: string;
  readonly voided: boolean;
  readonly voidReason: string | null;
}

/**
 * The statistics of a run now (the engine's evidence state). Common: decision, rule (null while
 * continuing), llr, n, total.
 * - passfail / count (no `model` field): n items, total nonconforming items or nonconformities.
 * - measurement: n values, total = sum, plus `sum` and `mean` (null before the first value).
 * - lifetime: n counted entries, total = failures, plus `time` (accumulated test time; at a decision
 *   by a time reading, the time the line was reached) and `failures`.
 * - graded: n items, total = demerits, plus `counts` per class (in the plan's class order) and `demerits`.
 */
export type RunState = EvidenceState;
export type {
  LinearCountEvidenceState as CountRunState,
  MeasurementEvidenceState as MeasurementRunState,
  LifetimeEvidenceState as LifetimeRunState,
  GradedEvidenceState as GradedRunState,
} from '../engine/index.js';

export type RunStatus = 'open' | 'closed';

export interface RunView {
  readonly run: RunRecord & {
    readonly status: RunStatus;
    readonly sourceName: string;
    readonly closedAt: string | null;
    readonly decision: Decision | null;
    readonly rule: string | null;
    readonly fingerprint: string | null;
  };
  /** Where the run stands, in the words every place uses. */
  readonly outcome: RunOutcome;
  readonly plan: PlanVersion;
  readonly entries: RunEntryView[];
  readonly state: RunState;
  /** False when the journal is damaged (read-only) or another process is writing it. */
  readonly writable: boolean;
  readonly problems: JournalProblem[];
  /** Set when opening this run moved a torn final line to quarantine. */
  readonly recovered: QuarantineRecord | null;
}
