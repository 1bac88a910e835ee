/**
 * The record lines of a linear-count plan (pass/fail, count): Wald's boundaries with the exact
 * risks and ASN of the integer plan, the items and the cumulative count, the sequential estimate
 * once a decision stands, and the acceptance and rejection numbers as steps.
 */
import { countNoun, countOf } from '../countWords.js';
import { PlanParameterError } from '../errors.js';
import { estimateAfterStop } from '../estimation/estimateAfterStop.js';
import { naiveQualityEstimate } from '../estimation/naiveQualityEstimate.js';
import { formatCount, formatFixed, formatNumber, percentText } from '../numberText.js';
import type { LimitRow, LinearCountDesign } from '../planDesignTypes.js';
import type { ResolvedPlan } from '../resolvePlan.js';
import type { LinearCountSpec } from '../spec.js';
import type { WaldBoundaries } from '../waldBoundaries.js';
import type { ModelLabels } from './sequentialModel.js';
import type { EvidenceDecision } from './sequentialModel.js';
import type { RecordEstimate, RecordLines, RecordRow } from './recordLines.js';

/** How a linear-count model's record names its count and its results. */
export interface LinearCountRecordWords<O> {
  /** The model as the record names it. */
  readonly modelLine: string;
  /** The unit of the quality level, e.g. "fraction nonconforming". */
  readonly qualityUnit: string;
  /** What the cumulative count counts, as rows and chart name it: "nonconforming", "nonconformities". */
  readonly counted: string;
  /** The count's noun after a number: "nonconforming" for any number, or "1 nonconformity". */
  countedNoun(total: number): string;
  /** The unit of the cumulative count on the chart's axis: "items" or "count". */
  readonly countUnit: string;
  /** One result as printed, e.g. "nonconforming". */
  resultText(observation: O): string;
}

/** The figures of a linear-count plan that its plan rows print. */
export interface LinearCountPlanFigures {
  readonly boundaries: Pick<WaldBoundaries, 'h1' | 'h2' | 'slope' | 'lnA' | 'lnB'>;
  readonly truncation: { readonly maxItems: number; readonly rule: string } | null;
  /** Average sample number, in items, at H0 and at H1 (the exact ones of the plan as run). */
  readonly asnH0: number;
  readonly asnH1: number;
}

/** Boundaries, LLR limits, truncation and ASN of a pass/fail or count plan. */
export function linearCountPlanRows({ boundaries, truncation, asnH0, asnH1 }: LinearCountPlanFigures): RecordRow[] {
  return [
    [
      'Boundaries',
      `h1 = ${formatFixed(boundaries.h1, 4)}, h2 = ${formatFixed(boundaries.h2, 4)}, slope s = ${formatFixed(boundaries.slope, 6)}\n` +
        `accept when d <= -h1 + s n; reject when d >= h2 + s n (d: cumulative nonconforming, n: items)`,
    ],
    ['LLR limits', `ln A = ${formatFixed(boundaries.lnA, 4)} (reject at or above), ln B = ${formatFixed(boundaries.lnB, 4)} (accept at or below)`],
    ['Truncation', truncation === null ? 'none' : `at ${formatCount(truncation.maxItems)} items: ${truncation.rule}`],
    ['Average sample number', `${formatNumber(asnH0)} items at H0, ${formatNumber(asnH1)} items at H1`],
  ];
}

const capitalised = (text: string) => text.charAt(0).toUpperCase() + text.slice(1);

/**
 * The record lines of a linear-count plan.
 *
 * Method: the estimate once a decision stands is Whitehead's bias-adjusted estimate with the
 * stagewise exact interval (estimateAfterStop); before, or where the stop is not one of the plan's
 * stopping points (a run continued after an override), the naive d/n with its fixed-sample interval.
 * References: Whitehead, J. (1986), Biometrika 73; Armitage, P. (1958); Jennison, C. and Turnbull,
 * B. W. (2000), Group Sequential Methods, section 8.4.
 */
