import { seededRandom } from '../../numerics/seededRandom.js';

/** Simulated OC and ASN with their standard errors. */
export interface SimulatedPoint {
  accept: number;
  acceptStandardError: number;
  asn: number;
  asnStandardError: number;
  /** Share of runs still undecided at the item cap (untruncated plans only). */
  undecided: number;
  runs: number;
  seed: number;
}

/**
 * Simulates a graded SPRT: items fall into class k with probability q_k, the LLR adds z_k, and a
 * run (from LLR startLlr, with `truncation` items left) stops at a line, at the truncation (accept iff LLR <= 0) or at `maxItems` (undecided).
 *
 * Method: `runs` independent runs from a seeded generator (class by inversion of the cumulative
 * q); P(accept) with standard error sqrt(p(1-p)/runs), ASN with the sample standard deviation over
 * sqrt(runs).
 * References: Wald, A. (1947), Sequential Analysis, §3.1; Ross, S. M. (2013), Simulation, 5th ed.,
 * ch. 8 (estimators and their standard errors).
 */
export function simulateGradedSprt(
  weights: Float64Array,
  q: Float64Array,
  lnA: number,
  lnB: number,
  truncation: number | null,
  runs: number,
  seed: number,
  maxItems = 100000,
  startLlr = 0,
): SimulatedPoint {
  const random = seededRandom(seed);
  const cumulative = new Float64Array(q.length);
  let running = 0;
  for (let k = 0; k < q.length; k++) {
    running += q[k];
    cumulative[k] = running;
  }
  const cap = truncation ?? maxItems;
  let accepted = 0;
  let undecided = 0;
  let sizeSum = 0;
  let sizeSquares = 0;
  for (let run = 0; run < runs; run++) {
    let llr = startLlr;
    let n = 0;
    let outcome = 0; // 1 accept, -1 reject, 0 undecided
    while (n < cap) {
      const u = random.uniform() * running;
      let k = 0;
      while (k < q.length - 1 && u > cumulative[k]) k++;
      llr += weights[k];
      n++;
      if (llr >= lnA - 1e-12) {
        outcome = -1;
        break;
      }
      if (llr <= lnB + 1e-12) {
        outcome = 1;
        break;
      }
    }
    if (outcome === 0 && truncation !== null) outcome = llr <= 1e-12 ? 1 : -1;
    if (outcome === 1) accepted++;
    if (outcome === 0) undecided++;
    sizeSum += n;
    sizeSquares += n * n;
  }
  const accept = accepted / runs;
  const asn = sizeSum / runs;
  const variance = Math.max(0, sizeSquares / runs - asn * asn) * (runs / Math.max(1, runs - 1));
  return {
    accept,
    acceptStandardError: Math.sqrt((accept * (1 - accept)) / runs),
    asn,
    asnStandardError: Math.sqrt(variance / runs),
    undecided: undecided / runs,
    runs,
    seed,
  };
}
