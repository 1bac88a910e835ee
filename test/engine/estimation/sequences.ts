// Independent references for the estimation tests: every pass/fail sequence of a small truncated
// plan, decided item by item with the engine's decisionAt (not with the stopping recursion), and
// the stagewise ordering written straight from its textbook definition.
import { decisionAt } from '../../../src-main/engine/index.js';
import type { IntegerLines } from '../../../src-main/engine/index.js';

/** One stopping point found by enumeration, with how many full sequences of each weight reach it. */
export interface EnumeratedStop {
  itemCount: number;
  total: number;
  decision: 'accept' | 'reject';
  /** True when the count is on or beyond a line at this item count (not only the truncation rule). */
  crossedLower: boolean;
  crossedUpper: boolean;
  /** sequencesByOnes[k] = number of full length-n_t sequences with k nonconforming items that stop here. */
  sequencesByOnes: number[];
}

/**
 * Walks all 2^n_t full pass/fail sequences and records where each one stops. A point's probability
 * at p is then sum_k sequencesByOnes[k] p^k (1-p)^(n_t-k), the sum over every completion.
 */
export function enumerateAllSequences(lines: IntegerLines): EnumeratedStop[] {
  const length = lines.truncation;
  if (length === null || length > 20) throw new Error('enumeration needs a truncation of at most 20');
  // The decision of every (n, d) once, from the engine's own rule.
  const decisions: string[][] = [];
  for (let n = 1; n <= length; n++) {
    decisions[n] = [];
    for (let d = 0; d <= n; d++) decisions[n][d] = decisionAt(lines, n, d).rule;
  }
  const stops = new Map<string, EnumeratedStop>();
  for (let sequence = 0; sequence < 2 ** length; sequence++) {
    let ones = 0;
    for (let bits = sequence; bits > 0; bits >>= 1) ones += bits & 1;
    let total = 0;
    for (let n = 1; n <= length; n++) {
      total += (sequence >> (n - 1)) & 1;
      const rule = decisions[n][total];
      if (rule.startsWith('continue')) continue;
      const key = `${n}:${total}`;
      let stop = stops.get(key);
      if (stop === undefined) {
        stop = {
          itemCount: n,
          total,
          decision: rule.startsWith('accept') ? 'accept' : 'reject',
          crossedLower: rule.startsWith('accept:'),
          crossedUpper: rule.startsWith('reject:'),
          sequencesByOnes: new Array<number>(length + 1).fill(0),
        };
        stops.set(key, stop);
      }
      stop.sequencesByOnes[ones] += 1;
      break;
    }
  }
  return [...stops.values()];
}

/** P_p(stop at this point), from the enumeration. */
export function enumeratedProbability(stop: EnumeratedStop, p: number): number {
  const length = stop.sequencesByOnes.length - 1;
  let sum = 0;
  for (let k = 0; k <= length; k++) {
    if (stop.sequencesByOnes[k] > 0) sum += stop.sequencesByOnes[k] * p ** k * (1 - p) ** (length - k);
  }
  return sum;
}

/**
 * Is a strictly higher than b in the stagewise ordering? Jennison and Turnbull (2000), Group
 * Sequential Methods with Applications to Clinical Trials, §8.4: (k', z') is above (k, z) if k' = k
 * and z' > z; or k' < k and z' >= b_k' (stopped by the upper line at k'); or k' > k and z <= a_k
 * (b stopped by the lower line at k). Here k is the item count and z the cumulative count.
 */
export function stagewiseAbove(a: EnumeratedStop, b: EnumeratedStop): boolean {
  if (a.itemCount === b.itemCount) return a.total > b.total;
  if (a.itemCount < b.itemCount) return a.crossedUpper;
  return b.crossedLower;
}

/** Stagewise tail probabilities of `observed` at p, by summing over the enumerated points. */
export function enumeratedTails(stops: EnumeratedStop[], observed: EnumeratedStop, p: number): { atLeast: number; atMost: number } {
  let atLeast = 0;
  let atMost = 0;
  for (const stop of stops) {
    const probability = enumeratedProbability(stop, p);
    if (!stagewiseAbove(observed, stop)) atLeast += probability;
    if (!stagewiseAbove(stop, observed)) atMost += probability;
  }
  return { atLeast, atMost };
}

/** Plain bisection for an increasing f on [0, 1], 100 halvings: the test's own root finder. */
export function bisect(f: (p: number) => number, target: number): number {
  let low = 0;
  let high = 1;
  if (f(low) >= target) return 0;
  if (f(high) < target) return 1;
  for (let i = 0; i < 100; i++) {
    const mid = (low + high) / 2;
    if (f(mid) < target) low = mid;
    else high = mid;
  }
  return (low + high) / 2;
}
