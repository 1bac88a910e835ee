/**
 * How much work designing a plan may take, and the limits that keep one spec from freezing the app:
 * a plan's runs must be of a size an inspection can reach, and its exact curves must be computable in
 * about a second. Each model estimates its own work (its `estimateWork`); this module holds the limits
 * and the one refusal.
 */
import { formatValue, PlanParameterError } from './errors.js';
import { MAX_FAILURES } from './models/lifetime/lifetimePlan.js';
import type { PlanSpec } from './spec.js';
import { MAX_TRUNCATION } from './validate.js';

/** The limits every plan is held to; README "Limits" states them for users. */
export const PLAN_LIMITS = {
  /** Largest truncation, in items (measurements for the measurement model); checked by the model's plan. */
  maxTruncation: MAX_TRUNCATION,
  /** Largest failure count at which a lifetime test stops; checked by lifetimePlan. */
  maxFailures: MAX_FAILURES,
  /** Largest expected run (Wald's ASN at the worst quality), in items, or failures for lifetime. */
  maxExpectedRun: 100_000,
  /** Largest estimated work of one design, in elementary updates of the exact recursions. */
  maxWork: 3e9,
  /** Largest number of qualities on the curves. */
  maxCurvePoints: 10_001,
} as const;

/** The design's own figures besides the curve: H0, H1, and the truncation search or the fit. */
export const EXTRA_POINTS = 4;
/** Untruncated recursions run until 1e-12 of the mass is left: about this many expected runs. */
const HORIZON_MULTIPLE = 30;
/** Hard cap of the untruncated recursions (exactEvaluator.ts). */
const RECURSION_CAP = 1_000_000;

/** A model's estimate of one design's size, made from the spec alone before any work is done. */
export interface PlanWorkEstimate {
  /** Wald's ASN at the worst quality: entries per run (failures for lifetime). */
  expectedRun: number;
  /** Estimated elementary updates of the whole design. */
  work: number;
  /** What the expected run counts: "items", "measurements" or "failures". */
  unit: string;
  /** The spec's parameter that ends every run early (truncation, maxFailures, maxTime), or null when none is set. */
  stopParameter: string | null;
  /** The spec's rejectable quality parameter, named in a refusal of the expected run. */
  gapParameter: string;
  /** The spec's acceptable quality parameter it is compared with. */
  baseParameter: string;
  /** The relative gap between the two qualities, |q1 - q0| / |q0|. */
  relativeGap: number;
}

/**
 * The steps an exact recursion walks: the truncation, or for an untruncated plan 30 x the expected
 * run (the recursions run until 1e-12 of the mass is left; the stopping time's tail is close to
 * geometric with that mean), capped as the recursion caps it.
 * References: the cost model is common practice, no source.
 */
export function workHorizon(truncation: number | null | undefined, expectedRun: number): number {
  return truncation ?? Math.min(RECURSION_CAP, HORIZON_MULTIPLE * Math.max(1, expectedRun));
}

/** |q1 - q0| / |q0|, for the refusal's wording. */
export function relativeGap(q0: number, q1: number): number {
  return Math.abs(q1 - q0) / Math.max(Math.abs(q0), Number.MIN_VALUE);
}

/** Throws unless curvePoints is an integer from 2 to PLAN_LIMITS.maxCurvePoints; returns it (default 51). */
export function checkCurvePoints(curvePoints: unknown = 51): number {
  if (typeof curvePoints !== 'number' || !Number.isInteger(curvePoints) || curvePoints < 2 || curvePoints > PLAN_LIMITS.maxCurvePoints) {
    throw new PlanParameterError('curvePoints', curvePoints, `an integer from 2 to ${PLAN_LIMITS.maxCurvePoints}`);
  }
  return curvePoints;
}

function formatCount(value: number): string {
  if (!Number.isFinite(value)) return 'without end';
  if (value >= 1e12) return `about ${value.toExponential(1).replace('e+', 'e')}`;
  if (value >= 1e9) return `about ${Number((value / 1e9).toPrecision(2))} billion`;
  if (value >= 1e6) return `about ${Number((value / 1e6).toPrecision(2))} million`;
  return `about ${Math.round(value).toLocaleString('en-US')}`;
}

function formatPercent(fraction: number): string {
  return `${Number((100 * fraction).toPrecision(2))} %`;
}

/** A spec's parameter by name, for messages. */
function spec0(spec: PlanSpec, name: string): unknown {
  return (spec as unknown as Record<string, unknown>)[name];
}

/**
 * Refuses a spec whose runs or design would be too large to compute, with what is allowed and why.
 *
 * Method: the bounds of PLAN_LIMITS on the expected run and the estimated work (the model's
 * estimateWork); truncation and failures are bounded by the model's own plan check.
 * References: common practice, no source.
 *
 * @throws PlanParameterError naming the parameter to change.
 */
export function checkPlanWork(spec: PlanSpec, estimate: PlanWorkEstimate): void {
  const { unit, stopParameter } = estimate;
  if (stopParameter === null && !(estimate.expectedRun <= PLAN_LIMITS.maxExpectedRun)) {
    const q1 = estimate.gapParameter;
    const q0 = estimate.baseParameter;
    throw new PlanParameterError(
      q1,
      spec0(spec, q1),
      `far enough from ${q0} for a run of at most ${PLAN_LIMITS.maxExpectedRun.toLocaleString('en-US')} ${unit} on average`,
      `${estimate.relativeGap < 0.1 ? `${q1} within ${formatPercent(estimate.relativeGap)} of ${q0}` : `${q0} = ${formatValue(spec0(spec, q0))} and ${q1} = ${formatValue(spec0(spec, q1))}`} would need ${formatCount(estimate.expectedRun)} ${unit} per run ` +
        `(at most ${PLAN_LIMITS.maxExpectedRun.toLocaleString('en-US')} allowed); widen the gap or set a truncation`,
    );
  }
  if (!(estimate.work <= PLAN_LIMITS.maxWork)) {
    const parameter = stopParameter ?? estimate.gapParameter;
    throw new PlanParameterError(
      parameter,
      spec0(spec, parameter),
      'a plan whose exact curves take at most a few seconds',
      `this plan's exact curves would take ${formatCount(estimate.work)} steps (curve points x ${unit} x states), ` +
        `at most ${formatCount(PLAN_LIMITS.maxWork).replace('about ', '')} allowed; ` +
        (stopParameter !== null ? `lower the ${stopParameter}, ` : '') +
        'use fewer curve points or widen the gap between the two qualities',
    );
  }
}
