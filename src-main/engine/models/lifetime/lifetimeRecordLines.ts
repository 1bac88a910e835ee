/**
 * The record lines of a lifetime plan: MTBFs in the plan's time unit, the lines in (T, r), the
 * accumulated test time and failures, the naive MTBF with its chi-square interval, and the chart of
 * failures against test time.
 */
import { countNoun } from '../../countWords.js';
import { naiveQualityEstimate } from '../../estimation/naiveQualityEstimate.js';
import { formatCount, formatFixed, formatNumber, percentText, withUnit } from '../../numberText.js';
import { SEQUENTIAL_INTERVAL_NOTE, type ChartPoint, type RecordLines } from '../recordLines.js';
import type { LifetimeDesign } from './lifetimeDesign.js';
import type { LifetimeEvidenceState, LifetimeLimitRow, LifetimeObservation } from './lifetimeModel.js';
import { lifetimeBoundaries, type LifetimePlan } from './lifetimePlan.js';

/**
 * The record lines of a lifetime plan.
 *
 * Method: estimate: MTBF T/r with the chi-square interval 2T/chi2(1-a/2; 2r+2) to 2T/chi2(a/2; 2r),
 * computed through its equivalence with the exact Poisson (Garwood) interval of the failure count
 * (naive: it ignores the stopping rule); with no failure the lower limit is the figure.
 * References: Epstein, B. and Sobel, M. (1953), "Life testing", JASA 48 (chi-square limits for the
 * exponential mean, from memory); Garwood, F. (1936), Biometrika 28.
 */
export function lifetimeRecordLines(
  plan: LifetimePlan,
): RecordLines<{ design: LifetimeDesign; state: LifetimeEvidenceState; observation: LifetimeObservation; row: LifetimeLimitRow }> {
  const unit = plan.spec.unit ?? 'time units';
  return {
    modelLine: 'lifetime (exponential times to failure; SPRT on test time and failures)',
    plan(design) {
      const b = design.boundaries;
      const level = (symbol: string, value: number) => ({ symbol, value, unit: `${unit} (MTBF)` });
      return {
        acceptableQuality: level('theta0', plan.spec.theta0),
        rejectableQuality: level('theta1', plan.spec.theta1),
        producerRiskExact: design.exact.alpha,
        consumerRiskExact: design.exact.beta,
        rows: [
          [
            'Boundaries',
            `accept when T >= ${formatFixed(b.acceptTimeAtZero, 2)} + ${formatFixed(b.timePerFailure, 2)} r; ` +
              `reject at the r-th failure if T <= ${formatFixed(b.timePerFailure, 2)} r - ${formatFixed(b.rejectOffset, 2)}\n` +
              `(T: accumulated test time in ${unit}, r: failures; discrimination ratio d = ${formatNumber(b.discriminationRatio)})`,
          ],
          ['Truncation', design.truncationRule],
          [
            'Expected test time',
            `${withUnit(design.exact.expectedTimeH0, unit)} at H0, ${withUnit(design.exact.expectedTimeH1, unit)} at H1 (fixed-duration test: ${withUnit(design.single.time, unit)})`,
          ],
        ],
      };
    },
    evidence: (state) => ({
      rows: [
        ['Accumulated test time', withUnit(state.time, unit)],
        ['Failures', formatCount(state.failures)],
        ['Entries counted', formatCount(state.n)],
      ],
      facts: `${withUnit(state.time, unit)} of test time, ${formatCount(state.failures)} ${countNoun(state.failures, 'failure')}, final LLR ${formatFixed(state.llr)}`,
    }),
    resultText(observation) {
      if ('failure' in observation) return observation.time === undefined ? 'failure' : `failure at T = ${withUnit(observation.time, unit)}`;
      return `T = ${withUnit(observation.time, unit)}`;
    },
    estimate(state, _decided, confidenceLevel) {
      if (state.n === 0) return null;
      // Poisson (Garwood) limits of the failure count's mean over the test time T; MTBF limits are T over them.
      const countLimits = naiveQualityEstimate({ model: 'count', itemsInspected: 1, nonconformities: state.failures, confidenceLevel });
      const lower = state.time / countLimits.upper;
      const upper = countLimits.lower === 0 ? Number.POSITIVE_INFINITY : state.time / countLimits.lower;
      const noFailure = state.failures === 0;
      return {
        methodName:
          `${noFailure ? 'No failure yet, so T/r is not defined: the figure is the lower limit. ' : 'Naive MTBF T/r with '}` +
          `the ${percentText(confidenceLevel)} chi-square interval 2T/chi2(2r+2) to 2T/chi2(2r) (time-terminated). ${SEQUENTIAL_INTERVAL_NOTE}`,
        pointEstimate: noFailure ? lower : state.time / state.failures,
        ...(noFailure ? { pointEstimateName: 'lower limit' } : {}),
        confidenceLevel,
        lower,
        upper,
        unit: `${unit} (MTBF)`,
      };
    },
    chart(limits, path) {
      const { rejectOffset, timePerFailure } = lifetimeBoundaries(plan);
      const last = path.at(-1);
      const [time, failures] = [last?.time ?? 0, last?.total ?? 0];
      return {
        xTitle: `Accumulated test time, T (${unit})`,
        yTitle: 'Failures, r',
        evidenceLabel: 'failures',
        acceptLabel: 'acceptance line',
        rejectLabel: 'rejection line',
        limitStyle: 'line',
        accept: limits.filter((row) => row.acceptTime !== null).map((row): ChartPoint => [row.acceptTime as number, row.failures]),
        // The rejection line from where it meets T = 0 (fewer failures cannot reject at any time),
        // then through each row's latest rejecting time.
        reject: [
          [0, rejectOffset / timePerFailure],
          ...limits.filter((row) => row.rejectTime !== null && row.rejectTime > 0).map((row): ChartPoint => [row.rejectTime as number, row.failures]),
        ],
        pathStyle: 'steps',
        path: path.map((point): ChartPoint => [point.time ?? 0, point.total]),
        alt: `Chart of ${failures} failures against ${formatNumber(time)} ${unit} of accumulated test time, drawn against the plan's acceptance and rejection lines.`,
      };
    },
  };
}
