import type { PoissonSprtLines } from './poissonSprtExact.js';
import { PlanParameterError } from '../../errors.js';
import type { Decision } from '../../integerLines.js';
import type { LifetimeSpec } from '../../spec.js';
import { checkRisksAndTruncation } from '../../validate.js';
import { waldLimits } from '../../waldBoundaries.js';
import type { IncrementLaw } from '../../waldCurve.js';

/** Largest failure count at which a test stops (README "Limits"): the limits table and the exact evaluation grow with it. */
export const MAX_FAILURES = 10_000;

/** A validated lifetime plan: the constants every later call uses. Times are in the spec's unit. */
export interface LifetimePlan {
  readonly spec: LifetimeSpec;
  /** Discrimination ratio d = theta0/theta1 > 1. */
  readonly ratio: number;
  /** ln d: the LLR added by one failure. */
  readonly llrPerFailure: number;
  /** 1/theta1 - 1/theta0: the LLR lost per unit of test time. */
  readonly llrPerTime: number;
  readonly lnA: number;
  readonly lnB: number;
  readonly maxTime: number | null;
  readonly maxFailures: number | null;
}

const GUARD = 1e-12;

/**
 * Validates a lifetime spec once and returns the plan's constants.
 *
 * Method: LLR(T, r) = r ln(theta0/theta1) - T (1/theta1 - 1/theta0); Wald's ln A, ln B.
 * References: Epstein, B. and Sobel, M. (1955), "Sequential life tests in the exponential case",
 * Ann. Math. Statist. 26(1); Wald, A. (1947), Sequential Analysis, §3.2; Epstein and Sobel 1955 lines (computed independently).
 *
 * @throws PlanParameterError naming the parameter, its value and what is allowed.
 */
export function lifetimePlan(spec: LifetimeSpec): LifetimePlan {
  if (spec === null || typeof spec !== 'object') throw new PlanParameterError('spec', spec, 'a plan specification object');
  for (const name of ['theta0', 'theta1'] as const) {
    const value = spec[name];
    if (typeof value !== 'number' || !Number.isFinite(value) || value <= 0) {
      throw new PlanParameterError(name, value, 'a number greater than 0');
    }
  }
  if (!(spec.theta1 < spec.theta0)) {
    throw new PlanParameterError(
      'theta1',
      spec.theta1,
      'less than theta0',
      `theta1 must be less than theta0 (got theta0 = ${spec.theta0}, theta1 = ${spec.theta1})`,
    );
  }
  checkRisksAndTruncation({ alpha: spec.alpha, beta: spec.beta });
  const maxTime = spec.maxTime ?? null;
  if (maxTime !== null && (typeof maxTime !== 'number' || !Number.isFinite(maxTime) || maxTime <= 0)) {
    throw new PlanParameterError('maxTime', maxTime, 'a number greater than 0 or null');
  }
  const maxFailures = spec.maxFailures ?? null;
  if (maxFailures !== null && (typeof maxFailures !== 'number' || !Number.isInteger(maxFailures) || maxFailures < 1 || maxFailures > MAX_FAILURES)) {
    throw new PlanParameterError('maxFailures', maxFailures, `an integer from 1 to ${MAX_FAILURES} or none`);
  }
  if (spec.unit !== undefined && typeof spec.unit !== 'string') throw new PlanParameterError('unit', spec.unit, 'a text');
  const ratio = spec.theta0 / spec.theta1;
  const { lnA, lnB } = waldLimits(spec.alpha, spec.beta);
  return {
    spec,
    ratio,
    llrPerFailure: Math.log(ratio),
    llrPerTime: 1 / spec.theta1 - 1 / spec.theta0,
    lnA,
    lnB,
    maxTime,
    maxFailures,
  };
}

/** LLR after accumulated test time T with r failures: r ln d - T (1/theta1 - 1/theta0). */
export function lifetimeLogLikelihoodRatio(plan: LifetimePlan, time: number, failures: number): number {
  return failures * plan.llrPerFailure - time * plan.llrPerTime;
}

/** Accept and reject lines in (T, r), in the spec's unit of time. */
export interface LifetimeBoundaries {
  lnA: number;
  lnB: number;
  discriminationRatio: number;
  /** Test time to accept with no failure: -ln B/(1/theta1 - 1/theta0). */
  acceptTimeAtZero: number;
  /** Time added to both lines by each failure: ln d/(1/theta1 - 1/theta0). */
  timePerFailure: number;
  /** Reject at the r-th failure if T <= r timePerFailure - rejectOffset; rejectOffset = ln A/(1/theta1 - 1/theta0). */
  rejectOffset: number;
  /** Fewest failures with which rejection is possible at a positive time: floor(ln A/ln d) + 1. */
  firstRejectFailures: number;
}

/**
 * The lines in (T, r).
 *
 * Method: accept when T >= (r ln d - ln B)/c, reject at a failure when T <= (r ln d - ln A)/c,
 * c = 1/theta1 - 1/theta0; rejection needs r ln d >= ln A.
 * References: Epstein, B. and Sobel, M. (1955), Ann. Math. Statist. 26(1), §3; MIL-HDBK-781A PRST
 * accept times at zero failures (from memory).
 */
export function lifetimeBoundaries(plan: LifetimePlan): LifetimeBoundaries {
  return {
    lnA: plan.lnA,
    lnB: plan.lnB,
    discriminationRatio: plan.ratio,
    acceptTimeAtZero: -plan.lnB / plan.llrPerTime,
    timePerFailure: plan.llrPerFailure / plan.llrPerTime,
    rejectOffset: plan.lnA / plan.llrPerTime,
    firstRejectFailures: Math.floor(plan.lnA / plan.llrPerFailure + 1e-9) + 1,
  };
}

