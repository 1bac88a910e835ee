import type { LinearCountDefinition } from './models/linearCountDefinition.js';
import type { LinearCountSpec } from './spec.js';

/** Wald's approximate OC and ASN at one quality. */
export interface WaldPoint {
  /** P(accept), Wald's approximation. */
  oc: number;
  /** Average sample number, Wald's approximation. */
  asn: number;
  /** The nonzero root h of E_theta[exp(h z)] = 1 (0 at the quality where E[z] = 0). */
  h: number;
}

/**
 * The nonzero root h of ln E_theta[exp(h z)] = 0; +-Infinity when there is none (a quality at
 * the edge, e.g. p = 0, where the OC is 1 or 0).
 *
 * Method: ln E[e^{hz}] is convex, 0 at h = 0 with slope E[z], so the other root lies on the side
 * opposite to the sign of E[z]; bracket it by doubling, then bisect to machine precision.
 * References: Wald, A. (1947), Sequential Analysis, §A.1 (existence and sign of h);
 * common practice, no source (bisection).
 */
export function solveWaldExponent(model: LinearCountDefinition<LinearCountSpec>, spec: LinearCountSpec, theta: number): number {
  const mean = model.meanIncrement(spec, theta);
  if (mean === 0) return 0;
  const direction = mean < 0 ? 1 : -1; // ln E[e^{hz}] is convex with slope E[z] at 0: the root lies opposite.
  let inside = 0;
  let outside = direction;
  let doublings = 0;
  while (!(model.logMomentGenerating(spec, theta, outside) > 0)) {
    inside = outside;
    outside *= 2;
    if (++doublings > 1100) return direction * Number.POSITIVE_INFINITY;
  }
  for (let i = 0; i < 200; i++) {
    const middle = 0.5 * (inside + outside);
    if (middle === inside || middle === outside) break;
    if (model.logMomentGenerating(spec, theta, middle) > 0) outside = middle;
    else inside = middle;
  }
  return 0.5 * (inside + outside);
}

/**
 * Wald's OC from the exponent h, in a form that neither overflows nor cancels.
 *
 * Method: OC = (A^h - 1)/(A^h - B^h); with x = h ln A, y = h ln B this is
 * expm1(-x)/expm1(y - x) for h > 0 and (e^{-y} - e^{x-y})/(-expm1(x - y)) for h < 0;
 * the limit at h = 0 is ln A/(ln A - ln B).
 * References: Wald, A. (1947), Sequential Analysis, §3.2.
 */
export function waldOcFromExponent(h: number, lnA: number, lnB: number): number {
  if (h === Number.POSITIVE_INFINITY) return 1;
  if (h === Number.NEGATIVE_INFINITY) return 0;
  if (h === 0) return lnA / (lnA - lnB);
  const x = h * lnA;
  const y = h * lnB;
  if (h > 0) return Math.expm1(-x) / Math.expm1(y - x);
  return (Math.exp(-y) - Math.exp(x - y)) / -Math.expm1(x - y);
}

/**
 * Wald's approximate OC and ASN at quality theta (no overshoot: the LLR is taken to stop exactly on
 * ln A or ln B).
 *
 * Method: solve E_theta[exp(h z)] = 1 for h != 0; OC = (A^h - 1)/(A^h - B^h);
 * ASN = (OC ln B + (1 - OC) ln A)/E_theta[z]; where E_theta[z] = 0: OC = ln A/(ln A - ln B) and
 * ASN = -ln A ln B / E_theta[z^2].
 * References: Wald, A. (1947), Sequential Analysis, Wiley, §3.2 (OC) and §3.3 (ASN);
 * Wald 1947 OC/ASN formulas (computed independently).
 */
export function waldPoint(
  model: LinearCountDefinition<LinearCountSpec>,
  spec: LinearCountSpec,
  lnA: number,
  lnB: number,
  theta: number,
): WaldPoint {
  const mean = model.meanIncrement(spec, theta);
  const scale = Math.sqrt(model.secondMomentIncrement(spec, theta));
  // Near E[z] = 0 the ratio form divides two vanishing numbers; the limit is exact there.
  if (Math.abs(mean) <= 1e-9 * scale) {
    return { oc: lnA / (lnA - lnB), asn: (-lnA * lnB) / model.secondMomentIncrement(spec, theta), h: 0 };
  }
  const h = solveWaldExponent(model, spec, theta);
  const oc = waldOcFromExponent(h, lnA, lnB);
  return { oc, asn: (oc * lnB + (1 - oc) * lnA) / mean, h };
}

/**
 * The quality at which E_theta[z] = 0, where Wald's ASN curve peaks (for the linear models this is
 * the slope of the lines).
 *
 * Method: bisection on E_theta[z], which increases from theta0 (negative: -D(H0||H1)) to theta1
 * (positive: D(H1||H0)).
 * References: Wald, A. (1947), Sequential Analysis, §3.3.
 */
export function neutralQuality(model: LinearCountDefinition<LinearCountSpec>, spec: LinearCountSpec): number {
  let { theta0: low, theta1: high } = model.hypotheses(spec);
  for (let i = 0; i < 200; i++) {
    const middle = 0.5 * (low + high);
    if (middle === low || middle === high) break;
    if (model.meanIncrement(spec, middle) < 0) low = middle;
    else high = middle;
  }
  return 0.5 * (low + high);
}
