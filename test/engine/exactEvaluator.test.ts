import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { createExactEvaluator, createPlanEvaluator, waldBoundaries } from '../../src-main/engine/index.js';
import { enumerateBernoulli, enumeratePoisson } from './bruteForce.js';
import {
  countExact,
  countSpecFirst,
  countSpecSecond,
  montgomeryExact,
  nistExactAtSlope,
  nistExactTruncated156,
  nistExactTruncated156AtSlope,
  nistExactUntruncated,
  nistTrueRisks,
} from '../reference/referenceValues.js';
import { linesOf, montgomery, nist } from './planFixtures.js';

// Suggested tolerances of common practice, no source: 1e-4 absolute for probabilities, 1e-3 relative for ASN.
function expectPoint(actual: { accept: number; asn: number }, oc: number, asn: number): void {
  expect(Math.abs(actual.accept - oc)).toBeLessThan(1e-4);
  expect(Math.abs(actual.asn - asn) / asn).toBeLessThan(1e-3);
}

describe('exact OC and ASN of the untruncated NIST plan', () => {
  const evaluator = createExactEvaluator(linesOf(nist), 'bernoulli');
  // Computed with exactOcAsn in test/reference/generateReferenceValues.ts (plain recursion, jstat step laws).
  it.each(nistExactUntruncated)('at p = %f has OC %f and ASN %f', (p, oc, asn) => {
    const point = evaluator.evaluate(p);
    expectPoint(point, oc, asn);
    expect(point.undecided).toBeLessThan(1e-12);
  });

  it('at p = s has OC 0.61863 and ASN 39.047', () => {
    // Computed with exactOcAsn (test/reference).
    expectPoint(evaluator.evaluate(waldBoundaries(nist).slope), nistExactAtSlope.oc, nistExactAtSlope.asn);
  });

  it('has true risks 0.0220 and 0.0996, inside Wald bounds', () => {
    // Computed with exactOcAsn (test/reference), written to 4 decimals.
    expect(Math.abs(evaluator.evaluate(0.01).reject - nistTrueRisks.alpha)).toBeLessThan(5e-5);
    expect(Math.abs(evaluator.evaluate(0.1).accept - nistTrueRisks.beta)).toBeLessThan(5e-5);
    expect(evaluator.evaluate(0.01).reject).toBeLessThan(0.05 / (1 - 0.1)); // Wald 1947 §3 (from memory): alpha' <= alpha/(1 - beta)
    expect(evaluator.evaluate(0.1).accept).toBeLessThan(0.1 / (1 - 0.05)); // and beta' <= beta/(1 - alpha)
  });
});

describe('exact OC and ASN of truncated plans', () => {
  it('matches the reference recursion for the NIST plan truncated at 156 = 3 x 52', () => {
    const evaluator = createExactEvaluator(linesOf(nist, 156), 'bernoulli');
    // Computed with exactOcAsn(..., 156) (test/reference).
    for (const [p, oc, asn] of nistExactTruncated156) expectPoint(evaluator.evaluate(p), oc, asn);
    expectPoint(evaluator.evaluate(waldBoundaries(nist).slope), nistExactTruncated156AtSlope.oc, nistExactTruncated156AtSlope.asn);
    expect(evaluator.evaluate(0.03).undecided).toBe(0);
  });

  it('matches the reference recursion for the Montgomery plan, untruncated and truncated at 330', () => {
    const s = waldBoundaries(montgomery).slope;
    // Computed with exactOcAsn (test/reference).
    for (const [truncation, quality, oc, asn] of montgomeryExact) {
      const evaluator = createExactEvaluator(linesOf(montgomery, truncation), 'bernoulli');
      expectPoint(evaluator.evaluate(quality === 'slope' ? s : quality), oc, asn);
    }
  });
});

describe('exact OC and ASN for count data', () => {
  it('matches the reference recursion for lambda 1 -> 2 and 0.5 -> 1 (no published example)', () => {
    // Computed with exactOcAsn, Poisson steps from jstat (test/reference).
    const evaluators = { first: createPlanEvaluator({ ...countSpecFirst }), second: createPlanEvaluator({ ...countSpecSecond }) };
    for (const [plan, rate, oc, asn] of countExact) expectPoint(evaluators[plan].evaluate(rate), oc, asn);
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
          // The recursion may stop early with up to 1e-12 undecided; the exact values lie within that remainder.
          expect(actual.undecided).toBeLessThan(1e-12);
          const slack = actual.undecided + 5e-13;
          expect(Math.abs(actual.accept - expected.accept)).toBeLessThan(slack);
          expect(Math.abs(actual.reject - expected.reject)).toBeLessThan(slack);
          expect(Math.abs(actual.asn - expected.asn)).toBeLessThan(truncation * slack + 5e-12);
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
