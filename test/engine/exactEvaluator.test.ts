import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { createExactEvaluator, createPlanEvaluator, waldBoundaries } from '../../src-main/engine/index.js';
import { enumerateBernoulli, enumeratePoisson } from './bruteForce.js';
import { linesOf, montgomery, nist } from './planFixtures.js';

// Suggested tolerances of common practice, no source: 1e-4 absolute for probabilities, 1e-3 relative for ASN.
function expectPoint(actual: { accept: number; asn: number }, oc: number, asn: number): void {
  expect(Math.abs(actual.accept - oc)).toBeLessThan(1e-4);
  expect(Math.abs(actual.asn - asn) / asn).toBeLessThan(1e-3);
}

describe('exact OC and ASN of the untruncated NIST plan', () => {
  const evaluator = createExactEvaluator(linesOf(nist), 'bernoulli');
  // exact recursion over the integer lines (computed independently, checked by simulation) (DP checked there by Monte Carlo with 4e5 runs).
  const table: Array<[number, number, number]> = [
    [0.005, 0.9951, 27.09],
    [0.01, 0.97795, 30.213],
    [0.02, 0.8995, 35.67],
    [0.03, 0.7687, 38.77],
    [0.05, 0.4689, 37.12],
    [0.07, 0.2549, 30.83],
    [0.1, 0.09958, 22.369],
    [0.15, 0.0218, 14.33],
    [0.2, 0.0048, 10.35],
  ];
  it.each(table)('at p = %f has OC %f and ASN %f', (p, oc, asn) => {
    const point = evaluator.evaluate(p);
    expectPoint(point, oc, asn);
    expect(point.undecided).toBeLessThan(1e-12);
  });

  it('at p = s has OC 0.61863 and ASN 39.047', () => {
    // exact recursion over the integer lines (computed independently, checked by simulation).
    expectPoint(evaluator.evaluate(waldBoundaries(nist).slope), 0.61863, 39.047);
  });

  it('has true risks 0.0220 and 0.0996, inside Wald bounds', () => {
    // exact recursion over the integer lines (computed independently, checked by simulation): alpha' = 0.0220, beta' = 0.0996.
    expect(evaluator.evaluate(0.01).reject).toBeCloseTo(0.022, 4);
    expect(evaluator.evaluate(0.1).accept).toBeCloseTo(0.0996, 4);
  });
});

describe('exact OC and ASN of truncated plans', () => {
  it('matches exact recursion over the integer lines (computed independently, checked by simulation) for the NIST plan truncated at 156 = 3 x 52', () => {
    const evaluator = createExactEvaluator(linesOf(nist, 156), 'bernoulli');
    // exact recursion over the integer lines (computed independently, checked by simulation).
    expectPoint(evaluator.evaluate(0.01), 0.97794, 30.209);
    expectPoint(evaluator.evaluate(waldBoundaries(nist).slope), 0.61945, 38.814);
    expectPoint(evaluator.evaluate(0.1), 0.09964, 22.367);
    expect(evaluator.evaluate(0.03).undecided).toBe(0);
  });

  it('matches exact recursion over the integer lines (computed independently, checked by simulation) for the Montgomery plan, untruncated and truncated at 330', () => {
    const untruncated = createExactEvaluator(linesOf(montgomery), 'bernoulli');
    const truncated = createExactEvaluator(linesOf(montgomery, 330), 'bernoulli');
    const s = waldBoundaries(montgomery).slope;
    // exact recursion over the integer lines (computed independently, checked by simulation).
    expectPoint(untruncated.evaluate(0.01), 0.97142, 63.584);
    expectPoint(untruncated.evaluate(s), 0.60379, 86.435);
    expectPoint(untruncated.evaluate(0.06), 0.09892, 50.508);
    expectPoint(truncated.evaluate(0.01), 0.97138, 63.57);
    expectPoint(truncated.evaluate(s), 0.60412, 85.709);
    expectPoint(truncated.evaluate(0.06), 0.09901, 50.496);
  });
});

