/**
 * The parts of a decision record that differ for a measurement, lifetime or graded run: its plan
 * in natural units, the decision's evidence, the naive estimate (labelled as such; the
 * sequential-exact interval exists only for pass/fail and count plans) and each entry's result.
 */
import {
  countNoun,
  designGradedPlan,
  designLifetimePlan,
  designMeasurementPlan,
  type GradedSpec,
  type LifetimeSpec,
  type MeasurementSpec,
} from '../../engine/index.js';
import { normalQuantile } from '../../engine/numerics/normalDistribution.js';
import type { ItemResult, RunState } from '../../inspection/index.js';
import { formatCount, formatFixed, formatNumber } from '../pdf/format.js';
import { naiveQualityEstimate } from '../../engine/estimation/naiveQualityEstimate.js';
import type { ModelRecordDetail, QualityEstimate, RecordPlan } from './decisionRecordInput.js';

/** A plan whose record shows its lines and evidence in natural units (no acceptance numbers). */
type ModelPartsSpec = MeasurementSpec | LifetimeSpec | GradedSpec;

/** Said on every estimate of these models. */
export const SEQUENTIAL_INTERVAL_NOTE =
  'The sequential-exact interval and bias-adjusted estimate are made for pass/fail and count plans only; this naive figure ignores the stopping rule (a sequential stop biases it).';

type PlanFigures = Pick<
  RecordPlan,
  'acceptableQuality' | 'rejectableQuality' | 'producerRiskExact' | 'consumerRiskExact' | 'boundaries' | 'truncation' | 'averageSampleNumberAtAcceptable' | 'averageSampleNumberAtRejectable'
>;

const unitOf = (spec: ModelPartsSpec): string => ('unit' in spec && spec.unit ? spec.unit : spec.model === 'lifetime' ? 'time units' : '');
const withUnit = (value: number, unit: string): string => `${formatNumber(value)}${unit ? ` ${unit}` : ''}`;

