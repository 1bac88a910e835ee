// Independent references for the exact recursion: walk every path of results one item at a time
// (depth first), deciding each path with decisionAt, instead of propagating a density over counts.
import { decisionAt } from '../../src-main/engine/index.js';
import type { IntegerLines } from '../../src-main/engine/index.js';

export interface BruteForceResult {
  accept: number;
  reject: number;
  asn: number;
}

/**
 * Enumerates all 2^n pass/fail sequences of a truncated plan (truncation n small), summing the
 * probability of each sequence into accept or reject at the item where it is decided.
 */
export function enumerateBernoulli(lines: IntegerLines, p: number): BruteForceResult {
  const truncation = lines.truncation;
  if (truncation === null || truncation > 20) throw new Error('brute force needs a truncation of at most 20');
  const result = { accept: 0, reject: 0, asn: 0 };
  for (let mask = 0; mask < 2 ** truncation; mask++) {
    let probability = 1;
    let total = 0;
    for (let n = 1; n <= truncation; n++) {
      const failed = (mask >> (n - 1)) & 1;
      probability *= failed ? p : 1 - p;
      total += failed;
      const { decision } = decisionAt(lines, n, total);
      if (decision !== 'continue') {
        // Every sequence sharing this prefix is decided here; count it once, from the mask whose
        // remaining bits are all zero.
        if (mask >> n === 0) {
          result[decision] += probability;
          result.asn += n * probability;
        }
        break;
      }
    }
  }
  return result;
}

/**
 * Walks every sequence of Poisson counts per unit (each count up to maxCount, whose tail beyond is
 * below 1e-15 for the rates used) for a truncated plan.
 */
export function enumeratePoisson(lines: IntegerLines, rate: number, maxCount: number): BruteForceResult {
  const pmf: number[] = [];
  let term = Math.exp(-rate);
  for (let k = 0; k <= maxCount; k++) {
    pmf.push(term);
    term *= rate / (k + 1);
  }
  const result = { accept: 0, reject: 0, asn: 0 };
  const walk = (n: number, total: number, probability: number): void => {
    for (let k = 0; k <= maxCount; k++) {
      const next = probability * pmf[k];
      const { decision } = decisionAt(lines, n + 1, total + k);
      if (decision === 'continue') walk(n + 1, total + k, next);
      else {
        result[decision] += next;
        result.asn += (n + 1) * next;
      }
    }
  };
  walk(0, 0, 1);
  return result;
}
