import { fillPoissonPmf } from './distributions/poisson.js';
import { rawAcceptanceNumber, rejectionNumber, truncationAcceptanceNumber } from './integerLines.js';
import type { IntegerLines } from './integerLines.js';
import type { CountStep } from './models/linearCountDefinition.js';

/** Exact operating characteristics of the integer plan at one quality. */
export interface ExactPoint {
  /** P(accept) = OC. */
  accept: number;
  /** P(reject). */
  reject: number;
  /** Probability still undecided when the recursion stopped (0 with truncation). */
  undecided: number;
  /** Expected number of items inspected (from the start state: expected remaining items). */
  asn: number;
  /** Last item count the recursion reached. */
  steps: number;
}

/**
 * What a caller wants from the recursion besides OC and ASN. Both parts are optional; without a
 * visitor the recursion only sums.
 */
export interface LineRecursionVisitor {
  /**
   * Called for every stopping point (n, d) with its probability. `atTruncation` is true for every
   * point stopped at the truncation count. With this present, Poisson jumps past the rejection line
   * are resolved count by count (jumps beyond lambda + 12 sqrt(lambda) + 30, probability below 1e-17,
   * are not reported one by one; they still count in the totals).
   */
  point?(itemCount: number, total: number, probability: number, accepted: boolean, atTruncation: boolean): void;
  /**
   * Called after every item count n with the probability that stopped at n, the totals so far and the
   * undecided probability by count (mass[low..high], read only). Returns true to end the recursion.
   */
  afterStep?(itemCount: number, stoppedHere: number, accepted: number, rejected: number, mass: Float64Array, low: number, high: number): boolean;
}

export interface LineRecursionOptions {
  /** Untruncated plans: stop once the undecided probability is below this. Default 1e-12. */
  tolerance?: number;
  /** Untruncated plans: hard cap on the item count. Default 1,000,000. */
  maxSteps?: number;
}

/** The forward recursion of one plan, built once and run at many qualities. */
export interface LineRecursion {
  readonly lines: IntegerLines;
  readonly countStep: CountStep;
  /** Item count at which the recursion ends at the latest. */
  readonly maxSteps: number;
  /**
   * Runs from the state (startN items, count startTotal) at quality theta into `out`: OC, P(reject),
   * the undecided remainder and the expected remaining items; feeds `visitor` on the way.
   */
  run(theta: number, startN: number, startTotal: number, visitor: LineRecursionVisitor | null, out: ExactPoint): ExactPoint;
}

/** Poisson jump sizes past which the probability is negligible (P(jump > K) < ~1e-17). */
function poissonReach(rate: number): number {
  return Math.ceil(rate + 12 * Math.sqrt(rate) + 30);
}

function liveMass(mass: Float64Array, low: number, high: number): number {
  let sum = 0;
  for (let d = low; d <= high; d++) sum += mass[d];
  return sum;
}

/** One Bernoulli step of the recursion, in place: mass[low..high] -> mass[low..high+1]. */
function bernoulliStep(mass: Float64Array, low: number, high: number, p: number, q: number): void {
  mass[high + 1] = mass[high] * p;
  for (let d = high; d > low; d--) mass[d] = mass[d] * q + mass[d - 1] * p;
  mass[low] *= q;
}

/**
 * One Poisson step of the recursion: mass[low..high] convolved with the step law into
 * mass[low..rejectFrom-1] (through `next`); returns the mass that reaches rejectFrom or more.
 */
function poissonStep(
  mass: Float64Array,
  next: Float64Array,
  stepPmf: Float64Array,
  stepTail: Float64Array,
  low: number,
  high: number,
  rejectFrom: number,
): number {
  const lastTail = stepTail.length - 1;
  let tailMass = 0;
  for (let d = low; d <= high; d++) {
    const gap = rejectFrom - d;
    tailMass += mass[d] * (gap <= 0 ? 1 : stepTail[gap < lastTail ? gap : lastTail]);
  }
  const newHigh = rejectFrom - 1;
  for (let target = low; target <= newHigh; target++) {
    let sum = 0;
    const top = target < high ? target : high;
    for (let d = low; d <= top; d++) {
      const jump = target - d;
      if (jump < stepPmf.length) sum += mass[d] * stepPmf[jump];
    }
    next[target] = sum;
  }
  for (let d = low; d <= high; d++) mass[d] = 0;
  for (let target = low; target <= newHigh; target++) mass[target] = next[target];
  return tailMass;
}

