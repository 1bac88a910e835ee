import { createExactEvaluator } from './exactEvaluator.js';
import type { IntegerLines } from './integerLines.js';
import type { CountStep } from './models/linearCountDefinition.js';

/** How far above nominal the truncated plan's exact risks may be. */
export const TRUNCATION_RISK_ALLOWANCE = 1.1;

/**
 * The smallest truncation n_t for which the truncated plan's exact alpha and beta are each no
 * more than 10% above nominal; null when no n_t up to maxItems does it.
 *
 * Method: one forward recursion at H0 and one at H1 over the untruncated lines; at every n the
 * risks of the plan truncated at n are the mass already rejected (accepted) plus the undecided
 * mass with d > floor(s n) (d <= floor(s n)), because the plans agree up to n.
 * References: exact recursion over the integer lines (computed independently, checked by simulation) for the truncation rule; NIST/SEMATECH
 * e-Handbook §6.2.6 for the practice of truncating at all.
 */
export function suggestedTruncation(
  lines: IntegerLines,
  countStep: CountStep,
  hypotheses: { theta0: number; theta1: number },
  risks: { alpha: number; beta: number },
  maxItems = 100_000,
): number | null {
  const evaluator = createExactEvaluator({ ...lines, truncation: null }, countStep, { maxSteps: maxItems });
  const accept0 = new Float64Array(maxItems + 1);
  const reject0 = new Float64Array(maxItems + 1);
  const accept1 = new Float64Array(maxItems + 1);
  const reject1 = new Float64Array(maxItems + 1);
  const last0 = evaluator.risksIfTruncated(hypotheses.theta0, accept0, reject0);
  const last1 = evaluator.risksIfTruncated(hypotheses.theta1, accept1, reject1);
  // Past the item count where a recursion ran out of undecided mass its risks no longer change.
  const last = Math.max(last0, last1);
  accept0.fill(accept0[last0], last0 + 1, last + 1);
  reject0.fill(reject0[last0], last0 + 1, last + 1);
  accept1.fill(accept1[last1], last1 + 1, last + 1);
  reject1.fill(reject1[last1], last1 + 1, last + 1);
  for (let n = 1; n <= last; n++) {
    if (reject0[n] <= TRUNCATION_RISK_ALLOWANCE * risks.alpha && accept1[n] <= TRUNCATION_RISK_ALLOWANCE * risks.beta) {
      return n;
    }
  }
  return null;
}
