/** Exact OC and ASN of a graded SPRT with 2 or 3 classes, by recursion over the class counts. */
export interface ClassCountPoint {
  accept: number;
  reject: number;
  asn: number;
  undecided: number;
  /** Last item count reached. */
  steps: number;
}

const GUARD = 1e-12;

/**
 * Forward recursion over the counts of classes 1 and 2 (class 0 fills the rest) from a starting
 * count vector, stopping at the truncation (sign rule), or when the undecided probability is below
 * `undecidedStop`, or at `maxSteps` items (then reporting the remainder as undecided).
 *
 * Method: after each item, mass[a][b] <- q0 mass[a][b] + q1 mass[a-1][b] + q2 mass[a][b-1] in place
 * (a and b run downwards so the old values are read first); states with LLR >= ln A reject, with
 * LLR <= ln B accept; the LLR is n z_0 + a (z_1 - z_0) + b (z_2 - z_0).
 * References: Wald, A. (1947), Sequential Analysis, §3.1; Aroian, L. A. (1968), "Sequential
 * analysis, direct method", Technometrics 10(1) (direct recursion over the sample space).
 */
export function classCountRecursion(
  weights: Float64Array,
  q: Float64Array,
  lnA: number,
  lnB: number,
  start: readonly number[],
  stepsLeft: number | null,
  maxSteps: number,
  undecidedStop: number,
): ClassCountPoint {
  const three = weights.length === 3;
  const steps = stepsLeft === null ? maxSteps : Math.min(stepsLeft, maxSteps);
  const size = steps + 1;
  const stride = three ? size : 1;
  const mass = new Float64Array(size * stride);
  const q0 = q[0];
  const q1 = q[1];
  const q2 = three ? q[2] : 0;
  const z0 = weights[0];
  const d1 = weights[1] - z0;
  const d2 = three ? weights[2] - z0 : 0;
  let startLlr = 0;
  for (let k = 0; k < weights.length; k++) startLlr += start[k] * weights[k];
  mass[0] = 1;
  let accept = 0;
  let reject = 0;
  let asn = 0;
  let undecided = 1;
  let n = 0;
  for (n = 1; n <= steps; n++) {
    asn += undecided;
    const last = stepsLeft !== null && n === stepsLeft;
    const base = startLlr + n * z0;
    let remaining = 0;
    for (let a = n; a >= 0; a--) {
      const bTop = three ? n - a : 0;
      for (let b = bTop; b >= 0; b--) {
        const index = a * stride + b;
        let value = q0 * mass[index];
        if (a > 0) value += q1 * mass[index - stride];
        if (b > 0) value += q2 * mass[index - 1];
        if (value === 0) {
          mass[index] = 0;
          continue;
        }
        const llr = base + a * d1 + b * d2;
        if (llr >= lnA - GUARD || (last && llr > GUARD)) {
          reject += value;
          mass[index] = 0;
        } else if (llr <= lnB + GUARD || last) {
          accept += value;
          mass[index] = 0;
        } else {
          mass[index] = value;
          remaining += value;
        }
      }
    }
    undecided = remaining;
    if (last || undecided < undecidedStop) break;
  }
  return { accept, reject, asn, undecided, steps: Math.min(n, steps) };
}
