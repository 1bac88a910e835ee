import { decisionAt } from '../integerLines.js';
import type { LinearCountSpec } from '../spec.js';
import { biasAdjustedEstimate } from './biasAdjusted.js';
import { stagewiseInference } from './stagewiseInterval.js';
import { createStoppingEvaluator } from './stoppingDistribution.js';
import type { StoppingEvaluator } from './stoppingDistribution.js';

export const ESTIMATION_METHOD =
  'stagewise exact (Armitage 1958; Jennison & Turnbull 2000 §8.4), bias-adjusted (Whitehead 1986)';

/** What a finished run says about the quality (fraction nonconforming p, or nonconformities per unit). */
export interface EstimateAfterStop {
  n: number;
  total: number;
  decision: 'accept' | 'reject';
  /** total / n: biased after a sequential stop. */
  naive: number;
  /** Whitehead's bias-adjusted estimate. */
  biasAdjusted: number;
  /** Median-unbiased estimate from the stagewise ordering (mid-p form). */
  medianUnbiased: number;
  /** Exact interval from the stagewise ordering; each side misses with probability at most (1 - confidence)/2. */
  interval: { lower: number; upper: number; confidence: number };
  /** One-sided p-value against the acceptable quality (p0 or lambda0), stagewise ordering. */
  pValue: number;
  method: typeof ESTIMATION_METHOD;
}

/**
 * Estimation after a sequential stop at (n, total): the naive fraction, Whitehead's bias-adjusted
 * estimate, and the stagewise median-unbiased estimate, exact confidence interval and p-value, all
 * from the exact stopping distribution of the integer (and possibly truncated) plan that was run.
 * Pass a stopping evaluator instead of a spec to reuse one across many runs of the same plan.
 *
 * Method: the stopping distribution by forward recursion (createStoppingEvaluator); the interval
 * by inverting the stagewise tails, P_lower(T >= t) = gamma and P_upper(T <= t) = gamma with
 * gamma = (1 - confidence)/2 (stagewiseInference); the adjusted estimate solves
 * E_theta[d/N] = total/n (biasAdjustedEstimate).
 * References: Armitage, P. (1958), "Numerical studies in the sequential estimation of a binomial
 * parameter", Biometrika 45(1/2):1-15; Jennison, C. and Turnbull, B. W. (2000), Group Sequential
 * Methods with Applications to Clinical Trials, §8.4; Whitehead, J. (1986), "On the bias of maximum
 * likelihood estimates following a sequential test", Biometrika 73(3):573-581.
 *
 * @throws PlanParameterError for an invalid spec or confidence, or when (n, total) is not a stopping
 *   point of the plan (the message says which counts would stop the run at n).
 */
export function estimateAfterStop(
  plan: LinearCountSpec | StoppingEvaluator,
  observed: { n: number; total: number; confidence?: number },
): EstimateAfterStop {
  const evaluator = 'tail' in plan ? plan : createStoppingEvaluator(plan);
  const { n, total } = observed;
  // stagewiseInference checks (n, total) and the confidence first, so later calls see a valid point.
  const inference = stagewiseInference(evaluator, { n, total }, observed.confidence ?? 0.9);
  const decision = decisionAt(evaluator.lines, n, total).decision === 'accept' ? 'accept' : 'reject';
  return {
    n,
    total,
    decision,
    naive: total / n,
    biasAdjusted: biasAdjustedEstimate(evaluator, { n, total }),
    medianUnbiased: inference.medianUnbiased,
    interval: { lower: inference.lower, upper: inference.upper, confidence: inference.confidence },
    pValue: inference.pValue,
    method: ESTIMATION_METHOD,
  };
}
