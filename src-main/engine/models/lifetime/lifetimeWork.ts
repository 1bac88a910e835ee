/**
 * The size of a lifetime design, estimated from the spec before any of it is done.
 */
import { waldOperatingPoint } from '../../waldCurve.js';
import { EXTRA_POINTS, relativeGap, type PlanWorkEstimate } from '../../planWork.js';
import type { LifetimeSpec } from '../../spec.js';
import { lifetimeIncrementLaw, lifetimePlan } from './lifetimePlan.js';

/**
 * The exact evaluation carries a piecewise polynomial per failure, about 30,000 cell updates' worth
 * each (measured), and its mass is gone after about 5 expected runs of failures.
 */
const COST_PER_FAILURE = 30_000;
const HORIZON_MULTIPLE = 5;

/**
 * Estimates the work of designing a lifetime plan.
 *
 * Method: (curve points + 4) x failures walked x cost per failure, where failures walked is the
 * smallest of maxFailures, the failures at maxTime on the accept line, and 5 expected runs; the
 * expected run is Wald's ASN in test time at the neutral theta, divided by that theta.
 * References: Wald, A. (1947), Sequential Analysis, §3.3 (ASN); the cost model is common practice, no source.
 *
 * @throws PlanParameterError for a spec lifetimePlan refuses.
 */
export function lifetimeWork(spec: LifetimeSpec, curvePoints: number): PlanWorkEstimate {
  const plan = lifetimePlan(spec);
  const neutralTheta = plan.llrPerFailure / plan.llrPerTime;
  const expectedTime = waldOperatingPoint(lifetimeIncrementLaw(plan, neutralTheta), plan.lnA, plan.lnB).asn;
  const expectedRun = expectedTime / neutralTheta;
  const atMaxTime = plan.maxTime === null ? Number.POSITIVE_INFINITY : (plan.maxTime * plan.llrPerTime) / plan.llrPerFailure + 1;
  const failures = Math.min(plan.maxFailures ?? Number.POSITIVE_INFINITY, atMaxTime, HORIZON_MULTIPLE * Math.max(1, expectedRun));
  return {
    expectedRun,
    work: (curvePoints + EXTRA_POINTS) * failures * COST_PER_FAILURE,
    unit: 'failures',
    stopParameter: plan.maxFailures !== null ? 'maxFailures' : plan.maxTime !== null ? 'maxTime' : null,
    gapParameter: 'theta1',
    baseParameter: 'theta0',
    relativeGap: relativeGap(spec.theta0, spec.theta1),
  };
}
