import { neutralCount, rawAcceptanceNumber, rejectionNumber, truncationAcceptanceNumber } from './integerLines.js';
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

export interface ExactEvaluatorOptions {
  /** Stop once the undecided probability is below this (untruncated plans). Default 1e-12. */
  tolerance?: number;
  /** Hard cap on the item count for untruncated plans. Default 1,000,000. */
  maxSteps?: number;
}

/** A fast evaluator of the exact OC/ASN of one integer plan at many qualities. */
export interface ExactEvaluator {
  readonly lines: IntegerLines;
  readonly countStep: CountStep;
  /** Exact OC/ASN at quality theta, from n = 0. Writes into `out` when given (no allocation). */
  evaluate(theta: number, out?: ExactPoint): ExactPoint;
  /** Same, from the state (n items, cumulative count total); asn is the expected remaining items. */
  evaluateFrom(theta: number, n: number, total: number, out?: ExactPoint): ExactPoint;
  /** Same, plus the distribution of the item count at the decision: probabilities[k] = P(stop at k). */
  sampleSizeDistribution(theta: number): { point: ExactPoint; probabilities: Float64Array };
  /**
   * For every n = 1..acceptIfTruncated.length-1: P(accept) and P(reject) of the same plan truncated
   * at n (the rest decided by LLR <= 0), in one pass. Returns the last n reached.
   */
  risksIfTruncated(theta: number, acceptIfTruncated: Float64Array, rejectIfTruncated: Float64Array): number;
  /** Exact OC and ASN at many qualities into preallocated arrays. */
  evaluateMany(thetas: ArrayLike<number>, accept: Float64Array, asn: Float64Array, undecided?: Float64Array): void;
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
 * Builds an exact evaluator for integer lines whose count moves by Bernoulli (pass/fail) or
 * Poisson (count per unit) steps. Lines are trusted (validated by the caller); the hot loop takes
 * plain numbers and typed arrays, windowed over the live band of counts, with no allocation per step.
 *
 * Method: forward recursion over the cumulative count d. Let m_n(d) be P(undecided with count d
 * after n items). m_n(d) = sum_j m_{n-1}(d - j) P(step = j); then mass at d <= Ac(n) is accepted,
 * at d >= Re(n) rejected; ASN = sum_n n P(stop at n). At n_t, the rest is accepted iff
 * d <= floor(s n_t). Without truncation the recursion stops when the undecided mass is below the
 * tolerance, and reports that remainder.
 * References: Aroian, L. A. (1968), "Sequential analysis, direct method", Technometrics 10(1);
 * common practice, no source.
 */
export function createExactEvaluator(
  lines: IntegerLines,
  countStep: CountStep,
  options: ExactEvaluatorOptions = {},
): ExactEvaluator {
  const tolerance = options.tolerance ?? 1e-12;
  const maxSteps = lines.truncation ?? options.maxSteps ?? 1_000_000;
  const truncationAcceptance = truncationAcceptanceNumber(lines) ?? -1;
  const bandWidth = Math.ceil(lines.h1 + lines.h2 + Math.max(1, lines.slope)) + 4;

  let acceptance = new Int32Array(0);
  let rejection = new Int32Array(0);
  let mass = new Float64Array(0);
  let scratch = new Float64Array(0);
  const stepPmf = new Float64Array(bandWidth + 2);
  const stepTail = new Float64Array(bandWidth + 2);

  /** Makes the bound tables cover item counts 0..n; grows by doubling, so rarely allocates. */
  function ensureSteps(n: number): void {
    if (n < acceptance.length) return;
    const size = Math.min(maxSteps + 1, Math.max(n + 1, acceptance.length * 2, 256));
    const nextAcceptance = new Int32Array(size);
    const nextRejection = new Int32Array(size);
    for (let k = 0; k < size; k++) {
      nextAcceptance[k] = rawAcceptanceNumber(lines, k);
      nextRejection[k] = rejectionNumber(lines, k);
    }
    acceptance = nextAcceptance;
    rejection = nextRejection;
    const countSize = Math.max(nextRejection[size - 1] + bandWidth + 2, 16);
    if (countSize > mass.length) {
      const grown = new Float64Array(countSize);
      grown.set(mass);
      mass = grown;
      scratch = new Float64Array(countSize);
    }
  }

  function fillPoissonStep(rate: number): void {
    let logPmf = -rate;
    const logRate = Math.log(rate);
    let cumulative = 0;
    for (let k = 0; k < stepPmf.length; k++) {
      const pmf = rate === 0 ? (k === 0 ? 1 : 0) : Math.exp(logPmf);
      stepPmf[k] = pmf;
      stepTail[k] = Math.max(0, 1 - cumulative); // P(step >= k)
      cumulative += pmf;
      logPmf += logRate - Math.log(k + 1);
    }
  }

  let scanAccept: Float64Array | null = null;
  let scanReject: Float64Array | null = null;

  function run(theta: number, startN: number, startTotal: number, stops: Float64Array | null, out: ExactPoint): ExactPoint {
    ensureSteps(Math.min(maxSteps, startN + 256));
    out.accept = 0;
    out.reject = 0;
    out.undecided = 0;
    out.asn = 0;
    out.steps = startN;
    // A state already decided stops here.
    if (startTotal >= rejectionNumber(lines, startN)) {
      out.reject = 1;
      return out;
    }
    if (startTotal <= rawAcceptanceNumber(lines, startN)) {
      out.accept = 1;
      return out;
    }
    if (lines.truncation !== null && startN >= lines.truncation) {
      if (startTotal <= truncationAcceptance) out.accept = 1;
      else out.reject = 1;
      return out;
    }
    if (countStep === 'poisson') fillPoissonStep(theta);
    // Locals, not closure variables, in the hot loop: V8 keeps them in registers.
    const bernoulli = countStep === 'bernoulli';
    const truncationAt = lines.truncation ?? -1;
    const scanA = scanAccept;
    const scanR = scanReject;
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
      let stoppedHere = 0;
      if (bernoulli) {
        bernoulliStep(m, low, high, p, q);
        high += 1;
      } else {
        const tailMass = poissonStep(m, scratch, stepPmf, stepTail, low, high, rejectFrom);
        high = rejectFrom - 1;
        rejected += tailMass;
        stoppedHere += tailMass;
      }
      while (low <= high && low <= acceptBelow) {
        accepted += m[low];
        stoppedHere += m[low];
        m[low] = 0;
        low += 1;
      }
      while (high >= low && high >= rejectFrom) {
        rejected += m[high];
        stoppedHere += m[high];
        m[high] = 0;
        high -= 1;
      }
      if (n === truncationAt) {
        for (let d = low; d <= high; d++) {
          if (d <= truncationAcceptance) accepted += m[d];
          else rejected += m[d];
          stoppedHere += m[d];
          m[d] = 0;
        }
        high = low - 1;
      }
      if (scanA !== null && scanR !== null && n < scanA.length) {
        const neutral = neutralCount(lines, n);
        let below = 0;
        let above = 0;
        for (let d = low; d <= high; d++) {
          if (d <= neutral) below += m[d];
          else above += m[d];
        }
        scanA[n] = accepted + below;
        scanR[n] = rejected + above;
      }
      weightedStops += n * stoppedHere;
      if (stops !== null) stops[n] = stoppedHere;
      if (low > high) break;
      // The cheap test can be off by rounding; confirm on the band itself so the reported remainder is below the tolerance.
      if (1 - accepted - rejected < 2 * tolerance && liveMass(m, low, high) < tolerance) break;
      if (scanA !== null && n + 1 >= scanA.length) break;
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

  const fresh = (): ExactPoint => ({ accept: 0, reject: 0, undecided: 0, asn: 0, steps: 0 });
  const shared = fresh();

  return {
    lines,
    countStep,
    evaluate: (theta, out = fresh()) => run(theta, 0, 0, null, out),
    evaluateFrom: (theta, n, total, out = fresh()) => run(theta, n, total, null, out),
    sampleSizeDistribution(theta) {
      const steps = run(theta, 0, 0, null, fresh()).steps;
      const probabilities = new Float64Array(steps + 1);
      return { point: run(theta, 0, 0, probabilities, fresh()), probabilities };
    },
    risksIfTruncated(theta, acceptIfTruncated, rejectIfTruncated) {
      scanAccept = acceptIfTruncated;
      scanReject = rejectIfTruncated;
      try {
        return run(theta, 0, 0, null, fresh()).steps;
      } finally {
        scanAccept = null;
        scanReject = null;
      }
    },
    evaluateMany(thetas, accept, asn, undecided) {
      for (let i = 0; i < thetas.length; i++) {
        run(thetas[i], 0, 0, null, shared);
        accept[i] = shared.accept;
        asn[i] = shared.asn;
        if (undecided !== undefined) undecided[i] = shared.undecided;
      }
    },
  };
}
