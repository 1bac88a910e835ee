import { PlanParameterError } from '../../errors.js';
import type { Decision } from '../../integerLines.js';
import type { IncrementLaw } from '../../waldCurve.js';
import type { GradedSpec } from '../../spec.js';
import { checkRisksAndTruncation } from '../../validate.js';
import { waldLimits } from '../../waldBoundaries.js';
import type { KlDivergences } from '../linearCountDefinition.js';

/** A validated graded plan: the constants every later call uses. */
export interface GradedPlan {
  readonly spec: GradedSpec;
  readonly classCount: number;
  /** ln(p1_k/p0_k): the LLR of one item in class k. */
  readonly weights: Float64Array;
  readonly lnA: number;
  readonly lnB: number;
  readonly truncation: number | null;
  /** Largest t (<= 1.5) for which (1 - t) p0 + t p1 is still a probability vector. */
  readonly familyEnd: number;
}

const MAX_CLASSES = 10;

function checkVector(name: 'p0' | 'p1', value: unknown, length: number): asserts value is number[] {
  const allowed = `${length} probabilities in (0, 1), one per class, summing to 1`;
  if (!Array.isArray(value) || value.length !== length) throw new PlanParameterError(name, value, allowed);
  let sum = 0;
  for (const p of value) {
    if (typeof p !== 'number' || !Number.isFinite(p) || p <= 0 || p >= 1) throw new PlanParameterError(name, value, allowed);
    sum += p;
  }
  if (Math.abs(sum - 1) > 1e-9) {
    throw new PlanParameterError(name, value, allowed, `${name} must sum to 1 within 1e-9 (got ${sum})`);
  }
}

/**
 * Validates a graded spec once and returns the plan's constants.
 *
 * Method: z_k = ln(p1_k/p0_k) per item of class k; Wald's ln A, ln B. The second class must point
 * more towards H1 than the first (z_1 > z_0), so the first class is the reference and the second
 * the demerit unit.
 * References: Wald, A. (1947), Sequential Analysis, §3.1 (any likelihood ratio); Wald 1947 ch. 3 (from memory).
 *
 * @throws PlanParameterError naming the parameter, its value and what is allowed.
 */
export function gradedPlan(spec: GradedSpec): GradedPlan {
  if (spec === null || typeof spec !== 'object') throw new PlanParameterError('spec', spec, 'a plan specification object');
  const classes = spec.classes;
  const classesAllowed = `2 to ${MAX_CLASSES} distinct, non-empty class names`;
  if (!Array.isArray(classes) || classes.length < 2 || classes.length > MAX_CLASSES) {
    throw new PlanParameterError('classes', classes, classesAllowed);
  }
  if (classes.some((name) => typeof name !== 'string' || name.trim() === '') || new Set(classes).size !== classes.length) {
    throw new PlanParameterError('classes', classes, classesAllowed);
  }
  checkVector('p0', spec.p0, classes.length);
  checkVector('p1', spec.p1, classes.length);
  checkRisksAndTruncation({ alpha: spec.alpha, beta: spec.beta, truncation: spec.truncation });
  const weights = new Float64Array(classes.length);
  for (let k = 0; k < classes.length; k++) weights[k] = Math.log(spec.p1[k] / spec.p0[k]);
  if (!(weights[1] > weights[0])) {
    throw new PlanParameterError(
      'p1',
      spec.p1,
      `p1[1]/p0[1] > p1[0]/p0[0]`,
      `p1 must make the second class (${classes[1]}) relatively more likely than the first (${classes[0]}): p1[1]/p0[1] > p1[0]/p0[0]`,
    );
  }
  let familyEnd = 1.5;
  for (let k = 0; k < classes.length; k++) {
    const change = spec.p1[k] - spec.p0[k];
    if (change < 0) familyEnd = Math.min(familyEnd, spec.p0[k] / -change);
  }
  const { lnA, lnB } = waldLimits(spec.alpha, spec.beta);
  return { spec, classCount: classes.length, weights, lnA, lnB, truncation: spec.truncation ?? null, familyEnd };
}

/** The quality vector (1 - t) p0 + t p1 of the one-parameter family the curves run over. */
export function gradedQuality(plan: GradedPlan, t: number, out: Float64Array = new Float64Array(plan.classCount)): Float64Array {
  for (let k = 0; k < plan.classCount; k++) out[k] = Math.max(0, (1 - t) * plan.spec.p0[k] + t * plan.spec.p1[k]);
  return out;
}

/** LLR of a count vector: sum_k counts_k ln(p1_k/p0_k). */
export function gradedLogLikelihoodRatio(plan: GradedPlan, counts: readonly number[]): number {
  let llr = 0;
  for (let k = 0; k < plan.classCount; k++) llr += counts[k] * plan.weights[k];
  return llr;
}

/**
 * KL divergences per item.
 *
 * Method: D(p0 || p1) = sum_k p0_k ln(p0_k/p1_k), D(p1 || p0) = sum_k p1_k ln(p1_k/p0_k).
 * References: Kullback, S. and Leibler, R. A. (1951), Ann. Math. Statist. 22(1).
 */
export function gradedKl(plan: GradedPlan): KlDivergences {
  let h0h1 = 0;
  let h1h0 = 0;
  for (let k = 0; k < plan.classCount; k++) {
    h0h1 -= plan.spec.p0[k] * plan.weights[k];
    h1h0 += plan.spec.p1[k] * plan.weights[k];
  }
  return { h0h1, h1h0 };
}

