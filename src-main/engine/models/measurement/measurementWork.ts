/**
 * The size of a measurement design, estimated from the spec before any of it is done.
 */
import { EXTRA_POINTS, relativeGap, workHorizon, type PlanWorkEstimate } from '../../planWork.js';
import type { MeasurementSpec } from '../../spec.js';
import { measurementPlan, measurementWaldPoint } from './measurementPlan.js';
import { createNormalSprtEvaluator } from './normalSprtExact.js';

/** Measured on the development machine (2 cores): relative cost of one quadrature update, and of one kernel value. */
const MEASUREMENT_COST = 1.6;
const KERNEL_COST = 25;

/**
 * Estimates the work of designing a measurement plan.
 *
 * Method: untruncated, one dense solve per quality (nodes^3 / 3); truncated, nodes^2 per
 * measurement until the mass is gone; both after nodes^2 kernel values. Expected run: Wald's ASN at
 * the midpoint of mu0 and mu1.
 * References: Wald, A. (1947), Sequential Analysis, §3.3 (ASN); the cost model is common practice, no source.
 *
 * @throws PlanParameterError for a spec measurementPlan refuses.
 */
export function measurementWork(spec: MeasurementSpec, curvePoints: number): PlanWorkEstimate {
  const plan = measurementPlan(spec);
  const expectedRun = measurementWaldPoint(plan, plan.midpoint, plan.rejectLimit, plan.acceptLimit).asn;
  const nodes = createNormalSprtEvaluator(plan.acceptLimit, plan.rejectLimit, plan.stepScale).nodes;
  const kernel = KERNEL_COST * nodes * nodes;
  const solve = plan.truncation === null ? nodes ** 3 / 3 : Math.min(plan.truncation, workHorizon(null, expectedRun)) * nodes * nodes;
  return {
    expectedRun,
    work: (curvePoints + EXTRA_POINTS) * MEASUREMENT_COST * (kernel + solve),
    unit: 'measurements',
    stopParameter: plan.truncation === null ? null : 'truncation',
    gapParameter: 'mu1',
    baseParameter: 'mu0',
    relativeGap: relativeGap(spec.mu0, spec.mu1),
  };
}
