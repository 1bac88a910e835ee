import { logSumExp } from './logSumExp.js';

/** P(X <= k) for X ~ Poisson(mean), summed in log space. */
export function poissonCdf(k: number, mean: number): number {
  if (k < 0) return 0;
  if (mean <= 0) return 1;
  let logTerm = -mean;
  let logSum = logTerm;
  for (let i = 1; i <= k; i++) {
    logTerm += Math.log(mean / i);
    logSum = logSumExp(logSum, logTerm);
  }
  return Math.min(1, Math.exp(logSum));
}

/**
 * A Poisson count with mean `rate` drawn from uniforms on [0, 1).
 *
 * Method: multiply uniforms until the product falls to e^-rate or below; the count is the number
 * of factors before that. Its work grows with the rate: meant for the small rates of simulated runs.
 * References: Knuth, D. E. (1997), The Art of Computer Programming, vol. 2, §3.4.1 (from memory).
 */
export function poissonDraw(rate: number, uniform: () => number): number {
  const limit = Math.exp(-rate);
  let count = 0;
  for (let product = uniform(); product > limit; product *= uniform()) count += 1;
  return count;
}
