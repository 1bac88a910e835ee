import { lifetimeWork } from './lifetimeWork.js';
import { lifetimeRecordLines } from './lifetimeRecordLines.js';
import type { LifetimeSpec } from '../../spec.js';
import type { EvidenceDecision, SequentialModel } from '../sequentialModel.js';
import { designLifetimePlan, lifetimeLiveState, type LifetimeDesign, type LifetimeLiveState } from './lifetimeDesign.js';
import { acceptTime, decideLifetime, lifetimeLimitRows, lifetimePlan, type LifetimePlan } from './lifetimePlan.js';

/** A reading of accumulated test time, or a failure (at an accumulated time, when given). */
export type LifetimeObservation = { readonly time: number } | { readonly failure: true; readonly time?: number };

/** Entries counted, the accumulated test time (readings never go down) and the failures counted. */
export interface LifetimeEvidence {
  readonly n: number;
  readonly time: number;
  readonly failures: number;
}

/**
 * The decision on a lifetime test: total = failures; `time` is the accumulated test time, and at a
 * decision by a time reading the time the line was reached.
 */
export interface LifetimeEvidenceState extends EvidenceDecision {
  readonly model: 'lifetime';
  readonly time: number;
  readonly failures: number;
}

/** One row of the lifetime limits: per failure count, the time that accepts and the latest failure time that rejects. */
export interface LifetimeLimitRow {
  failures: number;
  acceptTime: number | null;
  rejectTime: number | null;
}

const isRecord = (value: unknown): value is Record<string, unknown> => typeof value === 'object' && value !== null && !Array.isArray(value);
const hasOnly = (value: Record<string, unknown>, keys: readonly string[]) => Object.keys(value).every((key) => keys.includes(key));

function lifetimeState(plan: LifetimePlan, evidence: LifetimeEvidence): LifetimeEvidenceState {
  const decided = decideLifetime(plan, evidence.time, evidence.failures);
  // A time reading past a line decided where the line was reached, not at the reading.
  let time = decided.decision !== 'continue' && plan.maxTime !== null ? Math.min(evidence.time, plan.maxTime) : evidence.time;
  if (decided.rule === 'acceptance line crossed') time = Math.min(time, acceptTime(plan, evidence.failures));
  const llr = decided.decision === 'continue' ? decided.llr : evidence.failures * plan.llrPerFailure - time * plan.llrPerTime;
  return {
    model: 'lifetime',
    decision: decided.decision,
    rule: decided.decision === 'continue' ? null : decided.rule,
    standing: decided.rule,
    llr,
    n: evidence.n,
    total: evidence.failures,
    time,
    failures: evidence.failures,
  };
}

function observeLifetime(plan: LifetimePlan, evidence: LifetimeEvidence, result: LifetimeObservation): LifetimeEvidence {
  const time = result.time === undefined ? evidence.time : Math.max(evidence.time, result.time);
  let failures = evidence.failures;
  // A failure reported at a time that already decided came after the decision: it is not counted.
  if ('failure' in result && decideLifetime(plan, time, failures).decision === 'continue') failures += 1;
  return { n: evidence.n + 1, time, failures };
}

/**
 * Exponential times to failure: the evidence is the accumulated test time T and the failures r. A
 * failure given with a time first moves T there; if that time alone decides, the failure is not counted.
 *
 * Method: LLR = r ln(theta0/theta1) - T (1/theta1 - 1/theta0); decision by decideLifetime,
 * look-ahead and design by the recursion over failures (lifetimeDesign).
 * References: Epstein, B. and Sobel, M. (1955), "Sequential life tests in the exponential case",
 * Ann. Math. Statist. 26(1); Wald, A. (1947), Sequential Analysis, ch. 5.
 */
export const lifetimeModel: SequentialModel<{
  spec: LifetimeSpec;
  plan: LifetimePlan;
  evidence: LifetimeEvidence;
  observation: LifetimeObservation;
  state: LifetimeEvidenceState;
  live: LifetimeLiveState & { readonly model: 'lifetime' };
  row: LifetimeLimitRow;
  design: LifetimeDesign;
}> = {
  name: 'lifetime',
  labels: { title: 'lifetime', quality: 'theta', hypotheses: ['theta0', 'theta1'], entry: ['entry', 'entries'] },
  plan: lifetimePlan,
  emptyEvidence: () => ({ n: 0, time: 0, failures: 0 }),
  observationProblem(_plan, result, evidence) {
    const allowed = '{ "time": T } (a reading of accumulated test time) or { "failure": true } with an optional "time"';
    const failure = isRecord(result) && result.failure === true && hasOnly(result, ['failure', 'time']);
    const reading = isRecord(result) && hasOnly(result, ['time']) && result.time !== undefined;
    if (!failure && !reading) return `a lifetime plan takes ${allowed}, not ${JSON.stringify(result)}`;
    const time = (result as Record<string, unknown>).time;
    if (time === undefined) return null;
    if (typeof time !== 'number' || !Number.isFinite(time) || time < 0) return `a test time is a number of 0 or more, not ${JSON.stringify(time)}`;
    return time < evidence.time ? `accumulated test time never goes down: it is ${evidence.time} now, so ${time} is not allowed` : null;
  },
  canonical: (_plan, result) => result,
  observe: observeLifetime,
  llrStep: (plan, evidence, result) => lifetimeState(plan, observeLifetime(plan, evidence, result)).llr - lifetimeState(plan, evidence).llr,
  state: lifetimeState,
  liveState: (plan, state) => ({ model: 'lifetime', ...lifetimeLiveState(plan.spec, state.time, state.failures) }),
  limitRows: (plan, horizon) => lifetimeLimitRows(plan, plan.maxFailures === null ? horizon : Math.min(horizon, plan.maxFailures)),
  estimateWork: lifetimeWork,
  design: designLifetimePlan,
  recordLines: lifetimeRecordLines,
};
