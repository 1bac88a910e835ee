import type { LinearCountDefinition } from './models/linearCountDefinition.js';
import type { LinearCountSpec } from './spec.js';

/** A single sampling plan: inspect n items, accept iff the count is at most c. */
export interface SinglePlan {
  n: number;
  c: number;
  /** P(accept | H0) of the plan (at least 1 - alpha). */
  acceptH0: number;
  /** P(accept | H1) of the plan (at most beta). */
  acceptH1: number;
}

/**
 * The smallest single sampling plan (n, c) meeting the same two OC points as the sequential plan.
 *
 * Method: for n = 1, 2, ...: c = the largest count with P(X <= c | H1, n) <= beta; the plan is
 * found when also P(X <= c | H0, n) >= 1 - alpha. X is binomial(n, p) for pass/fail and
 * Poisson(n lambda) for count data.
 * References: Montgomery, D. C., Introduction to Statistical Quality Control, §15.2.3 (two-point
 * design); Montgomery §15.2.3 (first-hand), minimal plans computed independently.
 *
 * @param maxItems the search stops (returns null) beyond this n.
 */
export function singleSamplingPlan(
  model: LinearCountDefinition<LinearCountSpec>,
  spec: LinearCountSpec,
  maxItems = 1_000_000,
): SinglePlan | null {
  const { theta0, theta1 } = model.hypotheses(spec);
  let cdf0 = new Float64Array(16);
  let cdf1 = new Float64Array(16);
  for (let n = 1; n <= maxItems; n++) {
    // c must lie below the H1 mean plus a few standard deviations, since P(X <= c | H1) <= beta < 1.
    const mean1 = n * theta1;
    const length = Math.ceil(mean1 + 12 * Math.sqrt(mean1) + 12);
    if (length > cdf1.length) {
      cdf0 = new Float64Array(length * 2);
      cdf1 = new Float64Array(length * 2);
    }
    const view1 = cdf1.subarray(0, length);
    model.fillCountCdf(theta1, n, view1);
    let c = -1;
    while (c + 1 < length && view1[c + 1] <= spec.beta) c++;
    if (c < 0) continue;
    const view0 = cdf0.subarray(0, c + 1);
    model.fillCountCdf(theta0, n, view0);
    if (view0[c] >= 1 - spec.alpha) return { n, c, acceptH0: view0[c], acceptH1: view1[c] };
  }
  return null;
}