/** The plan's figures and its rows in natural units. */
export function modelPlan(spec: ModelPartsSpec): { figures: PlanFigures; rows: ModelRecordDetail['planRows'] } {
  const unit = unitOf(spec);
  if (spec.model === 'measurement') {
    const design = designMeasurementPlan(spec, { curvePoints: 2 });
    const { h1, h2, slope, rejectWhen, correction, lnA, lnB } = design.boundaries;
    const [accept, reject] = rejectWhen === 'above' ? [`S <= ${formatFixed(slope, 4)} n - ${formatFixed(h1, 4)}`, `S >= ${formatFixed(slope, 4)} n + ${formatFixed(h2, 4)}`] : [`S >= ${formatFixed(slope, 4)} n + ${formatFixed(h1, 4)}`, `S <= ${formatFixed(slope, 4)} n - ${formatFixed(h2, 4)}`];
    const level = (symbol: string, value: number) => ({ symbol, value, unit: `${unit} (mean; known sigma = ${withUnit(spec.sigma, unit)})`.trim() });
    return {
      figures: {
        acceptableQuality: level('mu0', spec.mu0),
        rejectableQuality: level('mu1', spec.mu1),
        producerRiskExact: design.exact.alpha,
        consumerRiskExact: design.exact.beta,
        boundaries: { h1, h2, slope, lnA, lnB },
        truncation: design.truncation === null ? null : { maxItems: design.truncation, rule: design.truncationRule },
        averageSampleNumberAtAcceptable: design.exact.asnH0,
        averageSampleNumberAtRejectable: design.exact.asnH1,
      },
      rows: [
        ['Boundaries', `accept when ${accept}; reject when ${reject}\n(S: sum of the n measurements${unit ? `, in ${unit}` : ''})`],
        ['Overshoot correction', correction > 0 ? `both LLR limits pulled in by ${formatFixed(correction, 4)} (Siegmund)` : 'none'],
        ['Truncation', design.truncationRule],
        ['Expected measurements', `${formatNumber(design.exact.asnH0)} at H0, ${formatNumber(design.exact.asnH1)} at H1 (fixed-sample plan: ${design.single.n})`],
      ],
    };
  }
  if (spec.model === 'lifetime') {
    const design = designLifetimePlan(spec, { curvePoints: 2 });
    const b = design.boundaries;
    const level = (symbol: string, value: number) => ({ symbol, value, unit: `${unit} (MTBF)` });
    return {
      figures: {
        acceptableQuality: level('theta0', spec.theta0),
        rejectableQuality: level('theta1', spec.theta1),
        producerRiskExact: design.exact.alpha,
        consumerRiskExact: design.exact.beta,
        boundaries: { h1: b.acceptTimeAtZero, h2: b.rejectOffset, slope: b.timePerFailure, lnA: b.lnA, lnB: b.lnB },
        truncation: null,
        averageSampleNumberAtAcceptable: design.exact.expectedTimeH0,
        averageSampleNumberAtRejectable: design.exact.expectedTimeH1,
      },
      rows: [
        [
          'Boundaries',
          `accept when T >= ${formatFixed(b.acceptTimeAtZero, 2)} + ${formatFixed(b.timePerFailure, 2)} r; ` +
            `reject at the r-th failure if T <= ${formatFixed(b.timePerFailure, 2)} r - ${formatFixed(b.rejectOffset, 2)}\n` +
            `(T: accumulated test time in ${unit}, r: failures; discrimination ratio d = ${formatNumber(b.discriminationRatio)})`,
        ],
        ['Truncation', design.truncationRule],
        ['Expected test time', `${withUnit(design.exact.expectedTimeH0, unit)} at H0, ${withUnit(design.exact.expectedTimeH1, unit)} at H1 (fixed-duration test: ${withUnit(design.single.time, unit)})`],
      ],
    };
  }
  const design = designGradedPlan(spec, { curvePoints: 2 });
  const { h1, h2, slope, lnA, lnB, demerits } = design.boundaries;
  const reference = spec.classes[0];
  const level = (symbol: string, vector: number[]) => ({
    symbol,
    value: 1 - vector[0],
    unit: `not ${reference} (by class: ${spec.classes.map((name, k) => `${name} ${formatNumber(vector[k])}`).join(', ')})`,
  });
  const asn = design.exact ?? { asnH0: design.wald.asnH0, asnH1: design.wald.asnH1 };
  return {
    figures: {
      acceptableQuality: level(`P0(not ${reference})`, spec.p0),
      rejectableQuality: level(`P1(not ${reference})`, spec.p1),
      producerRiskExact: design.exact?.alpha ?? null,
      consumerRiskExact: design.exact?.beta ?? null,
      boundaries: { h1, h2, slope, lnA, lnB },
      truncation: design.truncation === null ? null : { maxItems: design.truncation, rule: design.truncationRule },
      averageSampleNumberAtAcceptable: asn.asnH0,
      averageSampleNumberAtRejectable: asn.asnH1,
    },
    rows: [
      ['Demerits per item', demerits.map((row) => `${row.className} ${formatNumber(row.demerits)}`).join(', ')],
      ['Boundaries', `accept when D <= ${formatFixed(slope, 4)} n - ${formatFixed(h1, 4)}; reject when D >= ${formatFixed(slope, 4)} n + ${formatFixed(h2, 4)}\n(D: total demerits, n: items graded)`],
      ['Truncation', design.truncationRule],
      ['Average sample number', `${formatNumber(asn.asnH0)} items at H0, ${formatNumber(asn.asnH1)} items at H1 (${design.exact === null ? "Wald's approximation" : 'exact'})`],
    ],
  };
}

/** The evidence rows of the decision section and the line under the headline. */
export function modelEvidence(spec: ModelPartsSpec, state: RunState): { rows: ModelRecordDetail['decisionRows']; facts: string } {
  const unit = unitOf(spec);
  const llr = `final LLR ${formatFixed(state.llr)}`;
  if (state.model === 'measurement') {
    const mean = state.mean === null ? 'none yet' : withUnit(state.mean, unit);
    return {
      rows: [['Measurements', formatCount(state.n)], ['Sum of measurements', withUnit(state.sum, unit)], ['Mean', mean]],
      facts: `${formatCount(state.n)} ${countNoun(state.n, 'measurement')}, mean ${mean}, ${llr}`,
    };
  }
  if (state.model === 'lifetime') {
    return {
      rows: [['Accumulated test time', withUnit(state.time, unit)], ['Failures', formatCount(state.failures)], ['Entries counted', formatCount(state.n)]],
      facts: `${withUnit(state.time, unit)} of test time, ${formatCount(state.failures)} ${countNoun(state.failures, 'failure')}, ${llr}`,
    };
  }
  if (state.model === 'graded' && spec.model === 'graded') {
    const counts = spec.classes.map((name, k) => `${name} ${formatCount(state.counts[k])}`).join(', ');
    return {
      rows: [['Items graded', formatCount(state.n)], ['Items per class', counts], ['Demerits', formatNumber(state.demerits)]],
      facts: `${formatCount(state.n)} ${countNoun(state.n, 'item')} graded (${counts}), ${formatNumber(state.demerits)} demerits, ${llr}`,
    };
  }
  throw new Error(`the run's state does not match its ${spec.model} plan`);
}

