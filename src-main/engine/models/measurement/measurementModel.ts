import { measurementWork } from './measurementWork.js';
import { measurementRecordLines } from './measurementRecordLines.js';
import type { MeasurementSpec } from '../../spec.js';
import { countOf } from '../../countWords.js';
import { normalQuantile } from '../../numerics/normalDistribution.js';
import { NUMBER_TEXT, formatNumber } from '../../numberText.js';
import { RISK_FLAGS, RISK_USAGE, TRUNCATE_FLAG, TRUNCATE_USAGE, UNIT_FLAG, UNIT_USAGE, risksFrom, truncationFrom, unitFrom } from '../commonPlanFlags.js';
import { itemHorizon, withoutPassedTruncation, type EvidenceDecision, type SequentialModel } from '../sequentialModel.js';
import { readableMeasurementPlan } from './measurementText.js';
import { designMeasurementPlan, measurementLiveState, type MeasurementDesign, type MeasurementLiveState } from './measurementDesign.js';
import { decideMeasurement, measurementLimitRows, measurementPlan, type MeasurementPlan } from './measurementPlan.js';

/** A measured value, in the plan's unit. */
export interface MeasurementObservation {
  readonly value: number;
}

/** n measured values and their sum. */
export interface MeasurementEvidence {
  readonly n: number;
  readonly sum: number;
}

/** The decision on a measurement run: total = sum, and the mean (null before the first value). */
export interface MeasurementEvidenceState extends EvidenceDecision {
  readonly model: 'measurement';
  readonly sum: number;
  readonly mean: number | null;
}

/** One row of the measurement limits: the running sum that accepts and the one that rejects after n values. */
export interface MeasurementLimitRow {
  n: number;
  accept: number;
  reject: number;
}

/** Measurement: the limits of the running sum against n, in the plan's unit (the truncation row holds its rule). */
export interface MeasurementFrame {
  readonly model: 'measurement';
  readonly horizon: number;
  readonly limits: MeasurementLimitRow[];
  /** The LLR limits in use (moved inward with the overshoot correction). */
  readonly lnA: number;
  readonly lnB: number;
  readonly truncation: number | null;
  /** 'above': reject at or above `reject`, accept at or below `accept`; 'below': mirrored. */
  readonly rejectWhen: 'above' | 'below';
  readonly unit: string | null;
}

const isRecord = (value: unknown): value is Record<string, unknown> => typeof value === 'object' && value !== null && !Array.isArray(value);

/**
 * Normal measurements with known sigma: the evidence is n and the sum of the values.
 *
 * Method: z = (mu1 - mu0)/sigma^2 (x - (mu0 + mu1)/2) per value; decision by decideMeasurement,
 * look-ahead and design by the integral-equation evaluator (measurementDesign).
 * References: Wald, A. (1947), Sequential Analysis, ch. 5; Siegmund, D. (1985), Sequential Analysis, ch. 3.
 */