/** The law of one item's LLR when classes occur with probabilities q. */
export function gradedIncrementLaw(plan: GradedPlan, q: Float64Array): IncrementLaw {
  let mean = 0;
  let secondMoment = 0;
  let largest = -Infinity;
  let smallest = Infinity;
  for (let k = 0; k < plan.classCount; k++) {
    mean += q[k] * plan.weights[k];
    secondMoment += q[k] * plan.weights[k] * plan.weights[k];
    if (q[k] > 0) {
      largest = Math.max(largest, plan.weights[k]);
      smallest = Math.min(smallest, plan.weights[k]);
    }
  }
  return {
    mean,
    secondMoment,
    // ln sum_k q_k e^{h z_k}, shifted by the largest exponent so it never overflows.
    logMomentGenerating(h) {
      const top = h > 0 ? h * largest : h * smallest;
      let sum = 0;
      for (let k = 0; k < plan.classCount; k++) if (q[k] > 0) sum += q[k] * Math.exp(h * plan.weights[k] - top);
      return top + Math.log(sum);
    },
  };
}

/** Lines for the demerit score: LLR = slope... in units of one second-class item. */
export interface GradedBoundaries {
  lnA: number;
  lnB: number;
  /** LLR per item of each class, nats. */
  weights: Array<{ className: string; llr: number }>;
  /** Demerits per item of each class: (z_k - z_0)/(z_1 - z_0); the reference class scores 0, the second 1. */
  demerits: Array<{ className: string; demerits: number }>;
  /** Accept when total demerits <= slope n - h1, reject when >= slope n + h2. */
  h1: number;
  h2: number;
  slope: number;
}

/**
 * The lines for the total demerits against n.
 *
 * Method: LLR = n z_0 + (z_1 - z_0) D with D = sum_k counts_k (z_k - z_0)/(z_1 - z_0), so
 * accept iff D <= slope n - h1 and reject iff D >= slope n + h2 with h1 = -ln B/(z_1 - z_0),
 * h2 = ln A/(z_1 - z_0), slope = -z_0/(z_1 - z_0). With two classes these are the pass/fail lines.
 * References: Wald, A. (1947), Sequential Analysis, ch. 5; NIST/SEMATECH e-Handbook §6.2.6 (the
 * two-class case); NIST/SEMATECH e-Handbook §6.2.6 (first-hand).
 */
export function gradedBoundaries(plan: GradedPlan): GradedBoundaries {
  const unit = plan.weights[1] - plan.weights[0];
  const classes = plan.spec.classes;
  return {
    lnA: plan.lnA,
    lnB: plan.lnB,
    weights: classes.map((className, k) => ({ className, llr: plan.weights[k] })),
    demerits: classes.map((className, k) => ({ className, demerits: (plan.weights[k] - plan.weights[0]) / unit })),
    h1: -plan.lnB / unit,
    h2: plan.lnA / unit,
    slope: -plan.weights[0] / unit,
  };
}

/** The decision from the count per class. */
export interface GradedDecision {
  decision: Decision;
  rule: string;
  llr: number;
}

/**
 * The decision from the counts per class.
 *
 * Method: reject iff LLR >= ln A, accept iff LLR <= ln B; at the truncation n_t accept iff LLR <= 0.
 * References: Wald, A. (1947), Sequential Analysis, §3.1; exact recursion over the integer lines (computed independently, checked by simulation) (the truncation
 * rule is a stated choice).
 */
export function decideGraded(plan: GradedPlan, counts: readonly number[]): GradedDecision {
  let n = 0;
  for (let k = 0; k < plan.classCount; k++) n += counts[k];
  const llr = gradedLogLikelihoodRatio(plan, counts);
  if (n > 0 && llr >= plan.lnA - 1e-12) return { decision: 'reject', rule: 'rejection line crossed', llr };
  if (n > 0 && llr <= plan.lnB + 1e-12) return { decision: 'accept', rule: 'acceptance line crossed', llr };
  if (plan.truncation !== null && n >= plan.truncation) {
    return llr <= 1e-12
      ? { decision: 'accept', rule: 'accept at truncation', llr }
      : { decision: 'reject', rule: 'reject at truncation', llr };
  }
  return { decision: 'continue', rule: 'between the lines', llr };
}

/**
 * Graded demerit lines for n = 1..length: accept at most `accept` (null: not yet possible), reject
 * at least `reject`; the truncation row holds the truncation rule (demerits <= slope n accepts).
 *
 * Method: D <= slope n - h1 accepts, D >= slope n + h2 rejects (gradedBoundaries).
 * References: Wald, A. (1947), Sequential Analysis, ch. 5.
 */
export function gradedLimitRows(plan: GradedPlan, length: number): Array<{ n: number; accept: number | null; reject: number }> {
  const boundaries = gradedBoundaries(plan);
  const rows = [];
  for (let n = 1; n <= length; n++) {
    const atTruncation = n === plan.truncation;
    const accept = boundaries.slope * n - (atTruncation ? 0 : boundaries.h1);
    rows.push({ n, accept: accept < 0 ? null : accept, reject: boundaries.slope * n + (atTruncation ? 0 : boundaries.h2) });
  }
  return rows;
}
