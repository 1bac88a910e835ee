import { describe, expect, it } from 'vitest';
import { countDefinition, passFailDefinition, resolvePlan, singleSamplingPlan } from '../../src-main/engine/index.js';
import type { LinearCountSpec } from '../../src-main/engine/index.js';
import { binomialCdf, poissonCdf } from './referenceDistributions.js';

function single(spec: LinearCountSpec) {
  return singleSamplingPlan(resolvePlan(spec).model, spec);
}

/** Independent check that no (m, c) with m < n meets both points, using jstat's CDFs. */
function noSmallerPlan(cdf: (c: number, m: number, theta: number) => number, spec: LinearCountSpec, theta0: number, theta1: number, n: number): boolean {
  for (let m = 1; m < n; m++) {
    for (let c = 0; c <= m; c++) {
      if (cdf(c, m, theta1) > spec.beta) break;
      if (cdf(c, m, theta0) >= 1 - spec.alpha) return false;
    }
  }
  return true;
}

describe('single sampling plans', () => {
  it('give (52, 2) for the NIST points, confirmed by the jstat binomial CDF', () => {
    const spec: LinearCountSpec = { model: 'passfail', p0: 0.01, p1: 0.1, alpha: 0.05, beta: 0.1 };
    // Montgomery §15.2.3 (first-hand), minimal plans computed independently: (52, 2) with Pa = 0.9846 and 0.0966.
    const plan = single(spec);
    expect(plan).toMatchObject({ n: 52, c: 2 });
    // jstat 1.9.6 binomial CDF as the outside reference.
    expect(plan?.acceptH0).toBeCloseTo(binomialCdf(2, 52, 0.01), 9);
    expect(plan?.acceptH1).toBeCloseTo(binomialCdf(2, 52, 0.1), 9);
    expect(noSmallerPlan(binomialCdf, spec, 0.01, 0.1, 52)).toBe(true);
  });

  it('give the minimal (110, 3) for the Montgomery points, not the nomograph (120, 3)', () => {
    const spec: LinearCountSpec = { model: 'passfail', p0: 0.01, p1: 0.06, alpha: 0.05, beta: 0.1 };
    // Montgomery §15.2.3 (first-hand), minimal plans computed independently: Montgomery §15.2.3 answer (120, 3) (from memory); minimal exact plan (110, 3).
    const plan = single(spec);
    expect(plan).toMatchObject({ n: 110, c: 3 });
    expect(plan?.acceptH0).toBeCloseTo(0.975, 3); // Montgomery §15.2.3 (first-hand), minimal plans computed independently
    expect(plan?.acceptH1).toBeCloseTo(0.098, 3); // Montgomery §15.2.3 (first-hand), minimal plans computed independently
    // jstat binomial CDF: the nomograph plan meets both points too, with slack.
    expect(binomialCdf(3, 120, 0.01)).toBeCloseTo(0.967, 3);
    expect(binomialCdf(3, 120, 0.06)).toBeCloseTo(0.066, 3);
    expect(noSmallerPlan(binomialCdf, spec, 0.01, 0.06, 110)).toBe(true);
  });

  it('compute the binomial OC of (89, 2) as printed for Montgomery §15.2.1', () => {
    // Montgomery §15.2.1 plan (first-hand), OC by a binomial CDF: the exercise sheet prints 0.93969, 0.736578, 0.498483, 0.304158, 0.172077 (first-hand);
    // jstat's binomial CDF gives the same.
    const printed: Array<[number, number]> = [
      [0.01, 0.93969],
      [0.02, 0.736578],
      [0.03, 0.498483],
      [0.04, 0.304158],
      [0.05, 0.172077],
    ];
    const cdf = new Float64Array(3);
    for (const [p, pa] of printed) {
      passFailDefinition.fillCountCdf(p, 89, cdf);
      expect(Math.abs(cdf[2] - pa)).toBeLessThan(5e-6);
      expect(cdf[2]).toBeCloseTo(binomialCdf(2, 89, p), 9);
    }
  });

  it('use the Poisson CDF for count data, confirmed by jstat', () => {
    const spec: LinearCountSpec = { model: 'count', lambda0: 1, lambda1: 2, alpha: 0.1, beta: 0.1 };
    const plan = single(spec);
    if (plan === null) throw new Error('no single plan found');
    const poissonInUnits = (c: number, m: number, rate: number): number => poissonCdf(c, m * rate);
    // jstat 1.9.6 Poisson CDF as the outside reference.
    expect(plan.acceptH0).toBeCloseTo(poissonCdf(plan.c, plan.n * 1), 9);
    expect(plan.acceptH1).toBeCloseTo(poissonCdf(plan.c, plan.n * 2), 9);
    expect(plan.acceptH0).toBeGreaterThanOrEqual(0.9);
    expect(plan.acceptH1).toBeLessThanOrEqual(0.1);
    expect(noSmallerPlan(poissonInUnits, spec, 1, 2, plan.n)).toBe(true);
  });

  it('fill Poisson CDFs that reproduce Birolini: beta 0.1 with c = 1 needs m = 3.88972', () => {
    // Birolini 2007, Reliability Engineering, §7.1 (first-hand): Birolini (2007) §7.1, m = 3.9 (first-hand); P(X <= 1; 3.88972) = 0.1.
    const cdf = new Float64Array(2);
    countDefinition.fillCountCdf(3.88972, 1, cdf);
    expect(cdf[1]).toBeCloseTo(0.1, 5);
    expect(cdf[1]).toBeCloseTo(poissonCdf(1, 3.88972), 12); // jstat
  });
});
