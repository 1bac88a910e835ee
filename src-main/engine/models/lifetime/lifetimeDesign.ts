import { evaluatePoissonSprt } from './poissonSprtExact.js';
import { PlanParameterError } from '../../errors.js';
import type { Decision } from '../../integerLines.js';
import { waldOperatingPoint } from '../../waldCurve.js';
import type { LifetimeSpec } from '../../spec.js';
import { checkInteger } from '../../validate.js';
import { countOf } from '../../countWords.js';
import type { KlDivergences } from '../linearCountDefinition.js';
import {
  acceptTime,
  decideLifetime,
  lifetimeBoundaries,
  lifetimeIncrementLaw,
  lifetimePlan,
  remainingLines,
  truncationAcceptFailures,
} from './lifetimePlan.js';
import type { LifetimeBoundaries, LifetimePlan } from './lifetimePlan.js';
import { fixedDurationPlan } from './fixedDurationPlan.js';
import { lifetimeLimitRows } from './lifetimePlan.js';
import type { FixedDurationPlan } from './fixedDurationPlan.js';

export interface LifetimeCurvePoint {
  /** True MTBF. */
  theta: number;
  ocWald: number;
  expectedTimeWald: number;
  ocExact: number;
  expectedTimeExact: number;
}

/** Everything shown about a lifetime plan. Times are in the spec's unit (e.g. unit-hours). */
export interface LifetimeDesign {
  model: 'lifetime';
  boundaries: LifetimeBoundaries;
  /** KL divergence per unit of test time (h0h1 at theta0, h1h0 at theta1), in nats. */
  kl: KlDivergences;
  /** KL divergence per observed lifetime: d - 1 - ln d and ln d + 1/d - 1. */
  klPerLifetime: KlDivergences;
  wald: { alpha: number; beta: number; expectedTimeH0: number; expectedTimeH1: number; expectedTimeMax: number };
  exact: { alpha: number; beta: number; expectedTimeH0: number; expectedTimeH1: number; undecided: number; method: string };
  /** The shortest fixed-duration test meeting both OC points. */
  single: FixedDurationPlan;
  /** Per failure count r: accept when T reaches acceptTime; reject at the r-th failure if T <= rejectTime (null: not possible). */
  limits: Array<{ failures: number; acceptTime: number | null; rejectTime: number | null }>;
  curve: LifetimeCurvePoint[];
  quality: 'theta';
  hypotheses: { theta0: number; theta1: number };
  risks: { alpha: number; beta: number };
  maxTime: number | null;
  maxFailures: number | null;
  truncationRule: string;
  saving: { h0: number; h1: number };
  unit: string | null;
}

const METHOD = 'piecewise-polynomial recursion over failures of the Poisson process (exact up to rounding)';

/**
 * Designs a lifetime (reliability demonstration) plan: the lines in (T, r), KL, Wald's OC and
 * expected test time, the exact ones, the shortest fixed-duration test, and curves over the MTBF.
 *
 * Method: Wald's OC and E[T] from the LLR per unit time (waldOperatingPoint), exact values by
 * evaluatePoissonSprt; the curve covers theta1/2 to 1.5 theta0.
 * References: Wald, A. (1947), Sequential Analysis, §3.2, §3.3, ch. 5; Epstein, B. and Sobel, M.
 * (1955), Ann. Math. Statist. 26(1); MIL-HDBK-781A fixed-duration plans (table from memory, risks computed with a Poisson CDF), Epstein and Sobel 1955 lines (computed independently), exact recursion over failures (computed independently by a time grid).
 *
 * @throws PlanParameterError for an invalid spec or curvePoints.
 */
export function designLifetimePlan(spec: LifetimeSpec, options: { curvePoints?: number } = {}): LifetimeDesign {
  const curvePoints = options.curvePoints ?? 51;
  if (!Number.isInteger(curvePoints) || curvePoints < 2 || curvePoints > 10001) {
    throw new PlanParameterError('curvePoints', curvePoints, 'an integer from 2 to 10001');
  }
  const plan = lifetimePlan(spec);
  const lines = remainingLines(plan, 0, 0);
  const waldAt = (theta: number) => waldOperatingPoint(lifetimeIncrementLaw(plan, theta), plan.lnA, plan.lnB);
  const wald0 = waldAt(spec.theta0);
  const wald1 = waldAt(spec.theta1);
  const neutralTheta = plan.llrPerFailure / plan.llrPerTime;
  const exact0 = evaluatePoissonSprt(lines, 1 / spec.theta0);
  const exact1 = evaluatePoissonSprt(lines, 1 / spec.theta1);
  const d = plan.ratio;
  const curve: LifetimeCurvePoint[] = [];
  const from = 0.5 * spec.theta1;
  const to = 1.5 * spec.theta0;
  for (let i = 0; i < curvePoints; i++) {
    const theta = from + ((to - from) * i) / (curvePoints - 1);
    const wald = waldAt(theta);
    const exact = evaluatePoissonSprt(lines, 1 / theta);
    curve.push({ theta, ocWald: wald.oc, expectedTimeWald: wald.asn, ocExact: exact.accept, expectedTimeExact: exact.expectedTime });
  }
  const single = fixedDurationPlan(spec.theta0, spec.theta1, spec.alpha, spec.beta);
  const boundaries = lifetimeBoundaries(plan);
  const rows = plan.maxFailures ?? Math.max(boundaries.firstRejectFailures, 3 * (single.acceptFailures + 1));
  const limits = lifetimeLimitRows(plan, rows);
  return {
    model: 'lifetime',
    boundaries,
    kl: { h0h1: (d - 1 - Math.log(d)) / spec.theta0, h1h0: (Math.log(d) + 1 / d - 1) / spec.theta1 },
    klPerLifetime: { h0h1: d - 1 - Math.log(d), h1h0: Math.log(d) + 1 / d - 1 },
    wald: {
      alpha: 1 - wald0.oc,
      beta: wald1.oc,
      expectedTimeH0: wald0.asn,
      expectedTimeH1: wald1.asn,
      expectedTimeMax: waldAt(neutralTheta).asn,
    },
    exact: {
      alpha: exact0.reject,
      beta: exact1.accept,
      expectedTimeH0: exact0.expectedTime,
      expectedTimeH1: exact1.expectedTime,
      undecided: Math.max(exact0.undecided, exact1.undecided),
      method: METHOD,
    },
    single,
    limits,
    curve,
    quality: 'theta',
    hypotheses: { theta0: spec.theta0, theta1: spec.theta1 },
    risks: { alpha: spec.alpha, beta: spec.beta },
    maxTime: plan.maxTime,
    maxFailures: plan.maxFailures,
    truncationRule: lifetimeTruncationRule(plan),
    saving: { h0: 1 - exact0.expectedTime / single.time, h1: 1 - exact1.expectedTime / single.time },
    unit: spec.unit ?? null,
  };
}