/**
 * Builds the forward recursion over the cumulative count of integer lines whose count moves by
 * Bernoulli (pass/fail) or Poisson (count per unit) steps: the one recursion behind the exact OC/ASN,
 * the sample-size distribution, the truncation search and the stopping distribution of the
 * estimates, each a visitor. Lines are trusted (validated by the caller); the hot loop takes plain
 * numbers and typed arrays, windowed over the live band of counts, with no allocation per step.
 *
 * Method: let m_n(d) be P(undecided with count d after n items). m_n(d) = sum_j m_{n-1}(d - j)
 * P(step = j); then mass at d <= Ac(n) is accepted, at d >= Re(n) rejected; ASN = sum_n n P(stop at
 * n). At n_t every remaining d stops, accepted iff d <= floor(s n_t). Without truncation the
 * recursion stops when the undecided mass is below the tolerance, and reports that remainder
 * (counted at the last item count, so ASN stays a lower bound).
 * References: Aroian, L. A. (1968), "Sequential analysis, direct method", Technometrics 10(1)
 * (from memory); Armitage, P. (1958), "Numerical studies in the sequential estimation of a binomial
 * parameter", Biometrika 45(1/2):1-15 (from memory); common practice, no source (the guards).
 */
export function createLineRecursion(lines: IntegerLines, countStep: CountStep, options: LineRecursionOptions = {}): LineRecursion {
  const tolerance = options.tolerance ?? 1e-12;
  const maxSteps = lines.truncation ?? options.maxSteps ?? 1_000_000;
  const truncationAcceptance = truncationAcceptanceNumber(lines) ?? -1;
  const bandWidth = Math.ceil(lines.h1 + lines.h2 + Math.max(1, lines.slope)) + 4;

  let acceptance = new Int32Array(0);
  let rejection = new Int32Array(0);
  let mass = new Float64Array(0);
  let scratch = new Float64Array(0);
  let stepPmf = new Float64Array(bandWidth + 2);
  let stepTail = new Float64Array(bandWidth + 2);
  /** Largest count jump resolved point by point past the rejection line (Poisson with a point visitor). */
  let reach = 1;

  /** Makes the bound tables cover item counts 0..n and the count buffers wide enough; grows by doubling. */
  function ensureSteps(n: number): void {
    if (n >= acceptance.length) {
      const size = Math.min(maxSteps + 1, Math.max(n + 1, acceptance.length * 2, 256));
      const nextAcceptance = new Int32Array(size);
      const nextRejection = new Int32Array(size);
      for (let k = 0; k < size; k++) {
        nextAcceptance[k] = rawAcceptanceNumber(lines, k);
        nextRejection[k] = rejectionNumber(lines, k);
      }
      acceptance = nextAcceptance;
      rejection = nextRejection;
    }
    const countSize = Math.max(rejection[acceptance.length - 1] + bandWidth + 2, 16);
    if (countSize > mass.length) {
      const grown = new Float64Array(countSize);
      grown.set(mass);
      mass = grown;
      scratch = new Float64Array(countSize);
    }
  }

  /** The step law at rate `rate`, long enough for the band and, when points are reported, for `reach`. */
  function fillPoissonStep(rate: number, points: boolean): void {
    reach = points ? poissonReach(rate) : 1;
    const length = Math.max(bandWidth + 2, reach + 1);
    if (stepPmf.length < length) {
      stepPmf = new Float64Array(length);
      stepTail = new Float64Array(length);
    }
    fillPoissonPmf(rate, stepPmf);
    let cumulative = 0;
    for (let k = 0; k < stepPmf.length; k++) {
      stepTail[k] = Math.max(0, 1 - cumulative); // P(step >= k)
      cumulative += stepPmf[k];
    }
  }

  /** Reports each count d >= rejectFrom reached by one Poisson step from mass[low..high]. */
  function reportPoissonRejections(visitor: LineRecursionVisitor, n: number, low: number, high: number, rejectFrom: number, atTruncation: boolean): void {
    const lastJump = Math.min(reach, stepPmf.length - 1);
    for (let target = Math.max(rejectFrom, low); target <= high + lastJump; target++) {
      let sum = 0;
      const bottom = target - lastJump > low ? target - lastJump : low;
      const top = target < high ? target : high;
      for (let d = bottom; d <= top; d++) sum += mass[d] * stepPmf[target - d];
      if (sum > 0) visitor.point?.(n, target, sum, false, atTruncation);
    }
  }

  function run(theta: number, startN: number, startTotal: number, visitor: LineRecursionVisitor | null, out: ExactPoint): ExactPoint {
    ensureSteps(Math.min(maxSteps, startN + 256));
    out.accept = 0;
    out.reject = 0;
    out.undecided = 0;
    out.asn = 0;
    out.steps = startN;
    const atStartTruncation = lines.truncation !== null && startN >= lines.truncation;
    // A state already decided stops here.
    if (startTotal >= rejectionNumber(lines, startN)) {
      out.reject = 1;
      visitor?.point?.(startN, startTotal, 1, false, atStartTruncation);
      return out;
    }
    if (startTotal <= rawAcceptanceNumber(lines, startN)) {
      out.accept = 1;
      visitor?.point?.(startN, startTotal, 1, true, atStartTruncation);
      return out;
    }
    if (atStartTruncation) {
      const accepted = startTotal <= truncationAcceptance;
      if (accepted) out.accept = 1;
      else out.reject = 1;
      visitor?.point?.(startN, startTotal, 1, accepted, true);
      return out;
    }
    const points = visitor !== null && visitor.point !== undefined;
    const afterStep = visitor !== null && visitor.afterStep !== undefined;
    if (countStep === 'poisson') fillPoissonStep(theta, points);
    // Locals, not closure variables, in the hot loop: V8 keeps them in registers.
    const bernoulli = countStep === 'bernoulli';
    const truncationAt = lines.truncation ?? -1;
    let m = mass;
    let acceptAt = acceptance;
    let rejectAt = rejection;
    m[startTotal] = 1;
    let low = startTotal;
    let high = startTotal;
    let accepted = 0;
    let rejected = 0;
    let weightedStops = 0;
    const p = theta;
    const q = 1 - theta;
    let n = startN;
    while (n < maxSteps) {
      n += 1;
      if (n >= acceptAt.length) {
        ensureSteps(n);
        m = mass;
        acceptAt = acceptance;
        rejectAt = rejection;
      }
      const acceptBelow = acceptAt[n];
      const rejectFrom = rejectAt[n];
      const atTruncation = n === truncationAt;
      let stoppedHere = 0;
      if (bernoulli) {
        bernoulliStep(m, low, high, p, q);
        high += 1;
      } else {
        if (points) reportPoissonRejections(visitor as LineRecursionVisitor, n, low, high, rejectFrom, atTruncation);
        const tailMass = poissonStep(m, scratch, stepPmf, stepTail, low, high, rejectFrom);
        high = rejectFrom - 1;
        rejected += tailMass;
        stoppedHere += tailMass;
      }
      if (atTruncation) {
        // Every count stops: on or below the acceptance line, or below the rejection line and LLR <= 0, accepts.
        for (let d = low; d <= high; d++) {
          const accepts = d <= acceptBelow || (d < rejectFrom && d <= truncationAcceptance);
          if (accepts) accepted += m[d];
          else rejected += m[d];
          stoppedHere += m[d];
          if (points) (visitor as LineRecursionVisitor).point?.(n, d, m[d], accepts, true);
          m[d] = 0;
        }
        high = low - 1;
      } else {
        while (low <= high && low <= acceptBelow) {
          accepted += m[low];
          stoppedHere += m[low];
          if (points) (visitor as LineRecursionVisitor).point?.(n, low, m[low], true, false);
          m[low] = 0;
          low += 1;
        }
        while (high >= low && high >= rejectFrom) {
          rejected += m[high];
          stoppedHere += m[high];
          if (points) (visitor as LineRecursionVisitor).point?.(n, high, m[high], false, false);
          m[high] = 0;
          high -= 1;
        }
      }
      weightedStops += n * stoppedHere;
      if (afterStep && (visitor as LineRecursionVisitor).afterStep?.(n, stoppedHere, accepted, rejected, m, low, high)) break;
      if (low > high) break;
      // The cheap test can be off by rounding (it stalls near 1e-13 over long runs); confirm on the band
      // itself so the reported remainder is below the tolerance.
      if (1 - accepted - rejected < 2 * tolerance + 1e-12 && liveMass(m, low, high) < tolerance) break;
    }
    const undecided = liveMass(mass, low, high);
    mass.fill(0, low, high + 1); // leave the buffer clean for the next run
    out.accept = accepted;
    out.reject = rejected;
    out.undecided = undecided;
    // Counting the undecided remainder at the last item count keeps ASN a lower bound, not an overcount.
    out.asn = weightedStops - startN * (accepted + rejected) + (n - startN) * undecided;
    out.steps = n;
    return out;
  }

  return { lines, countStep, maxSteps, run };
}
