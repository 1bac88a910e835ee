/**
 * P(X <= last) for X ~ Poisson(mean), mean > 0, writing P(X = k) into pmf[k] and P(X <= k) into
 * cdf[k] for k <= last when they are given.
 *
 * Method: the ratio recursion f(k+1) = f(k) mean/(k + 1) in log space, so e^{-mean} does not
 * underflow for large means; the CDF is the running sum, capped at 1.
 * References: Johnson, N. L., Kemp, A. W. and Kotz, S. (2005), Univariate Discrete Distributions,
 * 3rd ed., §4.2 (from memory).
 */
function sumPoisson(mean: number, last: number, pmf: Float64Array | null, cdf: Float64Array | null): number {
  const logMean = Math.log(mean);
  let logPmf = -mean;
  let cumulative = 0;
  for (let k = 0; k <= last; k++) {
    const term = Math.exp(logPmf);
    cumulative += term;
    if (pmf !== null) pmf[k] = term;
    if (cdf !== null) cdf[k] = Math.min(1, cumulative);
    logPmf += logMean - Math.log(k + 1);
  }
  return Math.min(1, cumulative);
}

/**
 * out[k] = P(X = k) for X ~ Poisson(mean), k = 0..out.length-1 (all mass at 0 for mean 0).
 *
 * Method and References: as sumPoisson.
 */
export function fillPoissonPmf(mean: number, out: Float64Array): void {
  if (mean <= 0) {
    for (let k = 0; k < out.length; k++) out[k] = k === 0 ? 1 : 0;
    return;
  }
  sumPoisson(mean, out.length - 1, out, null);
}

/**
 * out[k] = P(X <= k) for X ~ Poisson(mean), k = 0..out.length-1.
 *
 * Method and References: as sumPoisson.
 */
export function fillPoissonCdf(mean: number, out: Float64Array): void {
  if (mean <= 0) {
    out.fill(1);
    return;
  }
  sumPoisson(mean, out.length - 1, null, out);
}

/**
 * P(X <= k) for X ~ Poisson(mean).
 *
 * Method and References: as sumPoisson.
 */
export function poissonCdf(k: number, mean: number): number {
  if (k < 0) return 0;
  if (mean <= 0) return 1;
  return sumPoisson(mean, k, null, null);
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
