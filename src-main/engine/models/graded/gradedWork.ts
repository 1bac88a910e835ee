/**
 * The size of a graded design, estimated from the spec before any of it is done.
 */
import { waldOperatingPoint } from '../../waldCurve.js';
import { EXTRA_POINTS, relativeGap, workHorizon, type PlanWorkEstimate } from '../../planWork.js';
import type { GradedSpec } from '../../spec.js';
import { GRADED_EXACT_LIMIT } from './gradedDesign.js';
import { gradedIncrementLaw, gradedKl, gradedPlan, gradedQuality } from './gradedPlan.js';

/** One simulated item per class costs about this many pass/fail cells (measured). */
const SIMULATION_COST = 3;
/** Runs the graded simulation makes at H0 and H1, and per curve point (gradedDesign.ts). */
const SIMULATED_RUNS = { hypotheses: 2 * 20_000, perPoint: 4_000 };

/**
 * Estimates the work of designing a graded plan.
 *
 * Method: up to three classes within 400 items, the recursion over class counts (about
 * n^(k-1)/(k-1)! states at item n, per curve point); beyond it, simulated runs that stop near the
 * expected run, a class drawn per item. Expected run: Wald's ASN at the neutral mixture.
 * References: Wald, A. (1947), Sequential Analysis, §3.3 (ASN); the cost model is common practice, no source.
 *
 * @throws PlanParameterError for a spec gradedPlan refuses.
 */
export function gradedWork(spec: GradedSpec, curvePoints: number): PlanWorkEstimate {
  const plan = gradedPlan(spec);
  const kl = gradedKl(plan);
  const neutralT = kl.h0h1 / (kl.h0h1 + kl.h1h0);
  const expectedRun = waldOperatingPoint(gradedIncrementLaw(plan, gradedQuality(plan, neutralT)), plan.lnA, plan.lnB).asn;
  const horizon = workHorizon(plan.truncation, expectedRun);
  const steps = Math.min(horizon, plan.truncation ?? Number.POSITIVE_INFINITY, 4 * Math.max(1, expectedRun));
  const exactSteps = Math.min(GRADED_EXACT_LIMIT, horizon);
  const exact = plan.classCount <= 3 && (plan.truncation === null || plan.truncation <= GRADED_EXACT_LIMIT);
  const exactWork = (curvePoints + EXTRA_POINTS) * (plan.classCount === 2 ? exactSteps ** 2 / 2 : exactSteps ** 3 / 6);
  const simulatedWork = SIMULATION_COST * (SIMULATED_RUNS.hypotheses + curvePoints * SIMULATED_RUNS.perPoint) * steps * plan.classCount;
  // The exact recursion falls back to simulation when it leaves mass undecided at 400 items.
  const work = exact ? exactWork + (horizon > GRADED_EXACT_LIMIT ? simulatedWork : 0) : simulatedWork;
  const differing = spec.p0.findIndex((p, k) => p !== spec.p1[k]);
  return {
    expectedRun,
    work,
    unit: 'items',
    stopParameter: plan.truncation === null ? null : 'truncation',
    gapParameter: 'p1',
    baseParameter: 'p0',
    relativeGap: differing < 0 ? 0 : relativeGap(spec.p0[differing], spec.p1[differing]),
  };
}
