import { binomialCdf } from '../distributions/binomial.js';
import { poissonCdf } from '../distributions/poisson.js';
import { bisectBoundary, expandUntil } from '../numerics/rootFinding.js';

/** The naive estimate with its fixed-sample interval, labelled with its method. */
export interface NaiveQualityEstimate {
  methodName: string;
  pointEstimate: number;
  confidenceLevel: number;
  lower: number;
  upper: number;
  unit: string;
}

export interface NaiveEstimateCounts {
  model: 'passfail' | 'count';
  itemsInspected: number;
  /** Nonconforming items (passfail) or nonconformities (count) among the counted entries. */
  nonconformities: number;
  /** Two-sided confidence level, e.g. 0.95. */
  confidenceLevel: number;
}

/** The x in [low, high] where a decreasing function crosses `target`, by bisection. */
function solveDecreasing(f: (x: number) => number, target: number, low: number, high: number): number {
  return bisectBoundary((x) => f(x) <= target, low, high, { absoluteTolerance: 1e-15 * Math.max(1, high) });
}

function checkCounts({ model, itemsInspected, nonconformities, confidenceLevel }: NaiveEstimateCounts): void {
  if (!Number.isInteger(itemsInspected) || itemsInspected < 1) {
    throw new RangeError(`naiveQualityEstimate: itemsInspected is ${itemsInspected}; allowed: a whole number >= 1`);
  }
  const most = model === 'passfail' ? itemsInspected : Number.MAX_SAFE_INTEGER;
  if (!Number.isInteger(nonconformities) || nonconformities < 0 || nonconformities > most) {
    throw new RangeError(`naiveQualityEstimate: nonconformities is ${nonconformities}; allowed: a whole number in [0, ${most}]`);
  }
  if (!(confidenceLevel > 0 && confidenceLevel < 1)) {
    throw new RangeError(`naiveQualityEstimate: confidenceLevel is ${confidenceLevel}; allowed: a number in (0, 1)`);
  }
}

/**
 * The naive quality estimate, where the sequential-exact one does not apply (or the run is undecided):
 * the naive fraction d/n (passfail) or rate d/n (count) with an exact fixed-sample interval. It is
 * labelled as ignoring the stopping rule, because a sequential stop biases both.
 *
 * Method: Clopper-Pearson: lower p with P(X >= d | n, p) = a/2, upper p with P(X <= d | n, p) = a/2,
 * X binomial. Garwood: the same with X ~ Poisson(n lambda). Both solved by bisection on the CDF.
 *
 * References: Clopper and Pearson, 1934, "The use of confidence or fiducial limits illustrated in the
 * case of the binomial", Biometrika 26; Garwood, 1936, "Fiducial limits for the Poisson distribution",
 * Biometrika 28.
 */
export function naiveQualityEstimate(counts: NaiveEstimateCounts): NaiveQualityEstimate {
  checkCounts(counts);
  const { model, itemsInspected: n, nonconformities: d, confidenceLevel } = counts;
  const tail = (1 - confidenceLevel) / 2;
  const percent = `${Number((confidenceLevel * 100).toPrecision(3))} %`;
  if (model === 'passfail') {
    // P(X >= d) = 1 - P(X <= d - 1) rises with p; P(X <= d) falls with p.
    const lower = d === 0 ? 0 : solveDecreasing((p) => binomialCdf(d - 1, n, p), 1 - tail, 0, 1);
    const upper = d === n ? 1 : solveDecreasing((p) => binomialCdf(d, n, p), tail, 0, 1);
    return {
      methodName: `Naive fraction d/n with exact Clopper-Pearson ${percent} interval; ignores the stopping rule (a sequential stop biases it)`,
      pointEstimate: d / n,
      confidenceLevel,
      lower,
      upper,
      unit: 'fraction nonconforming',
    };
  }
  const high = expandUntil((mean) => poissonCdf(d, mean) <= tail, 2 * d + 20, Number.MAX_VALUE);
  const lower = d === 0 ? 0 : solveDecreasing((mean) => poissonCdf(d - 1, mean), 1 - tail, 0, high) / n;
  const upper = solveDecreasing((mean) => poissonCdf(d, mean), tail, 0, high) / n;
  return {
    methodName: `Naive rate d/n with exact Poisson (Garwood) ${percent} interval; ignores the stopping rule (a sequential stop biases it)`,
    pointEstimate: d / n,
    confidenceLevel,
    lower,
    upper,
    unit: 'nonconformities per item',
  };
}
