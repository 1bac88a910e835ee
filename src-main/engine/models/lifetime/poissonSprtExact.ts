import { fillIncompleteGammaIntegrals } from '../../distributions/gamma.js';
/**
 * Exact operating characteristics of a continuous-time SPRT on a Poisson failure process: after k
 * failures the test accepts at time acceptBase + k step (no further failure by then) and rejects at
 * the k-th failure if it comes at or before rejectBase + k step.
 */
export interface PoissonSprtLines {
  acceptBase: number;
  rejectBase: number;
  /** Time added to both lines by one failure. */
  step: number;
  /** Time at which an undecided test stops (null: none); it then accepts iff failures <= truncationAcceptFailures. */
  maxTime: number | null;
  truncationAcceptFailures: number;
  /** The failure at which an undecided test stops and rejects (null: none). */
  maxFailures: number | null;
}

export interface PoissonSprtPoint {
  accept: number;
  reject: number;
  /** Expected test time to the decision (of the decided part when undecided > 0). */
  expectedTime: number;
  undecided: number;
}

const UNDECIDED_STOP = 1e-12;
/** Longest piece in units of 1/rate, so the series for the incomplete gamma integrals converge fast. */
const PIECE_LENGTH = 2;

/**
 * Evaluates the plan at failure rate `rate` (1/MTBF).
 *
 * Method: in u = rate t the undecided density of the r-th failure time is e^{-u} P_r(u), with
 * P_1 = 1 on (0, accept time 0) and P_{r+1}(u) = int_{lo_r}^u P_r(v) dv, cut below the r-th reject
 * time (that mass rejects) and above the r-th accept time (no failure by then: that mass, e^{-u_a}
 * int P_r, accepts). Between consecutive line times P_r is a polynomial whose degree stays below
 * (ln A - ln B)/ln d + 2; it is held exactly on each piece as Taylor coefficients of
 * e^{-u0} P_r(u0 + x), all non-negative, so the recursion adds no cancellation; reject masses and
 * times use int_0^L x^k e^{-x} dx by its positive series. Untruncated, it runs until the undecided
 * probability is below 1e-12.
 * References: Wald, A. (1947), Sequential Analysis, ch. 5 (the exponential case); Epstein, B. and
 * Sobel, M. (1955), "Sequential life tests in the exponential case", Ann. Math. Statist. 26(1),
 * §3 (the boundaries in (T, r)); exact recursion over failures (computed independently by a time grid).
 */
export function evaluatePoissonSprt(lines: PoissonSprtLines, rate: number): PoissonSprtPoint {
  const degreeCap = Math.ceil((lines.acceptBase - lines.rejectBase) / lines.step) + 4;
  let horizonFailures = Math.max(16, 4 * degreeCap);
  for (;;) {
    const result = run(lines, rate, degreeCap, horizonFailures);
    if (result !== null) return result;
    horizonFailures *= 2;
  }
}

