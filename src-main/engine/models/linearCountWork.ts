/**
 * The size of a pass/fail or count design, estimated from the spec before any of it is done.
 */
import { EXTRA_POINTS, relativeGap, workHorizon, type PlanWorkEstimate } from '../planWork.js';
import type { LinearCountSpec } from '../spec.js';
import { waldBoundaries, waldLimits } from '../waldBoundaries.js';
import { neutralQuality, waldPoint } from '../waldCurve.js';
import { validatedDefinition } from './linearCountDefinitions.js';

/** Evaluations at H0 and H1 that fitting the lines to the exact risks takes at most (exactFit.ts). */
const FIT_EVALUATIONS = 110;

/**
 * Estimates the work of designing a linear-count plan.
 *
 * Method: work = (curve points + the design's own evaluations) x steps x cells per step, where steps
 * is the truncation or the untruncated horizon (workHorizon) and cells per step the live band of
 * counts (pass/fail) or the band times the Poisson convolution's width (count); an untruncated plan
 * adds the truncation search over up to 100,000 items. Peak ASN = -ln A ln B / E[z^2] at E[z] = 0.
 * References: Wald, A. (1947), Sequential Analysis, §3.3 (ASN); the cost model is common practice, no source.
 *
 * @throws PlanParameterError for a spec the model's own checks refuse.
 */
export function linearCountWork(spec: LinearCountSpec, curvePoints: number): PlanWorkEstimate {
  const definition = validatedDefinition(spec);
  const boundaries = waldBoundaries(spec);
  const { lnA, lnB } = waldLimits(spec.alpha, spec.beta);
  const expectedRun = waldPoint(definition, spec, lnA, lnB, neutralQuality(definition, spec)).asn;
  const band = boundaries.h1 + boundaries.h2 + Math.max(1, boundaries.slope) + 4;
  // A Poisson step convolves the live counts (h1 + h2 wide) with the step law over the band.
  const cellsPerStep = spec.model === 'count' ? (boundaries.h1 + boundaries.h2 + 2) * band : band;
  const points = curvePoints + EXTRA_POINTS + (spec.fit === 'exact' ? FIT_EVALUATIONS : 0);
  // Without truncation the design also searches a truncation over up to 100,000 items (truncation.ts).
  const search = spec.truncation == null ? 2 * Math.min(100_000, workHorizon(null, expectedRun)) * cellsPerStep : 0;
  const { theta0, theta1 } = definition.hypotheses(spec);
  const [base, gap] = spec.model === 'passfail' ? ['p0', 'p1'] : ['lambda0', 'lambda1'];
  return {
    expectedRun,
    work: points * workHorizon(spec.truncation, expectedRun) * cellsPerStep + search,
    unit: 'items',
    stopParameter: spec.truncation == null ? null : 'truncation',
    gapParameter: gap,
    baseParameter: base,
    relativeGap: relativeGap(theta0, theta1),
  };
}