export function linearCountRecordLines<O>(
  plan: ResolvedPlan,
  labels: ModelLabels,
  words: LinearCountRecordWords<O>,
): RecordLines<{ design: LinearCountDesign; state: EvidenceDecision; observation: O; row: LimitRow }> {
  const spec: LinearCountSpec = plan.spec;
  return {
    modelLine: words.modelLine,
    plan: (design) => ({
      acceptableQuality: { symbol: labels.hypotheses[0], value: design.hypotheses.theta0, unit: words.qualityUnit },
      rejectableQuality: { symbol: labels.hypotheses[1], value: design.hypotheses.theta1, unit: words.qualityUnit },
      producerRiskExact: design.exact.alpha,
      consumerRiskExact: design.exact.beta,
      // The exact ASN of the integer plan as run (with its truncation), not Wald's approximation.
      rows: linearCountPlanRows({
        boundaries: design.boundaries,
        truncation: design.truncation === null ? null : { maxItems: design.truncation, rule: design.truncationRule },
        asnH0: design.exact.asnH0,
        asnH1: design.exact.asnH1,
      }),
    }),
    evidence: (state) => ({
      rows: [
        ['Items inspected', formatCount(state.n)],
        [`${capitalised(words.counted)} found`, formatCount(state.total)],
      ],
      facts: `${formatCount(state.n)} ${countNoun(state.n, 'item')} inspected, ${formatCount(state.total)} ${words.countedNoun(state.total)} found, final LLR ${formatFixed(state.llr)}`,
    }),
    resultText: words.resultText,
    estimate(state, decided, confidenceLevel): RecordEstimate | null {
      const { n, total } = state;
      if (n === 0) return null;
      const naive = naiveQualityEstimate({ model: spec.model, itemsInspected: n, nonconformities: total, confidenceLevel });
      if (!decided) return naive;
      try {
        const after = estimateAfterStop(spec, { n, total, confidence: confidenceLevel });
        return {
          methodName:
            `Bias-adjusted estimate (Whitehead 1986) and exact ${percentText(confidenceLevel)} interval from the stagewise ordering of the ` +
            `sample space (Armitage 1958; Jennison and Turnbull 2000, section 8.4), both from the exact stopping distribution of the plan as run`,
          pointEstimate: after.biasAdjusted,
          pointEstimateName: 'bias-adjusted',
          naiveEstimate: after.naive,
          confidenceLevel,
          lower: after.interval.lower,
          upper: after.interval.upper,
          unit: naive.unit,
        };
      } catch (error) {
        if (!(error instanceof PlanParameterError)) throw error;
        // E.g. a run that went on past a stopping point after an override: the stopping distribution
        // does not describe how it stopped, so only the naive figure can be given honestly.
        return { ...naive, methodName: `The sequential estimate does not apply to this stop (${error.message}). ${naive.methodName}` };
      }
    },
    chart(limits, path) {
      const [n, total] = [path.at(-1)?.n ?? 0, path.at(-1)?.total ?? 0];
      return {
        xTitle: 'Items inspected, n (items)',
        yTitle: `Cumulative ${words.counted}, d (${words.countUnit})`,
        evidenceLabel: `cumulative ${words.counted}`,
        acceptLabel: 'acceptance number',
        rejectLabel: 'rejection number',
        limitStyle: 'steps',
        accept: limits.map((row) => (row.accept === null ? null : [row.n, row.accept])),
        reject: limits.map((row) => [row.n, row.reject]),
        pathStyle: 'steps',
        path: path.map((point) => [point.n, point.total]),
        alt:
          `Chart of cumulative ${words.counted} against items inspected: ${countOf(n, 'item')}, ${total} ${words.countedNoun(total)}, ` +
          `drawn against the plan's acceptance and rejection numbers.`,
      };
    },
  };
}
