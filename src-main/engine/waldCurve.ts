import type { LinearCountDefinition } from './models/linearCountDefinition.js';
import { bisectBoundary, illinoisRoot } from './numerics/rootFinding.js';
import type { LinearCountSpec } from './spec.js';

/**
 * Wald's approximate OC and ASN, one solver for every model: each model describes the law of one
 * LLR increment (per item, per measurement or per unit of test time) and this module does the rest.
 */

/** The law of one LLR increment z at some quality, as Wald's OC and ASN need it. */
export interface IncrementLaw {
  /** E[z]. */
  mean: number;
  /** E[z^2]. */
  secondMoment: number;
  /** ln E[exp(h z)]. */
  logMomentGenerating(h: number): number;
  /** The nonzero root of ln E[exp(h z)] = 0 when it is known in closed form (skips the search). */
  exponent?: number;
}

/** Wald's approximate OC and ASN at one quality. */
export interface WaldPoint {
  /** P(accept), Wald's approximation. */
  oc: number;
  /** Average sample number (or expected test time, when z is the LLR per unit of time). */
  asn: number;
  /** The nonzero root h of E_theta[exp(h z)] = 1 (0 at the quality where E[z] = 0). */
  h: number;
}

/** |E[z]| below this times sqrt(E[z^2]) counts as E[z] = 0: the ratio forms divide two vanishing numbers there. */
const NEUTRAL_DRIFT = 1e-9;

/**
 * The nonzero root h of ln E[exp(h z)] = 0; 0 where E[z] = 0; +-Infinity when there is none (a
 * quality at the edge, e.g. p = 0, where the OC is 1 or 0).
 *
 * Method: ln E[e^{hz}] is convex, 0 at h = 0 with slope E[z], so the other root lies on the side
 * opposite to the sign of E[z]; bracket it by doubling from min(1, 1/sqrt(E[z^2])), then the
 * Illinois regula falsi (numerics/rootFinding) to a relative 1e-14.
 * References: Wald, A. (1947), Sequential Analysis, Wiley, §A.1 (existence and sign of h; from memory).
 */
export function waldExponent(law: IncrementLaw): number {
  if (law.mean === 0) return 0;
  if (law.exponent !== undefined) return law.exponent;
  const direction = law.mean < 0 ? 1 : -1;
  let inside = 0;
  let insideValue = 0;
  let outside = direction * Math.min(1, 1 / Math.sqrt(law.secondMoment));
  let outsideValue = law.logMomentGenerating(outside);
  for (let doublings = 0; !(outsideValue > 0); doublings++) {
    if (doublings > 1100 || !Number.isFinite(outside)) return direction * Number.POSITIVE_INFINITY;
    inside = outside;
    insideValue = outsideValue;
    outside *= 2;
    outsideValue = law.logMomentGenerating(outside);
  }
  return illinoisRoot((h) => law.logMomentGenerating(h), inside, insideValue, outside, outsideValue, 1e-14);
}

/**
 * Wald's OC from the exponent h, in a form that neither overflows nor cancels.
 *
 * Method: OC = (A^h - 1)/(A^h - B^h); with x = h ln A, y = h ln B this is
 * expm1(-x)/expm1(y - x) for h > 0 and (e^{-y} - e^{x-y})/(-expm1(x - y)) for h < 0;
 * the limit at h = 0 is ln A/(ln A - ln B).
 * References: Wald, A. (1947), Sequential Analysis, §3.2 (from memory).
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
 * Wald's OC and ASN (or expected test time, when z is the LLR per unit of time) for any increment
 * law, with the LLR taken to stop exactly on ln A or ln B (no overshoot).
 *
 * Method: h from waldExponent; OC = (A^h - 1)/(A^h - B^h), ASN = (OC ln B + (1 - OC) ln A)/E[z];
 * where E[z] = 0, OC = ln A/(ln A - ln B) and ASN = -ln A ln B/E[z^2].
 * References: Wald, A. (1947), Sequential Analysis, Wiley, §3.2 (OC) and §3.3 (ASN) (from memory).
 */
export function waldOperatingPoint(law: IncrementLaw, lnA: number, lnB: number): WaldPoint {
  if (Math.abs(law.mean) <= NEUTRAL_DRIFT * Math.sqrt(law.secondMoment)) {
    return { oc: lnA / (lnA - lnB), asn: (-lnA * lnB) / law.secondMoment, h: 0 };
  }
  const h = waldExponent(law);
  const oc = waldOcFromExponent(h, lnA, lnB);
  return { oc, asn: (oc * lnB + (1 - oc) * lnA) / law.mean, h };
}

/** The law of one item's LLR increment of a pass/fail or count plan at quality theta. */
export function linearCountIncrementLaw(
  model: LinearCountDefinition<LinearCountSpec>,
  spec: LinearCountSpec,
  theta: number,
): IncrementLaw {
  return {
    mean: model.meanIncrement(spec, theta),
    secondMoment: model.secondMomentIncrement(spec, theta),
    logMomentGenerating: (h) => model.logMomentGenerating(spec, theta, h),
  };
}

/**
 * The nonzero root h of ln E_theta[exp(h z)] = 0 for a pass/fail or count plan.
 *
 * Method and References: as waldExponent.
 */
export function solveWaldExponent(model: LinearCountDefinition<LinearCountSpec>, spec: LinearCountSpec, theta: number): number {
  return waldExponent(linearCountIncrementLaw(model, spec, theta));
}

/**
 * Wald's approximate OC and ASN of a pass/fail or count plan at quality theta.
 *
 * Method and References: as waldOperatingPoint.
 */
export function waldPoint(
  model: LinearCountDefinition<LinearCountSpec>,
  spec: LinearCountSpec,
  lnA: number,
  lnB: number,
  theta: number,
): WaldPoint {
  return waldOperatingPoint(linearCountIncrementLaw(model, spec, theta), lnA, lnB);
}

/**
 * The quality at which E_theta[z] = 0, where Wald's ASN curve peaks (for the linear models this is
 * the slope of the lines).
 *
 * Method: bisection (numerics/rootFinding) on the sign of E_theta[z], which increases from theta0
 * (negative: -D(H0||H1)) to theta1 (positive: D(H1||H0)).
 * References: Wald, A. (1947), Sequential Analysis, §3.3 (from memory).
 */
export function neutralQuality(model: LinearCountDefinition<LinearCountSpec>, spec: LinearCountSpec): number {
  const { theta0, theta1 } = model.hypotheses(spec);
  return bisectBoundary((theta) => model.meanIncrement(spec, theta) >= 0, theta0, theta1);
}