export const measurementModel: SequentialModel<{
  spec: MeasurementSpec;
  plan: MeasurementPlan;
  evidence: MeasurementEvidence;
  observation: MeasurementObservation;
  state: MeasurementEvidenceState;
  live: MeasurementLiveState & { readonly model: 'measurement' };
  row: MeasurementLimitRow;
  design: MeasurementDesign;
  frame: MeasurementFrame;
}> = {
  name: 'measurement',
  labels: { title: 'measurement', quality: 'mu', hypotheses: ['mu0', 'mu1'], entry: ['measurement', 'measurements'], pooledRate: null },
  plan: measurementPlan,
  emptyEvidence: () => ({ n: 0, sum: 0 }),
  observationProblem(plan, result) {
    const fits = isRecord(result) && Object.keys(result).every((key) => key === 'value') && typeof result.value === 'number' && Number.isFinite(result.value);
    if (fits) return null;
    const unit = plan.spec.unit ? ` in ${plan.spec.unit}` : '';
    return `a measurement plan takes a measured value { "value": number }${unit}, not ${JSON.stringify(result)}`;
  },
  canonical: (_plan, result) => result,
  observe: (_plan, evidence, result) => ({ n: evidence.n + 1, sum: evidence.sum + result.value }),
  llrStep: (plan, _evidence, result) => plan.llrPerUnit * (result.value - plan.midpoint),
  state(plan, evidence) {
    const decided = decideMeasurement(plan, evidence.n, evidence.sum);
    return {
      model: 'measurement',
      decision: decided.decision,
      rule: decided.decision === 'continue' ? null : decided.rule,
      standing: decided.rule,
      llr: decided.llr,
      n: evidence.n,
      total: evidence.sum,
      sum: evidence.sum,
      mean: evidence.n > 0 ? evidence.sum / evidence.n : null,
    };
  },
  liveState: (plan, state) => ({ model: 'measurement', ...measurementLiveState(withoutPassedTruncation(plan.spec, state.n), state.n, state.sum) }),
  limitRows: (plan, horizon) => measurementLimitRows(plan, plan.truncation === null ? horizon : Math.min(horizon, plan.truncation)),
  estimateWork: measurementWork,
  design: designMeasurementPlan,
  frame(plan, live) {
    // Far enough ahead to show where the run is expected to end under either hypothesis.
    const horizon = itemHorizon(live.n, Math.max(live.expectedRemainingH0, live.expectedRemainingH1), plan.truncation);
    return {
      model: 'measurement',
      horizon,
      limits: measurementLimitRows(plan, horizon),
      lnA: plan.rejectLimit,
      lnB: plan.acceptLimit,
      truncation: plan.truncation,
      rejectWhen: plan.shift > 0 ? 'above' : 'below',
      unit: plan.spec.unit ?? null,
    };
  },
  point: (state) => ({ n: state.n, total: state.total, llr: state.llr }),
  // A normal value with mean `quality` and the plan's sigma, by inversion of one uniform.
  drawObservation: (plan, _evidence, quality, uniform) => ({ value: quality + plan.spec.sigma * normalQuantile(uniform()) }),
  parseEntryText: (_plan, text) =>
    NUMBER_TEXT.test(text) && Number.isFinite(Number(text))
      ? { result: { value: Number(text) } }
      : { problem: `${JSON.stringify(text)} is not a measured value (a number such as 10.03)` },
  flags: {
    own: [{ name: 'mu0', kind: 'finite' }, { name: 'mu1', kind: 'finite' }, { name: 'sigma', kind: 'positive' }, { name: 'correct-overshoot', kind: 'switch' }, ...RISK_FLAGS, TRUNCATE_FLAG, UNIT_FLAG],
    usage: [
      '  --model measurement        normal measurements, sigma known:',
      '     --mu0 M --mu1 M --sigma S [--correct-overshoot]   (mu1 above or below mu0; the correction pulls both limits in by 0.5826 |mu1-mu0|/sigma)',
      RISK_USAGE,
      TRUNCATE_USAGE,
      UNIT_USAGE,
    ],
    spec(read) {
      const risks = risksFrom(read);
      const mu0 = read.need<number>('mu0');
      const mu1 = read.need<number>('mu1');
      const sigma = read.need<number>('sigma');
      return {
        model: 'measurement',
        mu0,
        mu1,
        sigma,
        ...risks,
        truncation: truncationFrom(read),
        overshootCorrection: read.given<boolean>('correct-overshoot') === true,
        ...unitFrom(read),
      };
    },
  },
  text: {
    result: (observation) => String(observation.value),
    evidence: (state) => `n = ${state.n}, sum = ${formatNumber(state.sum)}`,
    evidenceColumn: 'evidence',
    evidenceCell: (state) => formatNumber(state.sum),
    reached: (state) => `after ${countOf(state.n, 'entry', 'entries')}, ${formatNumber(state.sum)}`,
    design: readableMeasurementPlan,
  },
  json: {
    state: (state) => ({ sum: state.sum, mean: state.mean }),
    summary: (state) => ({ n: state.n, sum: state.sum }),
  },
  recordLines: measurementRecordLines,
};
