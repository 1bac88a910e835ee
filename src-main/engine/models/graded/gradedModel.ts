import { gradedWork } from './gradedWork.js';
import { gradedRecordLines } from './gradedRecordLines.js';
import type { GradedSpec } from '../../spec.js';
import { withoutPassedTruncation, type EvidenceDecision, type SequentialModel } from '../sequentialModel.js';
import { designGradedPlan, gradedLiveState, type GradedDesign, type GradedLiveState } from './gradedDesign.js';
import { decideGraded, gradedBoundaries, gradedLimitRows, gradedPlan, type GradedPlan } from './gradedPlan.js';

/** The class an item was graded into, by name. */
export interface GradedObservation {
  readonly grade: string;
}

/** n items and the count per class, in the plan's class order. */
export interface GradedEvidence {
  readonly n: number;
  readonly counts: readonly number[];
}

/** The decision on a graded run: total = demerits (the second class weighs 1). */
export interface GradedEvidenceState extends EvidenceDecision {
  readonly model: 'graded';
  readonly counts: readonly number[];
  readonly demerits: number;
}

/** One row of the graded limits: demerits that accept (null: not yet possible) and that reject after n items. */
export interface GradedLimitRow {
  n: number;
  accept: number | null;
  reject: number;
}

/** The class index of a grade, matching names without regard to case or surrounding spaces; -1 if none. */
export function gradeIndex(classes: readonly string[], grade: string): number {
  const wanted = grade.trim().toLowerCase();
  return classes.findIndex((name) => name.toLowerCase() === wanted);
}

const isRecord = (value: unknown): value is Record<string, unknown> => typeof value === 'object' && value !== null && !Array.isArray(value);

/**
 * Items graded into classes: the evidence is the count per class.
 *
 * Method: z_k = ln(p1_k/p0_k) per item of class k; decision by decideGraded, look-ahead and design
 * by the recursion over class counts or a seeded simulation (gradedDesign).
 * References: Wald, A. (1947), Sequential Analysis, §3.1 and ch. 5.
 */
export const gradedModel: SequentialModel<{
  spec: GradedSpec;
  plan: GradedPlan;
  evidence: GradedEvidence;
  observation: GradedObservation;
  state: GradedEvidenceState;
  live: GradedLiveState & { readonly model: 'graded' };
  row: GradedLimitRow;
  design: GradedDesign;
}> = {
  name: 'graded',
  labels: { title: 'graded', quality: 't', hypotheses: ['p0', 'p1'], entry: ['item', 'items'] },
  plan: gradedPlan,
  emptyEvidence: (plan) => ({ n: 0, counts: plan.spec.classes.map(() => 0) }),
  observationProblem(plan, result) {
    const { classes } = plan.spec;
    const allowed = classes.map((name) => JSON.stringify(name)).join(', ');
    if (!(isRecord(result) && Object.keys(result).every((key) => key === 'grade') && typeof result.grade === 'string')) {
      return `a graded plan takes { "grade": class name } with a class of ${allowed}, not ${JSON.stringify(result)}`;
    }
    return gradeIndex(classes, result.grade) >= 0 ? null : `${JSON.stringify(result.grade)} names no class of this plan; its classes are ${allowed}`;
  },
  canonical: (plan, result) => ({ grade: plan.spec.classes[gradeIndex(plan.spec.classes, result.grade)] }),
  observe(plan, evidence, result) {
    const index = gradeIndex(plan.spec.classes, result.grade);
    return { n: evidence.n + 1, counts: evidence.counts.map((count, k) => (k === index ? count + 1 : count)) };
  },
  llrStep: (plan, _evidence, result) => plan.weights[gradeIndex(plan.spec.classes, result.grade)] ?? 0,
  state(plan, evidence) {
    const decided = decideGraded(plan, evidence.counts);
    const { demerits: perClass } = gradedBoundaries(plan);
    const demerits = evidence.counts.reduce((sum, count, k) => sum + count * perClass[k].demerits, 0);
    return {
      model: 'graded',
      decision: decided.decision,
      rule: decided.decision === 'continue' ? null : decided.rule,
      standing: decided.rule,
      llr: decided.llr,
      n: evidence.n,
      total: demerits,
      counts: [...evidence.counts],
      demerits,
    };
  },
  liveState: (plan, state) => ({ model: 'graded', ...gradedLiveState(withoutPassedTruncation(plan.spec, state.n), state.counts) }),
  limitRows: (plan, horizon) => gradedLimitRows(plan, plan.truncation === null ? horizon : Math.min(horizon, plan.truncation)),
  estimateWork: gradedWork,
  design: designGradedPlan,
  recordLines: gradedRecordLines,
};
