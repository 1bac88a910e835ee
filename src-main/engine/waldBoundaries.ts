import type { KlDivergences } from './models/linearCountDefinition.js';
import { validatedDefinition } from './models/linearCountDefinitions.js';
import type { LinearCountSpec } from './spec.js';

/** Wald's limits on the LLR and the same limits as lines in (items, cumulative count). */
export interface WaldBoundaries {
  /** ln A = ln((1-beta)/alpha): reject H0 when LLR >= ln A. */
  lnA: number;
  /** ln B = ln(beta/(1-alpha)): accept H0 when LLR <= ln B. */
  lnB: number;
  /** Intercept of the acceptance line: accept when count <= slope n - h1. */
  h1: number;
  /** Intercept of the rejection line: reject when count >= slope n + h2. */
  h2: number;
  /** Common slope of both lines, in count per item. */
  slope: number;
}

/**
 * Wald's ln A and ln B from the two risks.
 *
 * Method: A = (1-beta)/alpha, B = beta/(1-alpha); reject when the likelihood ratio >= A, accept when <= B.
 * References: Wald, A. (1947), Sequential Analysis, Wiley, §3.2; Wald 1947 ch. 3 (from memory).
 */
export function waldLimits(alpha: number, beta: number): { lnA: number; lnB: number } {
  return { lnA: Math.log((1 - beta) / alpha), lnB: Math.log(beta / (1 - alpha)) };
}

/**
 * Wald's SPRT limits for a plan, in LLR units and in count units.
 *
 * Method: ln A = ln((1-beta)/alpha), ln B = ln(beta/(1-alpha)); continue while ln B < LLR < ln A.
 * With LLR = k d - b n (d the cumulative count after n items; k = countWeight, b = itemOffset):
 * h1 = -ln B / k, h2 = ln A / k, slope = b / k, so accept iff d <= slope n - h1 and reject iff
 * d >= slope n + h2. h1, h2 and slope do not depend on the log base.
 * References: Wald, A. (1945), "Sequential tests of statistical hypotheses", Ann. Math. Statist.
 * 16(2):117-186; NIST/SEMATECH e-Handbook of Statistical Methods (2012), §6.2.6.
 *
 * @throws PlanParameterError for an invalid spec.
 */
export function waldBoundaries(spec: LinearCountSpec): WaldBoundaries {
  const model = validatedDefinition(spec);
  const { lnA, lnB } = waldLimits(spec.alpha, spec.beta);
  const { countWeight, itemOffset } = model.linearStatistic(spec);
  return { lnA, lnB, h1: -lnB / countWeight, h2: lnA / countWeight, slope: itemOffset / countWeight };
}

/**
 * Kullback-Leibler divergences per observation between the two hypotheses, in nats.
 *
 * Method: h0h1 = D(H0 || H1) = E_0[ln(f0/f1)] = -E_0[z]; h1h0 = D(H1 || H0) = E_1[z].
 * Pass/fail: D = p ln(p/q) + (1-p) ln((1-p)/(1-q)); count: D = a ln(a/b) + b - a.
 * References: Kullback, S. and Leibler, R. A. (1951), "On information and sufficiency",
 * Ann. Math. Statist. 22(1):79-86; Wald, A. (1947), Sequential Analysis, ch. 4 (ASN).
 *
 * @throws PlanParameterError for an invalid spec.
 */
export function klDivergences(spec: LinearCountSpec): KlDivergences {
  return validatedDefinition(spec).klDivergences(spec);
}
