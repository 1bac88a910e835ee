/**
 * Plan specifications: what the engineer asks for. One discriminated union on `model`, one member
 * per model; each model's folder under `models/` turns its member into a plan.
 *
 * Conventions used throughout the engine:
 * - H0 is the acceptable quality (p0, lambda0, mu0, theta0), H1 the rejectable one.
 * - alpha = P(reject | H0), the producer's risk; beta = P(accept | H1), the consumer's risk.
 * - OC(theta) = P(accept | theta).
 * - Logarithms are natural (nats) unless a name says otherwise.
 */

export type FitMode = 'wald' | 'exact';

interface LinearCountCommon {
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
export interface PassFailSpec extends LinearCountCommon {
  model: 'passfail';
  p0: number;
  p1: number;
}

/** Nonconformities counted per unit (Poisson): rate per unit, hypotheses lambda0 < lambda1. */
export interface CountSpec extends LinearCountCommon {
  model: 'count';
  lambda0: number;
  lambda1: number;
}

/**
 * The models whose LLR is linear in one cumulative whole count (pass/fail, count): they share the
 * integer acceptance/rejection numbers and the exact recursion over them.
 */
export type LinearCountSpec = PassFailSpec | CountSpec;

/**
 * Normal measurements with known sigma: mean mu0 (acceptable) against mu1 (rejectable), mu1 above
 * or below mu0. Evidence: n measurements and their sum. Truncation counts measurements.
 */
export interface MeasurementSpec {
  model: 'measurement';
  mu0: number;
  mu1: number;
  /** Known standard deviation of one measurement, > 0, in the measurement's unit. */
  sigma: number;
  alpha: number;
  beta: number;
  truncation?: number | null;
  /** Pull both limits inward by Siegmund's rho |mu1 - mu0| / sigma so the true risks come near nominal. */
  overshootCorrection?: boolean;
  /** The measurement's unit, for display only (e.g. "mm"). */
  unit?: string;
}

/**
 * Exponential times to failure (reliability demonstration): MTBF theta0 (acceptable) against
 * theta1 < theta0 (rejectable). Evidence: accumulated test time T and failures r.
 */
export interface LifetimeSpec {
  model: 'lifetime';
  theta0: number;
  theta1: number;
  alpha: number;
  beta: number;
  /** Accumulated test time at which an undecided test stops: accept iff LLR <= 0 there. */
  maxTime?: number | null;
  /** Failure count at which an undecided test stops and rejects. */
  maxFailures?: number | null;
  /** The unit of time, for display only (e.g. "unit-hours"). */
  unit?: string;
}

/** Items graded into k classes (e.g. conforming / minor / major), probability vectors p0 and p1. */
export interface GradedSpec {
  model: 'graded';
  /** Class names, 2 to 10, distinct; the first is the reference class (usually "conforming"). */
  classes: string[];
  p0: number[];
  p1: number[];
  alpha: number;
  beta: number;
  truncation?: number | null;
}

/** Every plan the engine designs, discriminated by `model`. */
export type PlanSpec = PassFailSpec | CountSpec | MeasurementSpec | LifetimeSpec | GradedSpec;

/** The name of a data model: the one list of models, from which the registry and the renderer take theirs. */
export type ModelName = PlanSpec['model'];

/** The spec of one model. */
export type SpecOf<M extends ModelName> = Extract<PlanSpec, { model: M }>;
