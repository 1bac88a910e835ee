import { describe, expect, it } from 'vitest';
import jStat from 'jstat';
import { binomialCdf } from '../../../src-main/engine/distributions/binomial.js';
import { poissonCdf } from '../../../src-main/engine/distributions/poisson.js';
import { naiveQualityEstimate } from '../../../src-main/engine/estimation/naiveQualityEstimate.js';

// Relative tolerance: jstat inverts by iteration to about 1e-10; 1e-6 leaves room without hiding a wrong formula.
const RELATIVE = 1e-6;

describe('naiveQualityEstimate', () => {
  it.each([
    [135, 2],
    [20, 0],
    [500, 12],
    [30, 30],
    [3000, 7],
  ])('the passfail interval for %i items with %i nonconforming equals the Clopper-Pearson beta quantiles', (n, d) => {
    const estimate = naiveQualityEstimate({ model: 'passfail', itemsInspected: n, nonconformities: d, confidenceLevel: 0.95 });
    // Reference: jstat's beta inverse, the textbook Clopper-Pearson form (Clopper and Pearson, 1934).
    const lower = d === 0 ? 0 : jStat.beta.inv(0.025, d, n - d + 1);
    const upper = d === n ? 1 : jStat.beta.inv(0.975, d + 1, n - d);
    expect(estimate.pointEstimate).toBe(d / n);
    expect(Math.abs(estimate.lower - lower)).toBeLessThanOrEqual(RELATIVE * Math.max(lower, 1e-12));
    expect(Math.abs(estimate.upper - upper)).toBeLessThanOrEqual(RELATIVE * upper);
  });

  it.each([
    [100, 0],
    [100, 4],
    [40, 55],
  ])('the count interval for %i items with %i nonconformities equals the Garwood chi-square quantiles', (n, d) => {
    const estimate = naiveQualityEstimate({ model: 'count', itemsInspected: n, nonconformities: d, confidenceLevel: 0.9 });
    // Reference: jstat's chi-square inverse, Garwood (1936): lower chi2(a/2, 2d)/2, upper chi2(1-a/2, 2d+2)/2.
    const lower = d === 0 ? 0 : jStat.chisquare.inv(0.05, 2 * d) / 2 / n;
    const upper = jStat.chisquare.inv(0.95, 2 * d + 2) / 2 / n;
    expect(Math.abs(estimate.lower - lower)).toBeLessThanOrEqual(RELATIVE * Math.max(lower, 1e-12));
    expect(Math.abs(estimate.upper - upper)).toBeLessThanOrEqual(RELATIVE * upper);
  });

  it('names its method as naive and as ignoring the stopping rule', () => {
    const estimate = naiveQualityEstimate({ model: 'passfail', itemsInspected: 10, nonconformities: 1, confidenceLevel: 0.95 });
    expect(estimate.methodName).toMatch(/^Naive fraction/);
    expect(estimate.methodName).toContain('Clopper-Pearson 95 %');
    expect(estimate.methodName).toContain('ignores the stopping rule');
  });

  it('binomialCdf and poissonCdf agree with a brute-force sum on small cases', () => {
    const choose = (n: number, k: number): number => (k === 0 ? 1 : (choose(n, k - 1) * (n - k + 1)) / k);
    for (const [k, n, p] of [[0, 5, 0.3], [2, 10, 0.15], [7, 12, 0.6]] as const) {
      let sum = 0;
      for (let i = 0; i <= k; i++) sum += choose(n, i) * p ** i * (1 - p) ** (n - i);
      expect(binomialCdf(k, n, p)).toBeCloseTo(sum, 14);
    }
    let poisson = 0;
    let factorial = 1;
    for (let i = 0; i <= 4; i++) {
      factorial *= i || 1;
      poisson += (Math.exp(-2.5) * 2.5 ** i) / factorial;
    }
    expect(poissonCdf(4, 2.5)).toBeCloseTo(poisson, 14);
  });

  it('refuses more nonconforming items than items inspected, naming the value', () => {
    expect(() => naiveQualityEstimate({ model: 'passfail', itemsInspected: 5, nonconformities: 6, confidenceLevel: 0.95 })).toThrow(
      /nonconformities is 6; allowed: a whole number in \[0, 5\]/,
    );
  });
});
