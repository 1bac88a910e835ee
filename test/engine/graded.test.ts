import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { PlanParameterError, designGradedPlan, gradedLiveState, gradedPlan } from '../../src-main/engine/index.js';
import type { GradedSpec } from '../../src-main/engine/index.js';
import { classCountRecursion } from '../../src-main/engine/models/graded/classCountRecursion.js';
import { simulateGradedSprt } from '../../src-main/engine/models/graded/gradedSimulation.js';
import { nistExactTruncated156 } from '../reference/referenceValues.js';

const threeClass: GradedSpec = {
  model: 'graded', classes: ['conforming', 'minor', 'major'], p0: [0.9, 0.08, 0.02], p1: [0.75, 0.17, 0.08], alpha: 0.05, beta: 0.1,
};

/** Independent brute force: every sequence of classes up to the truncation, each stopped at its first decision. */
function bruteForce(weights: Float64Array, q: number[], lnA: number, lnB: number, truncation: number) {
  let accept = 0;
  let asn = 0;
  const walk = (n: number, llr: number, probability: number): void => {
    for (let k = 0; k < q.length; k++) {
      const next = llr + weights[k];
      const p = probability * q[k];
      if (next >= lnA - 1e-12) asn += (n + 1) * p;
      else if (next <= lnB + 1e-12) {
        accept += p;
        asn += (n + 1) * p;
      } else if (n + 1 === truncation) {
        if (next <= 1e-12) accept += p;
        asn += (n + 1) * p;
      } else walk(n + 1, next, p);
    }
  };
  walk(0, 0, 1);
  return { accept, asn };
}