/**
 * The truncation rules in words.
 *
 * Method: at the maxFailures-th failure reject; at T = maxTime accept iff LLR <= 0, i.e.
 * r <= floor(maxTime (1/theta1 - 1/theta0)/ln d).
 * References: exact recursion over the integer lines (computed independently, checked by simulation) ; MIL-HDBK-781A's truncation is not used (the rule is a stated choice, not MIL-HDBK-781A's).
 */
export function lifetimeTruncationRule(plan: LifetimePlan): string {
  const parts: string[] = [];
  if (plan.maxFailures !== null) parts.push(`at failure ${plan.maxFailures}, if no line has been crossed: reject`);
  if (plan.maxTime !== null) {
    parts.push(
      `at test time ${plan.maxTime}, if no line has been crossed: accept with at most ` +
        `${countOf(truncationAcceptFailures(plan), 'failure')} (LLR <= 0), otherwise reject`,
    );
  }
  return parts.length === 0 ? 'no truncation: testing continues until a line is crossed' : parts.join('; ');
}

/** Where a lifetime test stands at accumulated time T with r failures. */
export interface LifetimeLiveState {
  time: number;
  failures: number;
  decision: Decision;
  rule: string;
  llr: number;
  /** Test time still needed to accept if no further failure comes (0 once accepted; null once rejected). */
  timeToAccept: number | null;
  /** Failures, coming now, that would reject (0 once rejected; null once accepted). */
  failuresToReject: number | null;
  /** Current MTBF estimate T/r (null before the first failure). */
  estimate: number | null;
  probabilityAcceptH0: number;
  probabilityAcceptH1: number;
  probabilityAcceptEstimate: number | null;
  expectedRemainingTimeH0: number;
  expectedRemainingTimeH1: number;
  expectedRemainingTimeEstimate: number | null;
}

/**
 * The live state of a lifetime test from its accumulated evidence (T, r).
 *
 * Method: decision as in decideLifetime; the accept time at r and the fewest immediate failures
 * with r ln d - c T >= ln A (or reaching maxFailures); P(accept) and expected remaining time by the
 * exact recursion on the lines moved to (T, r) (memoryless), under theta0, theta1 and T/r.
 * References: Epstein, B. and Sobel, M. (1955), Ann. Math. Statist. 26(1); common practice, no source.
 *
 * @throws PlanParameterError for an invalid spec, time or failures.
 */
export function lifetimeLiveState(spec: LifetimeSpec, time: number, failures: number): LifetimeLiveState {
  const plan = lifetimePlan(spec);
  if (typeof time !== 'number' || !Number.isFinite(time) || time < 0) throw new PlanParameterError('time', time, 'a number >= 0');
  checkInteger('failures', failures, 0);
  const { decision, rule, llr } = decideLifetime(plan, time, failures);
  const open = decision === 'continue';
  const lines = remainingLines(plan, time, failures);
  const settled = { accept: decision === 'accept' ? 1 : 0, expectedTime: 0 };
  const at = (theta: number) => (open ? evaluatePoissonSprt(lines, 1 / theta) : settled);
  const estimate = failures > 0 ? time / failures : null;
  const atH0 = at(spec.theta0);
  const atH1 = at(spec.theta1);
  const atEstimate = estimate === null || estimate === 0 ? null : at(estimate);
  let failuresToReject: number | null = decision === 'reject' ? 0 : null;
  if (open) {
    const needed = Math.ceil((plan.lnA - llr) / plan.llrPerFailure - 1e-12);
    failuresToReject = plan.maxFailures === null ? needed : Math.min(needed, plan.maxFailures - failures);
  }
  const acceptAt = Math.min(acceptTime(plan, failures), plan.maxTime ?? Number.POSITIVE_INFINITY);
  return {
    time,
    failures,
    decision,
    rule,
    llr,
    timeToAccept: decision === 'accept' ? 0 : open && (plan.maxTime === null || failures <= truncationAcceptFailures(plan) || acceptAt < plan.maxTime) ? acceptAt - time : null,
    failuresToReject,
    estimate,
    probabilityAcceptH0: atH0.accept,
    probabilityAcceptH1: atH1.accept,
    probabilityAcceptEstimate: atEstimate === null ? null : atEstimate.accept,
    expectedRemainingTimeH0: atH0.expectedTime,
    expectedRemainingTimeH1: atH1.expectedTime,
    expectedRemainingTimeEstimate: atEstimate === null ? null : atEstimate.expectedTime,
  };
}
