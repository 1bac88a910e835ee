/**
 * The record lines of a graded plan: both class vectors, demerits per class, the lines on the
 * demerits, the items per class, the naive share outside the reference class, and the chart of
 * demerits against items graded.
 */
import { countNoun } from '../../countWords.js';
import { naiveQualityEstimate } from '../../estimation/naiveQualityEstimate.js';
import { formatCount, formatFixed, formatNumber, percentText } from '../../numberText.js';
import { SEQUENTIAL_INTERVAL_NOTE, type ChartPoint, type RecordLines } from '../recordLines.js';
import type { GradedDesign } from './gradedDesign.js';
import type { GradedEvidenceState, GradedLimitRow, GradedObservation } from './gradedModel.js';
import type { GradedPlan } from './gradedPlan.js';

/**
 * The record lines of a graded plan.
 *
 * Method: estimate: the share of items outside the reference class with the Clopper-Pearson
 * interval (naive: it ignores the stopping rule), and the share of each class.
 * References: Clopper, C. J. and Pearson, E. S. (1934), Biometrika 26.
 */
export function gradedRecordLines(
  plan: GradedPlan,
): RecordLines<{ design: GradedDesign; state: GradedEvidenceState; observation: GradedObservation; row: GradedLimitRow }> {
  const { classes } = plan.spec;
  const reference = classes[0];
  return {
    modelLine: 'graded (items graded into classes; multinomial SPRT on demerits)',
    plan(design) {
      const { h1, h2, slope, demerits } = design.boundaries;
      const level = (symbol: string, vector: readonly number[]) => ({
        symbol,
        value: 1 - vector[0],
        unit: `not ${reference} (by class: ${classes.map((name, k) => `${name} ${formatNumber(vector[k])}`).join(', ')})`,
      });
      const asn = design.exact ?? { asnH0: design.wald.asnH0, asnH1: design.wald.asnH1 };
      return {
        acceptableQuality: level(`P0(not ${reference})`, plan.spec.p0),
        rejectableQuality: level(`P1(not ${reference})`, plan.spec.p1),
        producerRiskExact: design.exact?.alpha ?? null,
        consumerRiskExact: design.exact?.beta ?? null,
        rows: [
          ['Demerits per item', demerits.map((row) => `${row.className} ${formatNumber(row.demerits)}`).join(', ')],
          ['Boundaries', `accept when D <= ${formatFixed(slope, 4)} n - ${formatFixed(h1, 4)}; reject when D >= ${formatFixed(slope, 4)} n + ${formatFixed(h2, 4)}\n(D: total demerits, n: items graded)`],
          ['Truncation', design.truncationRule],
          ['Average sample number', `${formatNumber(asn.asnH0)} items at H0, ${formatNumber(asn.asnH1)} items at H1 (${design.exact === null ? "Wald's approximation" : 'exact'})`],
        ],
      };
    },
    evidence(state) {
      const counts = classes.map((name, k) => `${name} ${formatCount(state.counts[k])}`).join(', ');
      return {
        rows: [
          ['Items graded', formatCount(state.n)],
          ['Items per class', counts],
          ['Demerits', formatNumber(state.demerits)],
        ],
        facts: `${formatCount(state.n)} ${countNoun(state.n, 'item')} graded (${counts}), ${formatNumber(state.demerits)} demerits, final LLR ${formatFixed(state.llr)}`,
      };
    },
    resultText: (observation) => observation.grade,
    estimate(state, _decided, confidenceLevel) {
      if (state.n === 0) return null;
      const share = naiveQualityEstimate({ model: 'passfail', itemsInspected: state.n, nonconformities: state.n - state.counts[0], confidenceLevel });
      return {
        methodName: `Naive share of items not ${reference} with the exact Clopper-Pearson ${percentText(confidenceLevel)} interval. ${SEQUENTIAL_INTERVAL_NOTE}`,
        pointEstimate: share.pointEstimate,
        confidenceLevel,
        lower: share.lower,
        upper: share.upper,
        unit: `share not ${reference}`,
        detail: `class shares: ${classes.map((name, k) => `${name} ${formatNumber(state.counts[k] / state.n)}`).join(', ')}`,
      };
    },
    chart(limits, path) {
      const n = path.at(-1)?.n ?? 0;
      return {
        xTitle: 'Items graded, n',
        yTitle: 'Demerits, D',
        evidenceLabel: 'demerits',
        acceptLabel: 'acceptance line',
        rejectLabel: 'rejection line',
        limitStyle: 'line',
        accept: limits.map((row): ChartPoint | null => (row.accept === null ? null : [row.n, row.accept])),
        reject: limits.map((row): ChartPoint => [row.n, row.reject]),
        pathStyle: 'line',
        path: path.map((point): ChartPoint => [point.n, point.total]),
        alt: `Chart of the demerits of ${n} graded items against n, drawn against the plan's acceptance and rejection lines.`,
      };
    },
  };
}