describe('graded model (k classes)', () => {
  it('with two classes gives the NIST pass/fail lines h1 0.939, h2 1.205, slope 0.0397 and exact recursion over the integer lines (computed independently, checked by simulation) exact OC/ASN', () => {
    const design = designGradedPlan(
      { model: 'graded', classes: ['pass', 'fail'], p0: [0.99, 0.01], p1: [0.9, 0.1], alpha: 0.05, beta: 0.1, truncation: 156 },
      { curvePoints: 2 },
    );
    // NIST/SEMATECH e-Handbook §6.2.6 printed values (from memory), recomputed in NIST/SEMATECH e-Handbook §6.2.6 (first-hand).
    expect(design.boundaries.h1).toBeCloseTo(0.939, 3);
    expect(design.boundaries.h2).toBeCloseTo(1.205, 3);
    expect(design.boundaries.slope).toBeCloseTo(0.0397, 4);
    // The pass/fail plan truncated at 156, computed with exactOcAsn (test/reference): OC 0.97794, ASN 30.209 at p = 0.01; 0.09964, 22.366 at p = 0.10.
    const [atH0, , atH1] = nistExactTruncated156;
    expect(1 - (design.exact?.alpha ?? NaN)).toBeCloseTo(atH0[1], 4);
    expect(design.exact?.asnH0).toBeCloseTo(atH0[2], 2);
    expect(design.exact?.beta).toBeCloseTo(atH1[1], 4);
    expect(design.exact?.asnH1).toBeCloseTo(atH1[2], 2);
  });

  it('the class-count recursion equals brute-force enumeration of all 3^n sequences (n_t = 7)', () => {
    const plan = gradedPlan({ ...threeClass, alpha: 0.2, beta: 0.2 });
    for (const q of [[0.9, 0.08, 0.02], [0.75, 0.17, 0.08], [0.5, 0.3, 0.2]]) {
      const exact = classCountRecursion(plan.weights, Float64Array.from(q), plan.lnA, plan.lnB, [0, 0, 0], 7, 400, 0);
      const brute = bruteForce(plan.weights, q, plan.lnA, plan.lnB, 7);
      expect(exact.accept).toBeCloseTo(brute.accept, 12);
      expect(exact.asn).toBeCloseTo(brute.asn, 11);
    }
  });

  it('property: recursion equals brute force for random 3-class vectors and truncations up to 6 (fast-check)', () => {
    const probability = fc.double({ min: 0.02, max: 0.9, noNaN: true });
    fc.assert(
      fc.property(probability, probability, probability, probability, fc.integer({ min: 1, max: 6 }), (a, b, c, d, truncation) => {
        const p0 = [a + 1, b, c].map((x, _, all) => x / (all[0] + all[1] + all[2]));
        const p1 = [d, b + 0.5, c + 0.5].map((x, _, all) => x / (all[0] + all[1] + all[2]));
        const plan = gradedPlan({ ...threeClass, p0, p1, alpha: 0.1, beta: 0.2 });
        const exact = classCountRecursion(plan.weights, Float64Array.from(p1), plan.lnA, plan.lnB, [0, 0, 0], truncation, 400, 0);
        const brute = bruteForce(plan.weights, p1, plan.lnA, plan.lnB, truncation);
        return Math.abs(exact.accept - brute.accept) < 1e-12 && Math.abs(exact.asn - brute.asn) < 1e-10;
      }),
      { numRuns: 60, seed: 8 },
    );
  });

  it('exact OC/ASN agree with a seeded simulation within 4 standard errors, and Wald bounds hold (Wald 1947 §3, (from memory))', () => {
    const design = designGradedPlan({ ...threeClass, truncation: 120 }, { curvePoints: 2 });
    const plan = gradedPlan({ ...threeClass, truncation: 120 });
    const simulated = simulateGradedSprt(plan.weights, Float64Array.from(threeClass.p1), plan.lnA, plan.lnB, 120, 40000, 11);
    expect(Math.abs(simulated.accept - (design.exact?.beta ?? NaN))).toBeLessThan(4 * simulated.acceptStandardError);
    expect(Math.abs(simulated.asn - (design.exact?.asnH1 ?? NaN))).toBeLessThan(4 * simulated.asnStandardError);
    const untruncated = designGradedPlan(threeClass, { curvePoints: 2 });
    expect((untruncated.exact?.alpha ?? 1) + (untruncated.exact?.beta ?? 1)).toBeLessThanOrEqual(0.15);
  });

  it('simulates, with standard errors, beyond three classes', () => {
    const design = designGradedPlan(
      { model: 'graded', classes: ['ok', 'a', 'b', 'c'], p0: [0.9, 0.05, 0.03, 0.02], p1: [0.75, 0.1, 0.07, 0.08], alpha: 0.05, beta: 0.1 },
      { curvePoints: 2, simulationRuns: 4000 },
    );
    expect(design.exact).toBeNull();
    expect(design.simulated?.h0.acceptStandardError).toBeGreaterThan(0);
    // Wald 1947 §3 bound (from memory): beta' <= beta/(1 - alpha), with simulation noise of 4 standard errors.
    expect(design.simulated?.h1.accept).toBeLessThan(0.1 / 0.95 + 4 * (design.simulated?.h1.acceptStandardError ?? 0));
  });

  it('Wald OC over the mixture family is alpha at t = 0 and beta at t = 1, and falls along it', () => {
    const design = designGradedPlan(threeClass, { curvePoints: 7 });
    expect(design.wald.alpha).toBeCloseTo(0.05, 10);
    expect(design.wald.beta).toBeCloseTo(0.1, 10);
    for (let i = 1; i < design.curve.length; i++) expect(design.curve[i].ocWald).toBeLessThan(design.curve[i - 1].ocWald);
  });

  it('linearCountLiveState from the counts per class matches the design at the start and decides on the lines', () => {
    const design = designGradedPlan({ ...threeClass, truncation: 100 }, { curvePoints: 2 });
    const start = gradedLiveState({ ...threeClass, truncation: 100 }, [0, 0, 0]);
    expect(start.probabilityAcceptH1).toBeCloseTo(design.exact?.beta ?? NaN, 12);
    expect(gradedLiveState(threeClass, [0, 0, 3]).decision).toBe('reject'); // 3 ln 4 = 4.16 >= ln 18
    expect(gradedLiveState(threeClass, [13, 0, 0]).decision).toBe('accept'); // 13 ln(0.75/0.9) = -2.37 <= ln(0.1/0.95)
  });

  it.each([
    ['p0', { p0: [0.9, 0.08, 0.03] }, /p0 must sum to 1 within 1e-9/],
    ['classes', { classes: ['a', 'a', 'b'] }, /classes must be 2 to 10 distinct/],
    ['p1', { p1: [0.95, 0.03, 0.02] }, /p1 must make the second class/],
  ])('rejects a bad %s with PlanParameterError naming it', (_, change, message) => {
    const call = () => gradedPlan({ ...threeClass, ...change } as GradedSpec);
    expect(call).toThrow(PlanParameterError);
    expect(call).toThrow(message);
  });
});
