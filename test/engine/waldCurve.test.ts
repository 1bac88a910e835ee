import { describe, expect, it } from 'vitest';
import { designLinearCountPlan, neutralQuality, resolvePlan, waldPoint } from '../../src-main/engine/index.js';
import type { LinearCountSpec } from '../../src-main/engine/index.js';
import { montgomery, nist } from './planFixtures.js';

function wald(spec: LinearCountSpec, theta: number) {
  const plan = resolvePlan(spec);
  return waldPoint(plan.model, spec, plan.lnA, plan.lnB, theta);
}

describe("Wald's OC and ASN", () => {
  it('give OC = 1 - alpha at H0 and beta at H1 (h = 1 and h = -1)', () => {
    // Wald (1947) §3.2, from memory (from memory): E_0[e^z] = 1 and E_1[e^{-z}] = 1 put the OC at the two risk points.
    for (const spec of [nist, montgomery, { model: 'count', lambda0: 1, lambda1: 2, alpha: 0.1, beta: 0.1 } as LinearCountSpec]) {
      const plan = resolvePlan(spec);
      const { theta0, theta1 } = plan.model.hypotheses(spec);
      expect(wald(spec, theta0).oc).toBeCloseTo(1 - spec.alpha, 10);
      expect(wald(spec, theta0).h).toBeCloseTo(1, 10);
      expect(wald(spec, theta1).oc).toBeCloseTo(spec.beta, 10);
    }
  });

  it('match the Wald 1947 OC/ASN formulas (computed independently) special points for the NIST and Montgomery plans', () => {
    // Wald 1947 OC/ASN formulas (computed independently); tolerance 1e-3 relative for ASN, 1e-4 absolute for OC.
    const cases: Array<[LinearCountSpec, number, number, number, number]> = [
      [nist, 27.957, 29.65, 16.447, 0.56215],
      [montgomery, 59.726, 70.075, 40.419, 0.56215],
    ];
    for (const [spec, asnH0, asnNeutral, asnH1, ocNeutral] of cases) {
      const { wald: asn } = designLinearCountPlan(spec, { curvePoints: 2 });
      expect(Math.abs(asn.asnH0 / asnH0 - 1)).toBeLessThan(1e-3);
      expect(Math.abs(asn.asnH1 / asnH1 - 1)).toBeLessThan(1e-3);
      expect(Math.abs(asn.asnMax / asnNeutral - 1)).toBeLessThan(1e-3);
      const atNeutral = wald(spec, neutralQuality(resolvePlan(spec).model, spec));
      expect(atNeutral.oc).toBeCloseTo(ocNeutral, 4);
      // The KL form and the curve agree at the hypotheses.
      expect(wald(spec, spec.model === 'passfail' ? spec.p0 : 0).asn).toBeCloseTo(asn.asnH0, 8);
    }
  });

  it('tend to OC 1 and ASN h1/s at p = 0, and OC 0 and ASN h2/(1-s) as p -> 1', () => {
    // Wald 1947 OC/ASN formulas (computed independently): NIST 23.621 and 1.2553.
    expect(wald(nist, 0).oc).toBe(1);
    expect(wald(nist, 0).asn).toBeCloseTo(23.621, 3);
    expect(wald(nist, 1 - 1e-9).oc).toBeLessThan(1e-6);
    expect(wald(nist, 1 - 1e-9).asn).toBeCloseTo(1.2553, 3);
  });

  it('follow the exact recursion over the integer lines (computed independently, checked by simulation) Wald columns for the NIST plan', () => {
    // exact recursion over the integer lines (computed independently, checked by simulation), printed to 4 decimals (OC) and 2 (ASN).
    const table: Array<[number, number, number]> = [
      [0.005, 0.984, 26.04],
      [0.02, 0.8415, 30.34],
      [0.03, 0.7019, 30.75],
      [0.05, 0.4305, 27.53],
      [0.07, 0.2432, 22.6],
      [0.15, 0.023, 10.49],
      [0.2, 0.0052, 7.45],
    ];
    for (const [p, oc, asn] of table) {
      expect(Math.abs(wald(nist, p).oc - oc)).toBeLessThan(5e-5);
      expect(Math.abs(wald(nist, p).asn - asn)).toBeLessThan(5e-3);
    }
  });

  it('follow Poisson SPRT lines and exact recursion (computed independently; no published example) for count data', () => {
    // Poisson SPRT lines and exact recursion (computed independently; no published example).
    const first: LinearCountSpec = { model: 'count', lambda0: 1, lambda1: 2, alpha: 0.1, beta: 0.1 };
    expect(wald(first, 1).asn).toBeCloseTo(5.728, 3);
    expect(wald(first, 2).asn).toBeCloseTo(4.55, 3);
    const second: LinearCountSpec = { model: 'count', lambda0: 0.5, lambda1: 1, alpha: 0.05, beta: 0.1 };
    expect(wald(second, 0.5).asn).toBeCloseTo(12.998, 3);
    expect(wald(second, 1).asn).toBeCloseTo(12.303, 3);
  });

  it('are continuous across the quality where E[z] = 0', () => {
    // Common practice, no source: the limit form and the ratio form must meet at s.
    const s = neutralQuality(resolvePlan(nist).model, nist);
    const at = wald(nist, s);
    for (const offset of [1e-7, -1e-7, 1e-5, -1e-5]) {
      const near = wald(nist, s + offset);
      expect(Math.abs(near.oc - at.oc)).toBeLessThan(1e-3);
      expect(Math.abs(near.asn - at.asn)).toBeLessThan(1e-2);
    }
  });
});
