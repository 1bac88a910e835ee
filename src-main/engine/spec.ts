/**
 * Plan specifications: what the engineer asks for. A discriminated union on `model`; the later
 * models (measurement, lifetime, graded) add a member here and a definition under `models/`.
 *
 * Conventions used throughout the engine:
 * - H0 is the acceptable quality (p0, lambda0), H1 the rejectable quality (p1, lambda1).
 * - alpha = P(reject | H0), the producer's risk; beta = P(accept | H1), the consumer's risk.
 * - OC(theta) = P(accept | theta).
 * - Logarithms are natural (nats) unless a name says otherwise.
 */

export type FitMode = 'wald' | 'exact';

interface CommonSpec {
  /** Producer's risk, P(reject | H0), in (0, 1). */
  alpha: number;
  /** Consumer's risk, P(accept | H1), in (0, 1), with alpha + beta < 1. */
  beta: number;
  /** Item count at which the plan stops and decides on the sign of the LLR; null or absent for none. */
  truncation?: number | null;
  /** 'wald' uses Wald's limits; 'exact' fits the intercepts so the exact risks meet the nominal ones. */
  fit?: FitMode;
}

/** Pass/fail items: fraction nonconforming p, hypotheses p0 < p1. */
export interface PassFailSpec extends CommonSpec {
  model: 'passfail';
  p0: number;
  p1: number;
}

/** Nonconformities counted per unit (Poisson): rate per unit, hypotheses lambda0 < lambda1. */
export interface CountSpec extends CommonSpec {
  model: 'count';
  lambda0: number;
  lambda1: number;
}

export type PlanSpec = PassFailSpec | CountSpec;

export type ModelName = PlanSpec['model'];