describe('exact OC and ASN for count data', () => {
  it('matches Poisson SPRT lines and exact recursion (computed independently; no published example) for lambda 1 -> 2 and 0.5 -> 1', () => {
    // Poisson SPRT lines and exact recursion (computed independently; no published example).
    const first = createPlanEvaluator({ model: 'count', lambda0: 1, lambda1: 2, alpha: 0.1, beta: 0.1 });
    expectPoint(first.evaluate(1), 0.94324, 7.3736);
    expectPoint(first.evaluate(2), 0.07592, 6.5947);
    const second = createPlanEvaluator({ model: 'count', lambda0: 0.5, lambda1: 1, alpha: 0.05, beta: 0.1 });
    expectPoint(second.evaluate(0.5), 0.96716, 14.8804);
    expectPoint(second.evaluate(1), 0.08251, 15.2471);
  });

  it('agrees with a walk over every sequence of counts for a plan truncated at 5 units', () => {
    // Independent method: depth-first enumeration of count sequences (bruteForce.ts).
    const lines = linesOf({ model: 'count', lambda0: 1, lambda1: 2, alpha: 0.1, beta: 0.1 }, 5);
    const evaluator = createExactEvaluator(lines, 'poisson');
    for (const rate of [0.5, 1, 1.5, 2]) {
      const expected = enumeratePoisson(lines, rate, 30);
      const actual = evaluator.evaluate(rate);
      expect(actual.accept).toBeCloseTo(expected.accept, 12);
      expect(actual.reject).toBeCloseTo(expected.reject, 12);
      expect(actual.asn).toBeCloseTo(expected.asn, 10);
    }
  });
});

describe('exact recursion against enumeration of all 2^n pass/fail sequences', () => {
  it('agrees on random plans truncated at up to 14 items', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.05, max: 0.3, noNaN: true }),
        fc.double({ min: 1.5, max: 4, noNaN: true }),
        fc.double({ min: 0.02, max: 0.2, noNaN: true }),
        fc.double({ min: 0.02, max: 0.2, noNaN: true }),
        fc.integer({ min: 1, max: 14 }),
        fc.double({ min: 0, max: 1, noNaN: true }),
        (p0, ratio, alpha, beta, truncation, p) => {
          const p1 = Math.min(0.95, p0 * ratio);
          const lines = linesOf({ model: 'passfail', p0, p1, alpha, beta }, truncation);
          const expected = enumerateBernoulli(lines, p);
          const actual = createExactEvaluator(lines, 'bernoulli').evaluate(p);
          expect(actual.accept).toBeCloseTo(expected.accept, 12);
          expect(actual.reject).toBeCloseTo(expected.reject, 12);
          expect(actual.asn).toBeCloseTo(expected.asn, 11);
          expect(actual.undecided).toBeLessThan(1e-12); // early stop once the undecided mass is below 1e-12
        },
      ),
      { numRuns: 150 },
    );
  });
});

describe('the evaluator as a hot loop', () => {
  it('evaluateMany writes the same values as evaluate, into preallocated arrays', () => {
    const evaluator = createExactEvaluator(linesOf(nist, 156), 'bernoulli');
    const qualities = Float64Array.from({ length: 21 }, (_, i) => i * 0.01);
    const accept = new Float64Array(21);
    const asn = new Float64Array(21);
    evaluator.evaluateMany(qualities, accept, asn);
    for (let i = 0; i < qualities.length; i++) {
      const point = evaluator.evaluate(qualities[i]);
      expect(accept[i]).toBe(point.accept);
      expect(asn[i]).toBe(point.asn);
    }
  });

  it('splits one step of the recursion exactly: P(accept) = q P(accept | 1, 0) + p P(accept | 1, 1)', () => {
    // Independent identity (first-step analysis), no reference numbers needed.
    const evaluator = createExactEvaluator(linesOf(montgomery, 200), 'bernoulli');
    const p = 0.03;
    const whole = evaluator.evaluate(p);
    const afterPass = evaluator.evaluateFrom(p, 1, 0);
    const afterFail = evaluator.evaluateFrom(p, 1, 1);
    expect(whole.accept).toBeCloseTo((1 - p) * afterPass.accept + p * afterFail.accept, 13);
    expect(whole.asn).toBeCloseTo(1 + (1 - p) * afterPass.asn + p * afterFail.asn, 10);
  });

  it('gives a distribution of the item count at the decision that sums to the decided mass', () => {
    const evaluator = createExactEvaluator(linesOf(nist), 'bernoulli');
    const { point, probabilities } = evaluator.sampleSizeDistribution(0.05);
    const sum = probabilities.reduce((a, b) => a + b, 0);
    const mean = probabilities.reduce((a, b, n) => a + n * b, 0);
    expect(sum).toBeCloseTo(1 - point.undecided, 13);
    expect(mean).toBeCloseTo(point.asn, 8);
    expect(probabilities[1]).toBe(0); // NIST: neither decision is possible at n = 1 (NIST/SEMATECH e-Handbook §6.2.6 (first-hand) table)
  });
});
