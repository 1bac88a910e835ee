/**
 * The record lines of a measurement plan: hypotheses in the plan's unit, the lines on the sum, the
 * running sum and mean, the naive mean with its z interval, and the chart of the sum less n mu0.
 */
import { countNoun } from '../../countWords.js';
import { normalQuantile } from '../../distributions/normal.js';
import { formatCount, formatFixed, formatNumber, percentText, withUnit } from '../../numberText.js';
import { SEQUENTIAL_INTERVAL_NOTE, type RecordLines } from '../recordLines.js';
import type { MeasurementDesign } from './measurementDesign.js';
import type { MeasurementEvidenceState, MeasurementLimitRow, MeasurementObservation } from './measurementModel.js';
import type { MeasurementPlan } from './measurementPlan.js';

/**
 * The record lines of a measurement plan.
 *
 * Method: estimate: mean x-bar with x-bar +- z_{(1+c)/2} sigma/sqrt(n), sigma known (naive: it
 * ignores the stopping rule). Chart: the sum of deviations from mu0, S - n mu0, has the same lines
 * and crossings as the plain sum without the common slope mu0 that would squeeze lines and path
 * into one stroke.
 * References: any fixed-sample z interval for a normal mean with known sigma (common practice, no source).
 */
export function measurementRecordLines(
  plan: MeasurementPlan,
): RecordLines<{ design: MeasurementDesign; state: MeasurementEvidenceState; observation: MeasurementObservation; row: MeasurementLimitRow }> {
  const { spec } = plan;
  const unit = spec.unit ?? '';
  return {
    modelLine: 'measurement (normal measurements, sigma known; SPRT on the sum)',
    plan(design) {
      const { h1, h2, slope, rejectWhen, correction } = design.boundaries;
      const [accept, reject] =
        rejectWhen === 'above'
          ? [`S <= ${formatFixed(slope, 4)} n - ${formatFixed(h1, 4)}`, `S >= ${formatFixed(slope, 4)} n + ${formatFixed(h2, 4)}`]
          : [`S >= ${formatFixed(slope, 4)} n + ${formatFixed(h1, 4)}`, `S <= ${formatFixed(slope, 4)} n - ${formatFixed(h2, 4)}`];
      const level = (symbol: string, value: number) => ({ symbol, value, unit: `${unit} (mean; known sigma = ${withUnit(spec.sigma, unit)})`.trim() });
      return {
        acceptableQuality: level('mu0', spec.mu0),
        rejectableQuality: level('mu1', spec.mu1),
        producerRiskExact: design.exact.alpha,
        consumerRiskExact: design.exact.beta,
        rows: [
          ['Boundaries', `accept when ${accept}; reject when ${reject}\n(S: sum of the n measurements${unit ? `, in ${unit}` : ''})`],
          ['Overshoot correction', correction > 0 ? `both LLR limits pulled in by ${formatFixed(correction, 4)} (Siegmund)` : 'none'],
          ['Truncation', design.truncationRule],
          ['Expected measurements', `${formatNumber(design.exact.asnH0)} at H0, ${formatNumber(design.exact.asnH1)} at H1 (fixed-sample plan: ${design.single.n})`],
        ],
      };
    },
    evidence(state) {
      const mean = state.mean === null ? 'none yet' : withUnit(state.mean, unit);
      return {
        rows: [
          ['Measurements', formatCount(state.n)],
          ['Sum of measurements', withUnit(state.sum, unit)],
          ['Mean', mean],
        ],
        facts: `${formatCount(state.n)} ${countNoun(state.n, 'measurement')}, mean ${mean}, final LLR ${formatFixed(state.llr)}`,
      };
    },
    resultText: (observation) => withUnit(observation.value, unit),
    estimate(state, _decided, confidenceLevel) {
      if (state.n === 0) return null;
      const mean = state.sum / state.n;
      const halfWidth = (normalQuantile(1 - (1 - confidenceLevel) / 2) * spec.sigma) / Math.sqrt(state.n);
      return {
        methodName: `Naive mean with the ${percentText(confidenceLevel)} z interval from the known sigma (mean +- z sigma/sqrt(n)). ${SEQUENTIAL_INTERVAL_NOTE}`,
        pointEstimate: mean,
        confidenceLevel,
        lower: mean - halfWidth,
        upper: mean + halfWidth,
        unit: `${unit} (mean)`.trim(),
      };
    },
    chart(limits, path) {
      const deviation = (n: number, sum: number): [number, number] => [n, sum - n * spec.mu0];
      const n = path.at(-1)?.n ?? 0;
      const unitText = unit ? ` (${unit})` : '';
      return {
        xTitle: 'Measurements, n',
        yTitle: `Running sum less n mu0, S - ${formatNumber(spec.mu0)} n${unitText}`,
        evidenceLabel: 'running sum less n mu0',
        acceptLabel: 'acceptance line',
        rejectLabel: 'rejection line',
        limitStyle: 'line',
        accept: limits.map((row) => deviation(row.n, row.accept)),
        reject: limits.map((row) => deviation(row.n, row.reject)),
        pathStyle: 'line',
        path: path.map((point) => deviation(point.n, point.total)),
        alt: `Chart of the running sum of ${n} measurements less n mu0 against n, drawn against the plan's acceptance and rejection lines.`,
      };
    },
  };
}