/**
 * The naive estimate of a measurement, lifetime or graded run, labelled as such.
 *
 * Method: measurement: mean x-bar with x-bar +- z_{(1+c)/2} sigma/sqrt(n), sigma known.
 * Lifetime: MTBF T/r with the chi-square interval 2T/chi2(1-a/2; 2r+2) to 2T/chi2(a/2; 2r),
 * computed through its equivalence with the exact Poisson (Garwood) interval of the failure count.
 * Graded: the share of items outside the reference class with the Clopper-Pearson interval, and the
 * share of each class.
 * References: Epstein, B. and Sobel, M. (1953), "Life testing", JASA 48 (chi-square limits for the
 * exponential mean, from memory); Garwood (1936), Biometrika 28; Clopper and Pearson (1934), Biometrika 26.
 */
export function modelEstimate(spec: ModelPartsSpec, state: RunState, confidenceLevel: number): QualityEstimate | null {
  if (state.n === 0) return null;
  const unit = unitOf(spec);
  const percent = `${Number((confidenceLevel * 100).toPrecision(3))} %`;
  if (spec.model === 'measurement' && state.model === 'measurement') {
    const mean = state.sum / state.n;
    const halfWidth = (normalQuantile(1 - (1 - confidenceLevel) / 2) * spec.sigma) / Math.sqrt(state.n);
    return {
      methodName: `Naive mean with the ${percent} z interval from the known sigma (mean +- z sigma/sqrt(n)). ${SEQUENTIAL_INTERVAL_NOTE}`,
      pointEstimate: mean,
      confidenceLevel,
      lower: mean - halfWidth,
      upper: mean + halfWidth,
      unit: `${unit} (mean)`.trim(),
    };
  }
  if (spec.model === 'lifetime' && state.model === 'lifetime') {
    // Poisson (Garwood) limits of the failure count's mean over the test time T; MTBF limits are T over them.
    const countLimits = naiveQualityEstimate({ model: 'count', itemsInspected: 1, nonconformities: state.failures, confidenceLevel });
    const lower = state.time / countLimits.upper;
    const upper = countLimits.lower === 0 ? Number.POSITIVE_INFINITY : state.time / countLimits.lower;
    const noFailure = state.failures === 0;
    return {
      methodName:
        `${noFailure ? 'No failure yet, so T/r is not defined: the figure is the lower limit. ' : 'Naive MTBF T/r with '}` +
        `the ${percent} chi-square interval 2T/chi2(2r+2) to 2T/chi2(2r) (time-terminated). ${SEQUENTIAL_INTERVAL_NOTE}`,
      pointEstimate: noFailure ? lower : state.time / state.failures,
      ...(noFailure ? { pointEstimateName: 'lower limit' } : {}),
      confidenceLevel,
      lower,
      upper,
      unit: `${unit} (MTBF)`,
    };
  }
  if (spec.model === 'graded' && state.model === 'graded') {
    const outside = state.n - state.counts[0];
    const share = naiveQualityEstimate({ model: 'passfail', itemsInspected: state.n, nonconformities: outside, confidenceLevel });
    return {
      methodName: `Naive share of items not ${spec.classes[0]} with the exact Clopper-Pearson ${percent} interval. ${SEQUENTIAL_INTERVAL_NOTE}`,
      pointEstimate: share.pointEstimate,
      confidenceLevel,
      lower: share.lower,
      upper: share.upper,
      unit: `share not ${spec.classes[0]}`,
      detail: `class shares: ${spec.classes.map((name, k) => `${name} ${formatNumber(state.counts[k] / state.n)}`).join(', ')}`,
    };
  }
  throw new Error(`the run's state does not match its ${spec.model} plan`);
}

/** One result as the record prints it. */
export function modelResultText(spec: ModelPartsSpec, result: ItemResult): string {
  if (typeof result !== 'object') return String(result);
  const unit = unitOf(spec);
  if ('value' in result) return withUnit(result.value, unit);
  if ('grade' in result) return result.grade;
  if ('failure' in result) return result.time === undefined ? 'failure' : `failure at T = ${withUnit(result.time, unit)}`;
  return `T = ${withUnit(result.time, unit)}`;
}
