import { createLineRecursion } from './integerLineRecursion.js';
import type { ExactPoint, LineRecursionVisitor } from './integerLineRecursion.js';
import { neutralCount } from './integerLines.js';
import type { IntegerLines } from './integerLines.js';
import type { CountStep } from './models/linearCountDefinition.js';

export type { ExactPoint } from './integerLineRecursion.js';

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

/**
 * Builds an exact evaluator for integer lines whose count moves by Bernoulli (pass/fail) or
 * Poisson (count per unit) steps: OC and ASN, the sample-size distribution and the risks of every
 * shorter truncation, each read off the one forward recursion (integerLineRecursion).
 *
 * Method: the forward recursion over the cumulative count; the sample-size distribution is the
 * probability stopped at each item count; the risks of the plan truncated at n are the mass already
 * accepted (rejected) plus the undecided mass with d <= floor(s n) (d > floor(s n)), because the plans
 * agree up to n.
 * References: Aroian, L. A. (1968), "Sequential analysis, direct method", Technometrics 10(1)
 * (from memory); common practice, no source.
 */
export function createExactEvaluator(
  lines: IntegerLines,
  countStep: CountStep,
  options: ExactEvaluatorOptions = {},
): ExactEvaluator {
  const recursion = createLineRecursion(lines, countStep, options);
  const fresh = (): ExactPoint => ({ accept: 0, reject: 0, undecided: 0, asn: 0, steps: 0 });
  const shared = fresh();

  return {
    lines,
    countStep,
    evaluate: (theta, out = fresh()) => recursion.run(theta, 0, 0, null, out),
    evaluateFrom: (theta, n, total, out = fresh()) => recursion.run(theta, n, total, null, out),
    sampleSizeDistribution(theta) {
      const stops: number[] = [0];
      const visitor: LineRecursionVisitor = {
        afterStep(n, stoppedHere) {
          stops[n] = stoppedHere;
          return false;
        },
      };
      const point = recursion.run(theta, 0, 0, visitor, fresh());
      const probabilities = new Float64Array(point.steps + 1);
      for (let n = 1; n <= point.steps; n++) probabilities[n] = stops[n] ?? 0;
      return { point, probabilities };
    },
    risksIfTruncated(theta, acceptIfTruncated, rejectIfTruncated) {
      const visitor: LineRecursionVisitor = {
        afterStep(n, _stoppedHere, accepted, rejected, mass, low, high) {
          if (n < acceptIfTruncated.length) {
            const neutral = neutralCount(lines, n);
            let below = 0;
            let above = 0;
            for (let d = low; d <= high; d++) {
              if (d <= neutral) below += mass[d];
              else above += mass[d];
            }
            acceptIfTruncated[n] = accepted + below;
            rejectIfTruncated[n] = rejected + above;
          }
          return n + 1 >= acceptIfTruncated.length;
        },
      };
      return recursion.run(theta, 0, 0, visitor, fresh()).steps;
    },
    evaluateMany(thetas, accept, asn, undecided) {
      for (let i = 0; i < thetas.length; i++) {
        recursion.run(thetas[i], 0, 0, null, shared);
        accept[i] = shared.accept;
        asn[i] = shared.asn;
        if (undecided !== undefined) undecided[i] = shared.undecided;
      }
    },
  };
}
