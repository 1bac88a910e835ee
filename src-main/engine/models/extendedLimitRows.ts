/**
 * The limit tables of the extended models in their natural units, for the design tables and for a
 * running chart: measurement sum against n, lifetime test time against failures, graded demerits
 * against n.
 */
import { gradedBoundaries } from './graded.js';
import type { GradedPlan } from './graded.js';
import { acceptTime, rejectTime } from './lifetime.js';
import type { LifetimePlan } from './lifetime.js';
import type { MeasurementPlan } from './measurement.js';

/**
 * Measurement lines in sum units for n = 1..length; the truncation row holds the truncation rule.
 *
 * Method: sum limit = n (mu0 + mu1)/2 + limit / ((mu1 - mu0)/sigma^2) for the LLR limits in use;
 * at the truncation both are n (mu0 + mu1)/2 (LLR = 0).
 * References: Wald, A. (1947), Sequential Analysis, ch. 5.
 */
export function measurementLimitRows(plan: MeasurementPlan, length: number): Array<{ n: number; accept: number; reject: number }> {
  const rows = [];
  for (let n = 1; n <= length; n++) {
    const atTruncation = n === plan.truncation;
    rows.push({
      n,
      accept: plan.midpoint * n + (atTruncation ? 0 : plan.acceptLimit / plan.llrPerUnit),
      reject: plan.midpoint * n + (atTruncation ? 0 : plan.rejectLimit / plan.llrPerUnit),
    });
  }
  return rows;
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

/**
 * Graded demerit lines for n = 1..length: accept at most `accept` (null: not yet possible), reject
 * at least `reject`; the truncation row holds the truncation rule (demerits <= slope n accepts).
 *
 * Method: D <= slope n - h1 accepts, D >= slope n + h2 rejects (gradedBoundaries).
 * References: Wald, A. (1947), Sequential Analysis, ch. 5.
 */
export function gradedLimitRows(plan: GradedPlan, length: number): Array<{ n: number; accept: number | null; reject: number }> {
  const boundaries = gradedBoundaries(plan);
  const rows = [];
  for (let n = 1; n <= length; n++) {
    const atTruncation = n === plan.truncation;
    const accept = boundaries.slope * n - (atTruncation ? 0 : boundaries.h1);
    rows.push({ n, accept: accept < 0 ? null : accept, reject: boundaries.slope * n + (atTruncation ? 0 : boundaries.h2) });
  }
  return rows;
}
