import { poissonCdf } from '../../distributions/poisson.js';
import { PlanParameterError } from '../../errors.js';
import { bisectBoundary, expandUntil } from '../../numerics/rootFinding.js';

/** Fixed-duration reliability test: run for `time`, accept iff failures <= `acceptFailures`. */
export interface FixedDurationPlan {
  time: number;
  acceptFailures: number;
  /** True risks: 1 - P(accept | theta0) and P(accept | theta1). */
  alpha: number;
  beta: number;
}

/**
 * True risks of a fixed-duration test of length `time` accepting with at most c failures.
 *
 * Method: failures ~ Poisson(time/theta); alpha' = 1 - P(N <= c | theta0), beta' = P(N <= c | theta1).
 * References: MIL-HDBK-781A (1996), fixed-duration test plans (table from memory);
 * MIL-HDBK-781A fixed-duration plans (table from memory, risks computed with a Poisson CDF) (recomputed risks).
 */
export function fixedDurationRisks(theta0: number, theta1: number, time: number, acceptFailures: number): { alpha: number; beta: number } {
  return { alpha: 1 - poissonCdf(acceptFailures, time / theta0), beta: poissonCdf(acceptFailures, time / theta1) };
}

/**
 * The shortest fixed-duration test meeting both OC points: smallest time T with a c such that
 * P(N <= c | theta0) >= 1 - alpha and P(N <= c | theta1) <= beta.
 *
 * Method: for c = 0, 1, ... the shortest time with P(N <= c | theta1) <= beta (bisection on the
 * Poisson mean by numerics/rootFinding; the CDF falls as the mean grows); the first c whose time
 * also meets the producer's point gives the shortest test (that time grows with c).
 * References: Epstein, B. (1960), "Statistical life test acceptance procedures", Technometrics 2(4);
 * MIL-HDBK-781A fixed-duration plans (table from memory, risks computed with a Poisson CDF), fixed-time demonstration factors (computed independently).
 */
export function fixedDurationPlan(theta0: number, theta1: number, alpha: number, beta: number): FixedDurationPlan {
  for (let c = 0; c <= 10000; c++) {
    const meetsBeta = (mean: number): boolean => poissonCdf(c, mean) <= beta;
    const high = expandUntil(meetsBeta, c + 1, Number.MAX_VALUE);
    const time = bisectBoundary(meetsBeta, 0, high, { relativeTolerance: 1e-13 }) * theta1;
    const risks = fixedDurationRisks(theta0, theta1, time, c);
    if (risks.alpha <= alpha) return { time, acceptFailures: c, ...risks };
  }
  throw new PlanParameterError('theta1', theta1, 'far enough below theta0 for a test of at most 10000 failures');
}
