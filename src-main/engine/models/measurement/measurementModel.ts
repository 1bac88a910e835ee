import { measurementWork } from './measurementWork.js';
import { measurementRecordLines } from './measurementRecordLines.js';
import type { MeasurementSpec } from '../../spec.js';
import { withoutPassedTruncation, type EvidenceDecision, type SequentialModel } from '../sequentialModel.js';
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
}> = {
  name: 'measurement',
  labels: { title: 'measurement', quality: 'mu', hypotheses: ['mu0', 'mu1'], entry: ['measurement', 'measurements'] },
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
  recordLines: measurementRecordLines,
};
