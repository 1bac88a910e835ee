import { PlanParameterError } from '../errors.js';
import { bracketAbove, solveIncreasing } from '../numerics/rootFinding.js';
import type { StagewiseTail, StoppingEvaluator } from './stoppingDistribution.js';
import { checkStoppingPoint } from './stoppingPoints.js';

/** Exact inference from the stagewise ordering for one observed stopping point. */
export interface StagewiseInference {
  /** Lower confidence limit: 0 when the observation is the lowest outcome of the plan. */
  lower: number;
  /** Upper confidence limit: the quality's upper limit (1 for a fraction) for the highest outcome. */
  upper: number;
  /** Two-sided confidence level 1 - 2 gamma. */
  confidence: number;
  /** Median-unbiased estimate (mid-p form). */
  medianUnbiased: number;
  /** One-sided p-value against the acceptable quality: P at theta0 of an outcome at least as high. */
  pValue: number;
}

/** Throws unless the confidence level is a number in (0, 1). */
export function checkConfidence(confidence: unknown): asserts confidence is number {
  if (typeof confidence !== 'number' || !Number.isFinite(confidence) || confidence <= 0 || confidence >= 1) {
    throw new PlanParameterError('confidence', confidence, 'a number in (0, 1), e.g. 0.90');
  }
}

/**
 * The exact confidence interval, median-unbiased estimate and p-value after a sequential stop at
 * (n, total), from the stagewise ordering of the plan's stopping points.
 *
 * Method: with T the stopping point and t the observed one, gamma = (1 - confidence)/2:
 * lower solves P_theta(T >= t) = gamma, upper solves P_theta(T <= t) = gamma; the median-unbiased
 * estimate solves P_theta(T > t) + P_theta(T = t)/2 = 1/2 (mid-p: on a discrete sample space the
 * equations with >= and > differ, and the mid-p root lies between them); pValue = P_theta0(T >= t).
 * Each tail is monotone in theta because the set {T >= t} only grows when any item's count grows
 * (a coupling argument), so bisection applies. Then P(lower > theta) <= gamma and
 * P(upper < theta) <= gamma at every theta: coverage is at least the nominal level.
 * References: Armitage, P. (1958), "Numerical studies in the sequential estimation of a binomial
 * parameter", Biometrika 45(1/2):1-15; Jennison, C. and Turnbull, B. W. (2000), Group Sequential
 * Methods with Applications to Clinical Trials, Chapman & Hall/CRC, §8.4 (stagewise ordering,
 * confidence interval and median-unbiased estimate by inverting the ordering's tail probabilities).
 *
 * @throws PlanParameterError when (n, total) is not a stopping point or the confidence is not in (0, 1).
 */
export function stagewiseInference(
  evaluator: StoppingEvaluator,
  observed: { n: number; total: number },
  confidence = 0.9,
): StagewiseInference {
  checkConfidence(confidence);
  const { n, total } = observed;
  const side = checkStoppingPoint(evaluator.lines, evaluator.countStep, n, total);
  const gamma = (1 - confidence) / 2;
  const tail: StagewiseTail = { below: 0, equal: 0, above: 0, meanNaive: 0, undecided: 0 };
  const atLeast = (theta: number): number => {
    evaluator.tail(theta, side, n, total, tail);
    return tail.above + tail.equal;
  };
  const notAtMost = (theta: number): number => {
    evaluator.tail(theta, side, n, total, tail);
    return -(tail.below + tail.equal);
  };
  const midAbove = (theta: number): number => {
    evaluator.tail(theta, side, n, total, tail);
    return tail.above + 0.5 * tail.equal;
  };
  const top = evaluator.qualityUpperLimit;
  // Rates have no upper limit: start the bracket above both the hypotheses and the observed rate.
  const start = Math.max(2 * evaluator.hypotheses.theta1, (2 * total) / n, 1e-3);
  const solve = (f: (theta: number) => number, target: number): number => {
    if (top !== Number.POSITIVE_INFINITY) return solveIncreasing(f, target, 0, top);
    const high = bracketAbove(f, target, start);
    if (high === Number.POSITIVE_INFINITY) return high;
    // Below high / 2 the last doubling already found f < target.
    return solveIncreasing(f, target, high === start ? 0 : high / 2, high);
  };

  const lower = solve(atLeast, gamma);
  // P(T <= t) decreases in theta, so solve -P(T <= t) = -gamma; for the highest outcome this gives the top.
  const upper = solve(notAtMost, -gamma);
  const medianUnbiased = solve(midAbove, 0.5);
  evaluator.tail(evaluator.hypotheses.theta0, side, n, total, tail);
  const pValue = Math.min(1, tail.above + tail.equal);
  return { lower, upper, confidence, medianUnbiased, pValue };
}
