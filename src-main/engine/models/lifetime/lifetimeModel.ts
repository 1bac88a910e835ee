import { lifetimeWork } from './lifetimeWork.js';
import { lifetimeRecordLines } from './lifetimeRecordLines.js';
import type { LifetimeSpec } from '../../spec.js';
import { countOf } from '../../countWords.js';
import { NUMBER_TEXT, formatNumber } from '../../numberText.js';
import { RISK_FLAGS, RISK_USAGE, UNIT_FLAG, UNIT_USAGE, risksFrom, unitFrom } from '../commonPlanFlags.js';
import { frameHorizon, type EntryText, type EvidenceDecision, type SequentialModel } from '../sequentialModel.js';
import { readableLifetimePlan } from './lifetimeText.js';
import { designLifetimePlan, lifetimeLiveState, type LifetimeDesign, type LifetimeLiveState } from './lifetimeDesign.js';
import { acceptTime, decideLifetime, lifetimeBoundaries, lifetimeLimitRows, lifetimePlan, type LifetimePlan } from './lifetimePlan.js';

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

/** Lifetime: per failure count, the accumulated test time that accepts and the latest failure time that rejects. */
export interface LifetimeFrame {
  readonly model: 'lifetime';
  /** The largest failure count drawn. */
  readonly horizon: number;
  readonly limits: LifetimeLimitRow[];
  readonly lnA: number;
  readonly lnB: number;
  readonly truncation: null;
  readonly maxTime: number | null;
  readonly maxFailures: number | null;
  readonly unit: string | null;
}

/** Failure counts drawn at least, for a lifetime chart. */
const MINIMUM_FAILURES = 3;

/**
 * One typed line as a lifetime entry: `time T` (accumulated test time), `fail` (a failure now) or
 * `fail T` (time reaches T, then a failure).
 */
function parseLifetimeText(text: string): EntryText<LifetimeObservation> {
  const match = /^(time|fail)(?:\s+(\S+))?$/i.exec(text);
  const at = match?.[2];
  const allowed = `${JSON.stringify(text)} is not "time T", "fail" or "fail T" (T the accumulated test time, a number of 0 or more)`;
  if (match === null || (at !== undefined && !NUMBER_TEXT.test(at)) || (at !== undefined && Number(at) < 0)) return { problem: allowed };
  if (match[1].toLowerCase() === 'time') return at === undefined ? { problem: allowed } : { result: { time: Number(at) } };
  return { result: at === undefined ? { failure: true } : { failure: true, time: Number(at) } };
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
  frame: LifetimeFrame;
}> = {
  name: 'lifetime',
  labels: { title: 'lifetime', quality: 'theta', hypotheses: ['theta0', 'theta1'], entry: ['entry', 'entries'], pooledRate: null },
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
  frame(plan, live) {
    // Failure counts far enough to show the next possible rejection, and the first one of the plan.
    const horizon = frameHorizon({
      reached: live.failures,
      reach: live.failures + Math.max(1, live.failuresToReject ?? 0),
      minimum: Math.max(MINIMUM_FAILURES, lifetimeBoundaries(plan).firstRejectFailures),
      limit: plan.maxFailures,
    });
    return {
      model: 'lifetime',
      horizon,
      limits: lifetimeLimitRows(plan, horizon),
      lnA: plan.lnA,
      lnB: plan.lnB,
      truncation: null,
      maxTime: plan.maxTime,
      maxFailures: plan.maxFailures,
      unit: plan.spec.unit ?? null,
    };
  },
  point: (state) => ({ n: state.n, total: state.total, llr: state.llr, time: state.time }),
  // The next failure, an exponential time with mean `quality` (the MTBF) after the test time so far, by inversion.
  drawObservation: (_plan, evidence, quality, uniform) => ({ failure: true, time: evidence.time - quality * Math.log1p(-uniform()) }),
  parseEntryText: (_plan, text) => parseLifetimeText(text),
  flags: {
    own: [{ name: 'theta0', kind: 'positive' }, { name: 'theta1', kind: 'positive' }, ...RISK_FLAGS, { name: 'max-time', kind: 'positive' }, { name: 'max-failures', kind: 'integer', min: 1 }, UNIT_FLAG],
    usage: [
      '  --model lifetime           exponential times to failure:',
      '     --theta0 T --theta1 T [--max-time T] [--max-failures R]   (theta1 < theta0, MTBF in your time unit)',
      RISK_USAGE,
      UNIT_USAGE,
    ],
    spec(read) {
      const risks = risksFrom(read);
      const theta0 = read.need<number>('theta0');
      const theta1 = read.need<number>('theta1');
      return {
        model: 'lifetime',
        theta0,
        theta1,
        ...risks,
        maxTime: read.given<number>('max-time') ?? null,
        maxFailures: read.given<number>('max-failures') ?? null,
        ...unitFrom(read),
      };
    },
  },
  text: {
    result: (observation) => ('failure' in observation ? (observation.time === undefined ? 'fail' : `fail ${observation.time}`) : `time ${observation.time}`),
    evidence: (state) => `test time = ${formatNumber(state.time)}, failures = ${state.failures}`,
    evidenceColumn: 'evidence',
    evidenceCell: (state) => `T ${formatNumber(state.time)}, r ${state.failures}`,
    reached: (state) => `after ${countOf(state.n, 'entry', 'entries')}, T ${formatNumber(state.time)}, r ${state.failures}`,
    design: readableLifetimePlan,
  },
  json: {
    state: (state) => ({ time: state.time, failures: state.failures }),
    summary: (state) => ({ time: state.time, failures: state.failures }),
  },
  recordLines: lifetimeRecordLines,
};
