import { describe, expect, it } from 'vitest';
import { PlanParameterError, designLinearCountPlan } from '../../src-main/engine/index.js';
import { nistExactUntruncated } from '../reference/referenceValues.js';
import { nist } from './planFixtures.js';

describe('designLinearCountPlan', () => {
  it('has exactly the keys of the CLI contract, and the extras', () => {
    const design = designLinearCountPlan(nist);
    for (const key of ['boundaries', 'kl', 'wald', 'exact', 'single', 'limits', 'curve']) expect(design).toHaveProperty(key);
    expect(Object.keys(design.boundaries).sort()).toEqual(['h1', 'h2', 'lnA', 'lnB', 'slope']);
    expect(Object.keys(design.wald).sort()).toEqual(['asnH0', 'asnH1', 'asnMax']);
    expect(Object.keys(design.exact).sort()).toEqual(
      ['alpha', 'asnH0', 'asnH1', 'beta', 'quantilesH0', 'quantilesH1', 'undecided'].sort(),
    );
    expect(Object.keys(design.curve[0]).sort()).toEqual(['asnExact', 'asnWald', 'ocExact', 'ocWald', 'theta']);
    expect(design.curve).toHaveLength(51);
  });

  it('for the NIST example gives single (52, 2) and limits up to 3 x 52 items', () => {
    const design = designLinearCountPlan(nist);
    // Montgomery §15.2.3 (first-hand), minimal plans computed independently and NIST §6.2.6 (first-hand) rule of thumb: truncate at 3 x the single plan's n.
    expect(design.single).toMatchObject({ n: 52, c: 2 });
    expect(design.threeTimesSingle).toBe(156);
    expect(design.limits).toHaveLength(156);
    expect(design.limits[0]).toEqual({ n: 1, accept: null, reject: 2 });
    expect(design.limits[23]).toEqual({ n: 24, accept: 0, reject: 3 }); // NIST §6.2.6 (first-hand)
    // Exact ASN at H0 30.213 (computed with exactOcAsn, test/reference) against 52: saving 1 - 30.213/52.
    const [, atH0] = nistExactUntruncated;
    expect(design.saving?.h0).toBeCloseTo(1 - atH0[2] / 52, 3);
  });

  it('puts the truncation rule in the last limits row and in words', () => {
    const design = designLinearCountPlan({ ...nist, truncation: 156 });
    expect(design.limits).toHaveLength(156);
    // exact recursion over the integer lines (computed independently, checked by simulation): at n_t = 156 accept iff d <= floor(s n_t) = 6.
    expect(design.limits[155]).toEqual({ n: 156, accept: 6, reject: 7 });
    expect(design.truncationRule).toContain('at n = 156');
    expect(design.truncationRule).toContain('at most 6');
    expect(design.exact.undecided).toBe(0);
  });

  it('gives quantiles of the item count consistent with the distribution it returns', () => {
    const design = designLinearCountPlan(nist);
    const cumulative = (values: number[], n: number): number => values.slice(0, n + 1).reduce((a, b) => a + b, 0);
    const { p50, p90, p99 } = design.exact.quantilesH0;
    for (const [quantile, q] of [
      [p50, 0.5],
      [p90, 0.9],
      [p99, 0.99],
    ] as const) {
      if (quantile === null) throw new Error('missing quantile');
      expect(cumulative(design.sampleSizeDistribution.h0, quantile)).toBeGreaterThanOrEqual(q - 1e-12);
      expect(cumulative(design.sampleSizeDistribution.h0, quantile - 1)).toBeLessThan(q);
    }
    // No decision is possible before n = 2 in the NIST plan (NIST/SEMATECH e-Handbook §6.2.6 (first-hand) table), so p50 >= 2.
    expect(p50).toBeGreaterThanOrEqual(2);
  });

  it('runs the curve from quality 0 to twice the rejectable quality, Wald and exact side by side', () => {
    const design = designLinearCountPlan(nist, { curvePoints: 11 });
    expect(design.curve.map((point) => point.theta)).toEqual(Array.from({ length: 11 }, (_, i) => (0.2 * i) / 10));
    const atP1 = design.curve[5];
    expect(atP1.ocWald).toBeCloseTo(0.1, 10); // Wald's OC is beta at p1 by construction
    expect(atP1.ocExact).toBeCloseTo(nistExactUntruncated[6][1], 5); // 0.09958, computed with exactOcAsn (test/reference)
  });

  it('rejects a bad number of curve points with a specific error', () => {
    expect(() => designLinearCountPlan(nist, { curvePoints: 1 })).toThrow(
      new PlanParameterError('curvePoints', 1, 'an integer from 2 to 10001'),
    );
  });
});