/** Accept time after r failures (the test accepts when T reaches it with no further failure). */
export function acceptTime(plan: LifetimePlan, failures: number): number {
  return (failures * plan.llrPerFailure - plan.lnB) / plan.llrPerTime;
}

/** Reject time at the r-th failure (reject if that failure comes at or before it); negative when impossible. */
export function rejectTime(plan: LifetimePlan, failures: number): number {
  return (failures * plan.llrPerFailure - plan.lnA) / plan.llrPerTime;
}

/** Failures at the truncation time that still accept: the largest r with LLR(maxTime, r) <= 0. */
export function truncationAcceptFailures(plan: LifetimePlan): number {
  return plan.maxTime === null ? Number.MAX_SAFE_INTEGER : Math.floor((plan.maxTime * plan.llrPerTime) / plan.llrPerFailure + GUARD);
}

/**
 * The lines as seen from a running test at (T, r), for the exact evaluator.
 *
 * Method: the Poisson process is memoryless, so the rest of the test is the same test with the
 * lines moved by -T and the failure count by -r.
 * References: Epstein, B. and Sobel, M. (1955), Ann. Math. Statist. 26(1).
 */
export function remainingLines(plan: LifetimePlan, time: number, failures: number): PoissonSprtLines {
  return {
    acceptBase: acceptTime(plan, failures) - time,
    rejectBase: rejectTime(plan, failures) - time,
    step: plan.llrPerFailure / plan.llrPerTime,
    maxTime: plan.maxTime === null ? null : plan.maxTime - time,
    truncationAcceptFailures: truncationAcceptFailures(plan) - failures,
    maxFailures: plan.maxFailures === null ? null : plan.maxFailures - failures,
  };
}

/** The law of the LLR per unit of test time at MTBF theta, for Wald's OC and expected test time. */
export function lifetimeIncrementLaw(plan: LifetimePlan, theta: number): IncrementLaw {
  const rate = 1 / theta;
  const a = plan.llrPerFailure;
  const c = plan.llrPerTime;
  return {
    mean: rate * a - c,
    secondMoment: rate * a * a + (rate * a - c) ** 2,
    // Poisson count N in unit time: ln E[e^{h(a N - c)}] = rate (e^{h a} - 1) - h c.
    logMomentGenerating: (h) => rate * Math.expm1(h * a) - h * c,
  };
}

/** The decision at accumulated time T with r failures. */
export interface LifetimeDecision {
  decision: Decision;
  rule: string;
  llr: number;
}

/**
 * The decision from the evidence (T, r), as it stands after the latest entry.
 *
 * Method: reject iff LLR >= ln A (only a failure can raise the LLR); accept iff LLR <= ln B (time
 * reached the accept line); at the maxFailures-th failure reject; at T = maxTime accept iff
 * LLR <= 0 (r <= T c/ln d), else reject. T beyond maxTime counts as maxTime.
 * References: Wald, A. (1947), Sequential Analysis, §3.1; Epstein, B. and Sobel, M. (1955);
 * exact recursion over the integer lines (computed independently, checked by simulation) (truncation rules are a stated choice); MIL-HDBK-781A's truncation is not used.
 */
export function decideLifetime(plan: LifetimePlan, time: number, failures: number): LifetimeDecision {
  const atTime = plan.maxTime === null ? time : Math.min(time, plan.maxTime);
  const llr = lifetimeLogLikelihoodRatio(plan, atTime, failures);
  if (llr >= plan.lnA - GUARD) return { decision: 'reject', rule: 'rejection line crossed', llr };
  if (llr <= plan.lnB + GUARD) return { decision: 'accept', rule: 'acceptance line crossed', llr };
  if (plan.maxFailures !== null && failures >= plan.maxFailures) {
    return { decision: 'reject', rule: 'reject at the maximum number of failures', llr };
  }
  if (plan.maxTime !== null && time >= plan.maxTime) {
    return llr <= 0
      ? { decision: 'accept', rule: 'accept at the maximum test time', llr }
      : { decision: 'reject', rule: 'reject at the maximum test time', llr };
  }
  return { decision: 'continue', rule: 'between the lines', llr };
}

/**
 * Lifetime lines per failure count r = 0..rows: accept when T reaches acceptTime; reject at the r-th
 * failure if T <= rejectTime (null: not possible, or past the maximum time).
 *
 * Method: acceptTime = (r ln d - ln B)/c, rejectTime = (r ln d - ln A)/c, c = 1/theta1 - 1/theta0;
 * at maxFailures every undecided test rejects, so it can still be running until the previous accept time;
 * no reject time lies past maxTime, and the table ends at the first failure count that rejects at
 * any time up to maxTime (a test never reaches more failures undecided).
 * References: Epstein, B. and Sobel, M. (1955), Ann. Math. Statist. 26(1), §3.
 */
export function lifetimeLimitRows(plan: LifetimePlan, rows: number): Array<{ failures: number; acceptTime: number | null; rejectTime: number | null }> {
  const limits = [];
  const maxTime = plan.maxTime ?? Number.POSITIVE_INFINITY;
  for (let r = 0; r <= rows; r++) {
    const accept = acceptTime(plan, r);
    const reject = rejectTime(plan, r);
    const rejectAll = plan.maxFailures !== null && r >= plan.maxFailures;
    limits.push({
      failures: r,
      acceptTime: rejectAll || accept > maxTime ? null : accept,
      rejectTime: rejectAll ? Math.min(acceptTime(plan, r - 1), maxTime) : reject > 0 && r > 0 ? Math.min(reject, maxTime) : null,
    });
    // The r-th failure rejects at any time up to the maximum test time: more failures are never reached.
    if (reject >= maxTime && r > 0) break;
  }
  return limits;
}
