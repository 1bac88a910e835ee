import { describe, expect, it } from 'vitest';
import { designLinearCountPlan, neutralQuality, resolvePlan, waldPoint } from '../../src-main/engine/index.js';
import type { LinearCountSpec } from '../../src-main/engine/index.js';
import { countSpecFirst, countSpecSecond, countWaldAsn, nistWaldAsnLimits, nistWaldColumns, waldSpecialPoints } from '../reference/referenceValues.js';
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

  it('match the Wald 1947 OC/ASN formulas at the special points of the NIST and Montgomery plans', () => {
    // Computed with waldOcAsn (test/reference); tolerance 1e-3 relative for ASN, 1e-4 absolute for OC.
    for (const [name, asnH0, asnNeutral, asnH1, ocNeutral] of waldSpecialPoints) {
      const spec = name === 'nist' ? nist : montgomery;
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
    // Computed with waldOcAsn and waldAsnAllFailing (test/reference): NIST 23.621 and 1.2553.
    expect(wald(nist, 0).oc).toBe(1);
    expect(wald(nist, 0).asn).toBeCloseTo(nistWaldAsnLimits.atZero, 3);
    expect(wald(nist, 1 - 1e-9).oc).toBeLessThan(1e-6);
    expect(wald(nist, 1 - 1e-9).asn).toBeCloseTo(nistWaldAsnLimits.allFailing, 3);
  });

  it('follow the reference Wald columns for the NIST plan', () => {
    // Computed with waldOcAsn (test/reference), written to 4 decimals (OC) and 2 (ASN).
    for (const [p, oc, asn] of nistWaldColumns) {
      expect(Math.abs(wald(nist, p).oc - oc)).toBeLessThan(5e-5);
      expect(Math.abs(wald(nist, p).asn - asn)).toBeLessThan(5e-3);
    }
  });

  it('follow the reference Wald ASN for count data (no published example)', () => {
    // Computed with waldOcAsn (test/reference), written to 3 decimals.
    const specs: Record<'first' | 'second', LinearCountSpec> = { first: { ...countSpecFirst }, second: { ...countSpecSecond } };
    for (const [plan, rate, asn] of countWaldAsn) expect(Math.abs(wald(specs[plan], rate).asn - asn)).toBeLessThan(5e-4);
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
