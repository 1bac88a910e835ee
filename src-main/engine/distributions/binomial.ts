import { logSumExp } from './logSumExp.js';

/** P(X <= k) for X ~ Binomial(n, p), summed in log space so long runs do not underflow. */
export function binomialCdf(k: number, n: number, p: number): number {
  if (k < 0) return 0;
  if (k >= n || p <= 0) return 1;
  if (p >= 1) return 0;
  let logTerm = n * Math.log1p(-p);
  let logSum = logTerm;
  const logOdds = Math.log(p) - Math.log1p(-p);
  for (let i = 0; i < k; i++) {
    logTerm += Math.log((n - i) / (i + 1)) + logOdds;
    logSum = logSumExp(logSum, logTerm);
  }
  return Math.min(1, Math.exp(logSum));
}
