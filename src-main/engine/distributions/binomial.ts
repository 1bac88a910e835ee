/**
 * P(X <= last) for X ~ Binomial(n, p), 0 < p < 1, writing P(X <= k) into out[k] for k <= last when
 * `out` is given.
 *
 * Method: the pmf by the ratio recursion f(k+1) = f(k) (n - k)/(k + 1) p/q, kept in log space so
 * q^n does not underflow for long runs; the CDF is the running sum, capped at 1.
 * References: Johnson, N. L., Kemp, A. W. and Kotz, S. (2005), Univariate Discrete Distributions,
 * 3rd ed., §3.2 (the recursion; from memory).
 */
function sumBinomial(n: number, p: number, last: number, out: Float64Array | null): number {
  const logRatio = Math.log(p) - Math.log1p(-p);
  let logPmf = n * Math.log1p(-p);
  let cumulative = 0;
  for (let k = 0; k <= last; k++) {
    if (k <= n) {
      cumulative += Math.exp(logPmf);
      logPmf += Math.log((n - k) / (k + 1)) + logRatio;
    }
    if (out !== null) out[k] = Math.min(1, cumulative);
  }
  return Math.min(1, cumulative);
}

/**
 * out[k] = P(X <= k) for X ~ Binomial(n, p), k = 0..out.length-1 (1 for k >= n).
 *
 * Method and References: as sumBinomial; p = 0 puts all mass at 0, p = 1 at n.
 */
export function fillBinomialCdf(n: number, p: number, out: Float64Array): void {
  if (p <= 0 || p >= 1) {
    const at = p <= 0 ? 0 : n;
    for (let k = 0; k < out.length; k++) out[k] = k >= at ? 1 : 0;
    return;
  }
  sumBinomial(n, p, out.length - 1, out);
}

/**
 * P(X <= k) for X ~ Binomial(n, p).
 *
 * Method and References: as sumBinomial.
 */
export function binomialCdf(k: number, n: number, p: number): number {
  if (k < 0) return 0;
  if (k >= n || p <= 0) return 1;
  if (p >= 1) return 0;
  return sumBinomial(n, p, k, null);
}