function run(lines: PoissonSprtLines, rate: number, degreeCap: number, horizonFailures: number): PoissonSprtPoint | null {
  const { acceptBase, rejectBase, step, maxTime, maxFailures } = lines;
  const lastAccept = maxFailures === null ? horizonFailures : Math.min(horizonFailures, maxFailures - 1);
  const horizon = maxTime === null ? acceptBase + lastAccept * step : Math.min(maxTime, acceptBase + lastAccept * step);
  // The horizon is only a working limit (not the plan's own end): reaching it means "start again, further".
  const workingLimit = lastAccept === horizonFailures && (maxTime === null || horizon < maxTime);
  // Breakpoints: 0, every accept and (positive) reject time up to the horizon, then subdivision.
  const marks: number[] = [0, horizon];
  for (let k = 0; acceptBase + k * step < horizon; k++) marks.push(acceptBase + k * step);
  for (let k = 1; rejectBase + k * step < horizon; k++) if (rejectBase + k * step > 0) marks.push(rejectBase + k * step);
  marks.sort((x, y) => x - y);
  const starts: number[] = [];
  for (let i = 0; i + 1 < marks.length; i++) {
    const width = marks[i + 1] - marks[i];
    if (width <= 1e-12 * Math.max(1, horizon)) continue;
    const parts = Math.ceil((rate * width) / PIECE_LENGTH);
    for (let p = 0; p < parts; p++) starts.push(marks[i] + (width * p) / parts);
  }
  const pieceCount = starts.length;
  starts.push(horizon);
  const stride = degreeCap + 1;
  let current = new Float64Array(pieceCount * stride);
  let next = new Float64Array(pieceCount * stride);
  const gammas = new Float64Array(stride + 1);
  // Index of the first piece starting at or after time t (pieces end exactly on the marks).
  const pieceAt = (t: number): number => {
    let low = 0;
    let high = pieceCount;
    while (low < high) {
      const middle = (low + high) >> 1;
      if (starts[middle] < t - 1e-12 * Math.max(1, Math.abs(t))) low = middle + 1;
      else high = middle;
    }
    return low;
  };

  let accept = 0;
  let reject = 0;
  let expectedTime = 0;
  const decideAtEnd = (failures: number, end: number, mass: number): void => {
    const atTruncation = maxTime !== null && end >= maxTime - 1e-12 * Math.max(1, maxTime);
    if (!atTruncation || failures <= lines.truncationAcceptFailures) accept += mass;
    else reject += mass;
    expectedTime += end * mass;
  };
  // No failure at all: decided at the first accept time or the truncation.
  decideAtEnd(0, horizon < acceptBase ? horizon : acceptBase, Math.exp(-rate * Math.min(horizon, acceptBase)));
  let first = 0;
  let last = Math.min(pieceAt(acceptBase), pieceCount) - 1;
  for (let j = first; j <= last; j++) {
    current.fill(0, j * stride, (j + 1) * stride);
    current[j * stride] = Math.exp(-rate * starts[j]);
  }
  for (let failures = 1; first <= last; failures++) {
    // Reject at this failure: the part of the density at or before its reject time (all of it at maxFailures).
    const rejectEnd = maxFailures !== null && failures >= maxFailures ? last + 1 : Math.min(last + 1, pieceAt(rejectBase + failures * step));
    for (let j = first; j < rejectEnd; j++) {
      const u0 = rate * starts[j];
      fillIncompleteGammaIntegrals(rate * (starts[j + 1] - starts[j]), gammas);
      let mass = 0;
      let moment = 0;
      for (let k = 0; k <= degreeCap; k++) {
        const c = current[j * stride + k];
        if (c === 0) continue;
        mass += c * gammas[k];
        moment += c * (u0 * gammas[k] + gammas[k + 1]);
      }
      reject += mass;
      expectedTime += moment / rate;
    }
    first = Math.max(first, rejectEnd);
    if (first > last) break;
    // Carry the running integral to the next accept time (or the truncation), building P_{r+1}.
    const acceptTime = acceptBase + failures * step;
    const end = acceptTime < horizon ? acceptTime : horizon;
    const endPiece = Math.min(pieceAt(end), pieceCount) - 1;
    if (acceptTime >= horizon && workingLimit) return null;
    let running = 0;
    for (let j = first; j <= endPiece; j++) {
      const length = rate * (starts[j + 1] - starts[j]);
      const base = j * stride;
      next[base] = running;
      let integral = 0;
      if (j <= last) {
        let power = length;
        for (let k = 0; k < degreeCap; k++) {
          const c = current[base + k];
          next[base + k + 1] = c / (k + 1);
          integral += (c * power) / (k + 1);
          power *= length;
        }
        if (current[base + degreeCap] !== 0) throw new RangeError('poisson SPRT recursion: degree bound exceeded');
      } else {
        next.fill(0, base + 1, base + stride);
      }
      running = Math.exp(-length) * (running + integral);
    }
    decideAtEnd(failures, end, running);
    const swap = current;
    current = next;
    next = swap;
    last = endPiece;
    if (maxFailures !== null && failures >= maxFailures) break;
    const undecided = 1 - accept - reject;
    if (undecided < UNDECIDED_STOP) {
      return { accept, reject, expectedTime, undecided: Math.max(0, undecided) };
    }
  }
  return { accept, reject, expectedTime, undecided: Math.max(0, 1 - accept - reject) };
}
