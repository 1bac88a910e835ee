import type { LinearCountSpec } from '../spec.js';

/** KL divergences per observation, in nats. */
export interface KlDivergences {
  /** D(H0 || H1) = -E_0[z]. */
  h0h1: number;
  /** D(H1 || H0) = E_1[z]. */
  h1h0: number;
}

/**
 * For models whose LLR is linear in one cumulative statistic T after n observations:
 * LLR = countWeight * T - itemOffset * n. Pass/fail and count models have T = the cumulative count,
 * which is what makes the integer acceptance/rejection numbers and the exact recursion possible.
 */
export interface LinearStatistic {
  countWeight: number;
  itemOffset: number;
}

/** The step law of the cumulative count at quality theta, for the exact recursion. */
export type CountStep = 'bernoulli' | 'poisson';

/**
 * What a data model supplies so the generic code (Wald limits, Wald OC/ASN, exact OC/ASN, single
 * plans, live state) works for it. A new model implements this and registers in `registry.ts`;
 * nothing generic changes.
 */
export interface LinearCountDefinition<S extends LinearCountSpec = LinearCountSpec> {
  readonly name: S['model'];
  /** Name of the quality parameter in output and messages, e.g. "p" or "lambda". */
  readonly qualityName: string;
  /** Largest quality value the model allows (1 for a fraction, Infinity for a rate). */
  readonly qualityUpperLimit: number;
  /** Throws PlanParameterError for anything invalid in the model's own parameters. */
  validate(spec: S): void;
  hypotheses(spec: S): { theta0: number; theta1: number };
  /** Log-likelihood ratio ln(f1(x)/f0(x)) of one observation x. */
  logLikelihoodRatio(spec: S, x: number): number;
  klDivergences(spec: S): KlDivergences;
  /** ln E_theta[exp(h z)] for the per-observation LLR z; Wald's OC solves this = 0 for h != 0. */
  logMomentGenerating(spec: S, theta: number, h: number): number;
  /** E_theta[z]. */
  meanIncrement(spec: S, theta: number): number;
  /** E_theta[z^2]. */
  secondMomentIncrement(spec: S, theta: number): number;
  /** The quality range a curve should cover by default. */
  curveRange(spec: S): { from: number; to: number };
  linearStatistic(spec: S): LinearStatistic;
  readonly countStep: CountStep;
  /** Cumulative probabilities P(count <= k) for k = 0..out.length-1 in n items at quality theta. */
  fillCountCdf(theta: number, n: number, out: Float64Array): void;
  /** Checks one observed result (a 0/1 item or a count per unit) and returns it as a number. */
  parseObservation(x: number): number | null;
}
