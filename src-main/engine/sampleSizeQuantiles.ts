import type { SampleSizeQuantiles } from './planDesignTypes.js';

/**
 * Quantiles of the item count at the decision, from P(stop at n).
 *
 * Method: the q-quantile is the smallest n with sum_{k<=n} P(stop at k) >= q (a tiny tolerance
 * absorbs rounding); null when the recorded mass never reaches q.
 * References: Hyndman, R. J. and Fan, Y. (1996), "Sample quantiles in statistical packages",
 * The American Statistician 50(4), definition 1 (inverse of the distribution function).
 */
export function sampleSizeQuantiles(stops: ArrayLike<number>): SampleSizeQuantiles {
  const targets = [0.5, 0.9, 0.99];
  const found: Array<number | null> = [null, null, null];
  let cumulative = 0;
  let next = 0;
  for (let n = 0; n < stops.length && next < targets.length; n++) {
    cumulative += stops[n];
    while (next < targets.length && cumulative >= targets[next] - 1e-12) found[next++] = n;
  }
  return { p50: found[0], p90: found[1], p99: found[2] };
}
