import { PlanParameterError } from '../errors.js';
import { createLineRecursion } from '../integerLineRecursion.js';
import type { ExactPoint, LineRecursionVisitor } from '../integerLineRecursion.js';
import type { IntegerLines } from '../integerLines.js';
import type { CountStep } from '../models/linearCountDefinition.js';
import { resolvePlan } from '../resolvePlan.js';
import type { LinearCountSpec } from '../spec.js';
import { StagewiseSide, compareStagewise } from './stagewiseOrder.js';

/** One point (n, d) at which a run of the plan stops, with its probability at the quality asked. */
export interface StoppingPoint {
  itemCount: number;
  total: number;
  decision: 'accept' | 'reject';
  /** Where the point sits in the stagewise ordering. */
  side: StagewiseSide;
  probability: number;
}

/** The exact distribution of the stopping point at one quality. */
export interface StoppingDistribution {
  quality: number;
  /** In order of item count, then count. */
  points: StoppingPoint[];
  /** Probability not yet stopped when an untruncated recursion ended (below the tolerance); 0 when truncated. */
  undecided: number;
}

/** Stagewise tail probabilities of one observed stopping point, and the mean of d/n, at one quality. */
export interface StagewiseTail {
  /** P(outcome lower than the observed one in the stagewise ordering). */
  below: number;
  /** P(outcome equal to the observed one). */
  equal: number;
  /** P(outcome higher than the observed one). */
  above: number;
  /** E[d / N], the mean of the naive estimate at the stopping point. */
  meanNaive: number;
  /** Probability not yet stopped when an untruncated recursion ended. */
  undecided: number;
}

export interface StoppingEvaluatorOptions {
  /** Untruncated plans: stop once the undecided probability is below this. Default 1e-12, as the engine's OC. */
  tolerance?: number;
  /** Untruncated plans: hard cap on the item count. Default 1,000,000. */
  maxSteps?: number;
}

/** An evaluator of the stopping distribution of one plan, built once and called at many qualities. */
export interface StoppingEvaluator {
  readonly spec: LinearCountSpec;
  readonly lines: IntegerLines;
  readonly countStep: CountStep;
  /** The quality under H0 (p0 or lambda0) and under H1. */
  readonly hypotheses: { theta0: number; theta1: number };
  /** Largest allowed quality: 1 for a fraction, Infinity for a rate per unit. */
  readonly qualityUpperLimit: number;
  /** Every stopping point with its probability at `quality` (allocates the result). */
  distribution(quality: number): StoppingDistribution;
  /** Tail probabilities of the stopping point (side, n, total) at `quality`; writes into `out`, no allocation. */
  tail(quality: number, side: StagewiseSide, itemCount: number, total: number, out?: StagewiseTail): StagewiseTail;
}

/**
 * Builds the exact stopping-distribution evaluator of a plan (validated here, once; truncation and an
 * exact-risk fit are taken from the spec): a point visitor on the engine's one forward recursion over
 * the integer lines (integerLineRecursion), so it shares the OC's lines, truncation rule and tolerance.
 *
 * Method: P(stop at (n, d)) is the undecided probability m_n(d) reaching d <= Ac(n) (accept) or
 * d >= Re(n) (reject) at item count n; at the truncation count n_t every remaining d stops (accept iff
 * d <= floor(s n_t)). Each point is compared with the observed one in the stagewise ordering as it
 * stops. Poisson jumps beyond lambda + 12 sqrt(lambda) + 30 are not listed one by one (probability
 * below 1e-17).
 * References: Armitage, P. (1958), "Numerical studies in the sequential estimation of a binomial
 * parameter", Biometrika 45(1/2):1-15 (the boundary distribution of a binomial sequential plan; from
 * memory); Jennison, C. and Turnbull, B. W. (2000), Group Sequential Methods with Applications to
 * Clinical Trials, §8.4 (from memory).
 *
 * @throws PlanParameterError for an invalid spec or options.
 */
export function createStoppingEvaluator(spec: LinearCountSpec, options: StoppingEvaluatorOptions = {}): StoppingEvaluator {
  const plan = resolvePlan(spec);
  const lines = plan.lines;
  const countStep = plan.model.countStep;
  const tolerance = options.tolerance ?? 1e-12;
  if (!(tolerance > 0 && tolerance < 1)) throw new PlanParameterError('tolerance', tolerance, 'a number in (0, 1)');
  const maxSteps = lines.truncation ?? options.maxSteps ?? 1_000_000;
  if (!Number.isInteger(maxSteps) || maxSteps < 1) throw new PlanParameterError('maxSteps', maxSteps, 'an integer >= 1');
  const recursion = createLineRecursion(lines, countStep, { tolerance, maxSteps });
  const result: ExactPoint = { accept: 0, reject: 0, undecided: 0, asn: 0, steps: 0 };

  // What to do with each stopped point: compare with an observed point, and optionally record it.
  let observedSide: StagewiseSide = StagewiseSide.accept;
  let observedItemCount = 0;
  let observedTotal = 0;
  let below = 0;
  let equal = 0;
  let above = 0;
  let meanNaive = 0;
  let record: StoppingPoint[] | null = null;

  const visitor: LineRecursionVisitor = {
    point(n, d, probability, accepted, atTruncation) {
      const side = atTruncation ? StagewiseSide.truncation : accepted ? StagewiseSide.accept : StagewiseSide.reject;
      meanNaive += (probability * d) / n;
      const order = compareStagewise(side, n, d, observedSide, observedItemCount, observedTotal);
      if (order < 0) below += probability;
      else if (order > 0) above += probability;
      else equal += probability;
      if (record !== null && probability > 0) {
        record.push({ itemCount: n, total: d, decision: accepted ? 'accept' : 'reject', side, probability });
      }
    },
  };

  /** Runs the recursion at `quality`; returns the undecided probability left. */
  function run(quality: number): number {
    below = equal = above = meanNaive = 0;
    return recursion.run(quality, 0, 0, visitor, result).undecided;
  }

  const { theta0, theta1 } = plan.model.hypotheses(spec);
  const upper = plan.model.qualityUpperLimit;
  return {
    spec,
    lines,
    countStep,
    hypotheses: { theta0, theta1 },
    qualityUpperLimit: upper,
    distribution(quality) {
      if (typeof quality !== 'number' || !(quality >= 0 && quality <= upper) || !Number.isFinite(quality)) {
        throw new PlanParameterError('quality', quality, upper === 1 ? 'a number in [0, 1]' : 'a finite number >= 0');
      }
      const points: StoppingPoint[] = [];
      record = points;
      try {
        const undecided = run(quality);
        points.sort((a, b) => a.itemCount - b.itemCount || a.total - b.total);
        return { quality, points, undecided };
      } finally {
        record = null;
      }
    },
    tail(quality, side, itemCount, total, out) {
      observedSide = side;
      observedItemCount = itemCount;
      observedTotal = total;
      const undecided = run(quality);
      const result = out ?? { below: 0, equal: 0, above: 0, meanNaive: 0, undecided: 0 };
      result.below = below;
      result.equal = equal;
      result.above = above;
      result.meanNaive = meanNaive;
      result.undecided = undecided;
      return result;
    },
  };
}
