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
