import { bracketAbove, solveIncreasing } from '../numerics/rootFinding.js';
import type { StagewiseTail, StoppingEvaluator } from './stoppingDistribution.js';
import { StagewiseSide } from './stagewiseOrder.js';
import { checkStoppingPoint } from './stoppingPoints.js';

const scratch: StagewiseTail = { below: 0, equal: 0, above: 0, meanNaive: 0, undecided: 0 };

/**
 * The exact bias of the naive estimate d/N after a sequential stop, at quality theta.
 *
 * Method: bias(theta) = E_theta[d/N] - theta = sum over stopping points (n, d) of
 * P_theta(stop at (n, d)) d/n, minus theta, from the exact stopping distribution.
 * References: Whitehead, J. (1986), "On the bias of maximum likelihood estimates following a
 * sequential test", Biometrika 73(3):573-581.
 */
export function naiveEstimateBias(evaluator: StoppingEvaluator, quality: number): number {
  // The observed point does not matter for the mean; any side will do.
  evaluator.tail(quality, StagewiseSide.accept, 0, 0, scratch);
  return scratch.meanNaive - quality;
}

/**
 * Whitehead's bias-adjusted estimate after a sequential stop at (n, total).
 *
 * Method: with the naive estimate hat-theta = total/n, the adjusted estimate tilde-theta solves
 * hat-theta = tilde-theta + bias(tilde-theta), i.e. E_tilde-theta[d/N] = hat-theta, with bias from
 * naiveEstimateBias; found by bisection on [0, 1] (fraction) or on a doubled bracket (rate), since
 * E_theta[d/N] runs from 0 at theta = 0 up to 1 (or without bound) and rises with theta (checked
 * numerically on the tested plans; bisection still returns a root if it did not).
 * Limit: runs accepted with d = 0 stay at 0, so at quality well below theta0 the adjusted mean can
 * sit further below theta than the naive one (NIST plan: p <= 0.02); the interval is the safer summary.
 * References: Whitehead, J. (1986), "On the bias of maximum likelihood estimates following a
 * sequential test", Biometrika 73(3):573-581 (section numbers not checked).
 *
 * @throws PlanParameterError when (n, total) is not a stopping point of the plan.
 */
export function biasAdjustedEstimate(evaluator: StoppingEvaluator, observed: { n: number; total: number }): number {
  const { n, total } = observed;
  checkStoppingPoint(evaluator.lines, evaluator.countStep, n, total);
  const naive = total / n;
  if (naive === 0) return 0;
  const meanNaive = (theta: number): number => naiveEstimateBias(evaluator, theta) + theta;
  if (evaluator.qualityUpperLimit !== Number.POSITIVE_INFINITY) {
    return solveIncreasing(meanNaive, naive, 0, evaluator.qualityUpperLimit);
  }
  const start = Math.max(2 * naive, 1e-3);
  const high = bracketAbove(meanNaive, naive, start);
  if (high === Number.POSITIVE_INFINITY) return high;
  return solveIncreasing(meanNaive, naive, high === start ? 0 : high / 2, high);
}
