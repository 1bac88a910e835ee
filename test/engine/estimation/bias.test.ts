import { describe, expect, it } from 'vitest';
import type { PassFailSpec } from '../../../src-main/engine/index.js';
import {
  biasAdjustedEstimate,
  createStoppingEvaluator,
  naiveEstimateBias,
} from '../../../src-main/engine/estimation/index.js';

// The NIST/SEMATECH e-Handbook §6.2.6 plan (NIST/SEMATECH e-Handbook §6.2.6 (first-hand)) truncated at 156 (exact recursion over the integer lines (computed independently, checked by simulation)).
const nist: PassFailSpec = { model: 'passfail', p0: 0.01, p1: 0.1, alpha: 0.05, beta: 0.1, truncation: 156 };
const evaluator = createStoppingEvaluator(nist);
const adjusted = new Map<string, number>();

/** Exact means of the naive and the adjusted estimate at p, summed over the stopping distribution. */
function exactMeans(p: number): { naive: number; adjusted: number } {
  let naive = 0;
  let adjustedMean = 0;
  for (const point of evaluator.distribution(p).points) {
    if (point.probability < 1e-13) continue; // cannot move a mean by more than ~1e-11
    const key = `${point.itemCount}:${point.total}`;
    let estimate = adjusted.get(key);
    if (estimate === undefined) {
      estimate = biasAdjustedEstimate(evaluator, { n: point.itemCount, total: point.total });
      adjusted.set(key, estimate);
    }
    naive += (point.probability * point.total) / point.itemCount;
    adjustedMean += point.probability * estimate;
  }
  return { naive, adjusted: adjustedMean };
}

describe('bias of the naive and the bias-adjusted estimate (exact expectations)', () => {
  it('naive d/n is biased upward from the middle of the design range on', () => {
    // Whitehead (1986) describes this overestimation after early stops (from memory); the sizes are computed here.
    for (const p of [0.05, 0.1, 0.15]) expect(naiveEstimateBias(evaluator, p)).toBeGreaterThan(0.02);
  });

  it('the bias-adjusted estimate has a smaller |mean - p| than d/n from p = 0.03 up', () => {
    // Computed, independent method (exact sums): at p = 0.05, 0.10, 0.15 the naive bias is
    // +0.027, +0.065, +0.087 and the adjusted +0.002, +0.013, +0.018.
    for (const p of [0.03, 0.04, 0.05, 0.07, 0.1, 0.15, 0.2]) {
      const means = exactMeans(p);
      expect(Math.abs(means.adjusted - p), `p = ${p}`).toBeLessThan(Math.abs(means.naive - p));
    }
  });

  it('below p = 0.025 the adjustment overshoots: d/n is then the less biased (a limit, pinned so it is not forgotten)', () => {
    // Runs that accept with d = 0 keep both estimates at 0; the adjustment pulls every other stop down by
    // the bias it would have near the design range, so at very good quality the mean ends too low.
    // Computed here: p = 0.005 naive -0.0019, adjusted -0.0022; p = 0.02 naive +0.0005, adjusted -0.0047.
    for (const p of [0.005, 0.02]) {
      const means = exactMeans(p);
      expect(Math.abs(means.adjusted - p), `p = ${p}`).toBeGreaterThan(Math.abs(means.naive - p));
      expect(Math.abs(means.adjusted - p)).toBeLessThan(0.005);
    }
  });

  it('the largest |bias| over the range is about 4 times smaller after adjustment', () => {
    const grid = [0.005, 0.01, 0.02, 0.03, 0.05, 0.1, 0.15, 0.2, 0.3];
    let worstNaive = 0;
    let worstAdjusted = 0;
    for (const p of grid) {
      const means = exactMeans(p);
      worstNaive = Math.max(worstNaive, Math.abs(means.naive - p));
      worstAdjusted = Math.max(worstAdjusted, Math.abs(means.adjusted - p));
    }
    // Computed: 0.115 (naive, at p = 0.3) against 0.028 (adjusted).
    expect(worstAdjusted).toBeLessThan(worstNaive / 3);
  });

  it('E_p[d/N] rises with p, so the adjusted estimate is a unique root', () => {
    let previous = -1;
    for (let i = 0; i <= 400; i++) {
      const p = i / 400;
      const mean = naiveEstimateBias(evaluator, p) + p;
      expect(mean).toBeGreaterThanOrEqual(previous - 1e-14);
      previous = mean;
    }
  });
});
