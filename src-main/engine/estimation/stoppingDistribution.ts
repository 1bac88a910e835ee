import { PlanParameterError } from '../errors.js';
import { rawAcceptanceNumber, rejectionNumber, truncationAcceptanceNumber } from '../integerLines.js';
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

/** Poisson jump sizes past which the probability is negligible (P(jump > K) < ~1e-17). */
function poissonReach(rate: number): number {
  return Math.ceil(rate + 12 * Math.sqrt(rate) + 30);
}

/**
 * Builds the exact stopping-distribution evaluator of a plan (validated here, once; truncation and an
 * exact-risk fit are taken from the spec). The recursion keeps the undecided probability by count in a
 * typed array windowed over the live band of counts, and allocates nothing per item.
 *
 * Method: forward recursion over the cumulative count d. With m_n(d) = P(undecided with count d after
 * n items), m_n(d) = sum_j m_{n-1}(d - j) P(step = j) (Bernoulli(p) per item, Poisson(lambda) per
 * unit); then P(stop at (n, d)) = m_n(d) for d <= Ac(n) (accept) or d >= Re(n) (reject), and at the
 * truncation count n_t every remaining d stops (accept iff d <= floor(s n_t)). Ac, Re and the
 * truncation rule are the engine's integer lines. Poisson jumps beyond lambda + 12 sqrt(lambda) + 30
 * are dropped (probability below 1e-17).
 * References: Armitage, P. (1958), "Numerical studies in the sequential estimation of a binomial
 * parameter", Biometrika 45(1/2):1-15 (the boundary distribution of a binomial sequential plan);
 * Jennison, C. and Turnbull, B. W. (2000), Group Sequential Methods with Applications to Clinical
 * Trials, §8.4; common practice, no source for the recursion and its guards.
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
  const truncationAcceptance = truncationAcceptanceNumber(lines) ?? -1;

  let acceptance = new Int32Array(0);
  let rejection = new Int32Array(0);
  let mass = new Float64Array(0);
  let next = new Float64Array(0);
  let stepPmf = new Float64Array(0);
  let reach = 1; // largest jump of the count in one step

  /** Bound tables for item counts 0..n and count buffers wide enough; grows by doubling, so rarely allocates. */
  function ensureCapacity(n: number): void {
    if (n >= acceptance.length) {
      const size = Math.min(maxSteps + 1, Math.max(n + 1, acceptance.length * 2, 256));
      acceptance = new Int32Array(size);
      rejection = new Int32Array(size);
      for (let k = 0; k < size; k++) {
        acceptance[k] = rawAcceptanceNumber(lines, k);
        rejection[k] = rejectionNumber(lines, k);
      }
    }
    const countSize = Math.max(rejection[acceptance.length - 1], 0) + reach + 2;
    if (countSize > mass.length) {
      const grown = new Float64Array(Math.max(countSize, 2 * mass.length));
      grown.set(mass);
      mass = grown;
      next = new Float64Array(grown.length);
    }
  }

  function fillPoissonStep(rate: number): void {
    reach = poissonReach(rate);
    if (stepPmf.length < reach + 1) stepPmf = new Float64Array(2 * reach + 1);
    const logRate = Math.log(rate);
    let logPmf = -rate;
    for (let k = 0; k <= reach; k++) {
      stepPmf[k] = rate === 0 ? (k === 0 ? 1 : 0) : Math.exp(logPmf);
      logPmf += logRate - Math.log(k + 1);
    }
  }

  // What to do with each stopped point: compare with an observed point, and optionally record it.
  let observedSide: StagewiseSide = StagewiseSide.accept;
  let observedItemCount = 0;
  let observedTotal = 0;
  let below = 0;
  let equal = 0;
  let above = 0;
  let meanNaive = 0;
  let record: StoppingPoint[] | null = null;

  function stop(side: StagewiseSide, n: number, d: number, probability: number, accepted: boolean): void {
    meanNaive += (probability * d) / n;
    const order = compareStagewise(side, n, d, observedSide, observedItemCount, observedTotal);
    if (order < 0) below += probability;
    else if (order > 0) above += probability;
    else equal += probability;
    if (record !== null && probability > 0) {
      record.push({ itemCount: n, total: d, decision: accepted ? 'accept' : 'reject', side, probability });
    }
  }

  /** Runs the recursion at `quality`; returns the undecided probability left. */
  function run(quality: number): number {
    below = equal = above = meanNaive = 0;
    if (countStep === 'poisson') fillPoissonStep(quality);
    else reach = 1;
    ensureCapacity(Math.min(maxSteps, 256));
    const p = quality;
    const q = 1 - quality;
    mass[0] = 1;
    let low = 0;
    let high = 0;
    let n = 0;
    while (n < maxSteps) {
      n += 1;
      if (n >= acceptance.length || rejection[n] + reach + 2 > mass.length) ensureCapacity(n);
      const buffer = mass;
      if (countStep === 'bernoulli') {
        buffer[high + 1] = buffer[high] * p;
        for (let d = high; d > low; d--) buffer[d] = buffer[d] * q + buffer[d - 1] * p;
        buffer[low] *= q;
        high += 1;
      } else {
        const newHigh = high + reach;
        for (let target = low; target <= newHigh; target++) {
          let sum = 0;
          const top = target < high ? target : high;
          const bottom = target - reach > low ? target - reach : low;
          for (let d = bottom; d <= top; d++) sum += buffer[d] * stepPmf[target - d];
          next[target] = sum;
        }
        for (let target = low; target <= newHigh; target++) buffer[target] = next[target];
        high = newHigh;
      }
      const acceptBelow = acceptance[n];
      const rejectFrom = rejection[n];
      if (lines.truncation !== null && n >= lines.truncation) {
        for (let d = low; d <= high; d++) {
          const accepted = d <= acceptBelow || (d < rejectFrom && d <= truncationAcceptance);
          stop(StagewiseSide.truncation, n, d, buffer[d], accepted);
          buffer[d] = 0;
        }
        high = low - 1;
        break;
      }
      while (low <= high && low <= acceptBelow) {
        stop(StagewiseSide.accept, n, low, buffer[low], true);
        buffer[low] = 0;
        low += 1;
      }
      while (high >= low && high >= rejectFrom) {
        stop(StagewiseSide.reject, n, high, buffer[high], false);
        buffer[high] = 0;
        high -= 1;
      }
      // Sum the live band itself: 1 - (stopped mass) stalls near 1e-13 from rounding over long runs.
      let remaining = 0;
      for (let d = low; d <= high; d++) remaining += buffer[d];
      if (low > high || remaining < tolerance) break;
    }
    let undecided = 0;
    for (let d = low; d <= high; d++) {
      undecided += mass[d];
      mass[d] = 0; // leave the buffer clean for the next run
    }
    return undecided;
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
