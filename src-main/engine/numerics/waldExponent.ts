import { waldOcFromExponent } from '../waldCurve.js';

/** The law of one LLR increment z at some quality, as Wald's OC and ASN need it. */
export interface IncrementLaw {
  /** E[z]. */
  mean: number;
  /** E[z^2]. */
  secondMoment: number;
  /** ln E[exp(h z)]. */
  logMomentGenerating(h: number): number;
}

/**
 * Wald's OC and ASN (or expected test time, when z is the LLR per unit of time) for any increment law.
 *
 * Method: h != 0 solves ln E[exp(h z)] = 0 (convex, slope E[z] at 0, so the root lies on the side
 * opposite to E[z]; bracketed by doubling, then the secant-bisection hybrid of the Illinois
 * method); OC = (A^h - 1)/(A^h - B^h), ASN = (OC ln B + (1 - OC) ln A)/E[z]; where E[z] = 0,
 * OC = ln A/(ln A - ln B) and ASN = -ln A ln B/E[z^2].
 * References: Wald, A. (1947), Sequential Analysis, Wiley, §3.2 and §3.3, §A.1; Dowell, M. and
 * Jarratt, P. (1971), "A modified regula falsi method", BIT 11 (the Illinois step).
 */
export function waldOperatingPoint(law: IncrementLaw, lnA: number, lnB: number): { oc: number; asn: number; h: number } {
  if (Math.abs(law.mean) <= 1e-9 * Math.sqrt(law.secondMoment)) {
    return { oc: lnA / (lnA - lnB), asn: (-lnA * lnB) / law.secondMoment, h: 0 };
  }
  const direction = law.mean < 0 ? 1 : -1;
  let inside = 0;
  let insideValue = 0;
  let outside = direction * Math.min(1, 1 / Math.sqrt(law.secondMoment));
  let outsideValue = law.logMomentGenerating(outside);
  for (let doublings = 0; !(outsideValue > 0); doublings++) {
    if (doublings > 1100 || !Number.isFinite(outside)) {
      const h = direction * Number.POSITIVE_INFINITY;
      return { oc: waldOcFromExponent(h, lnA, lnB), asn: (direction > 0 ? lnB : lnA) / law.mean, h };
    }
    inside = outside;
    insideValue = outsideValue;
    outside *= 2;
    outsideValue = law.logMomentGenerating(outside);
  }
  // Illinois regula falsi between inside (value <= 0) and outside (value > 0).
  let side = 0;
  let h = inside;
  for (let i = 0; i < 200; i++) {
    h = (inside * outsideValue - outside * insideValue) / (outsideValue - insideValue);
    if (!(h > Math.min(inside, outside) && h < Math.max(inside, outside))) h = 0.5 * (inside + outside);
    const value = law.logMomentGenerating(h);
    if (value > 0) {
      outside = h;
      outsideValue = value;
      if (side === 1) insideValue *= 0.5;
      side = 1;
    } else {
      inside = h;
      insideValue = value;
      if (side === -1) outsideValue *= 0.5;
      side = -1;
    }
    if (Math.abs(outside - inside) <= 1e-14 * Math.abs(h)) break;
  }
  const oc = waldOcFromExponent(h, lnA, lnB);
  return { oc, asn: (oc * lnB + (1 - oc) * lnA) / law.mean, h };
}
