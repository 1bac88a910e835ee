import { gradedWork } from './gradedWork.js';
import { gradedRecordLines } from './gradedRecordLines.js';
import type { GradedSpec } from '../../spec.js';
import { countOf } from '../../countWords.js';
import { formatNumber } from '../../numberText.js';
import { RISK_FLAGS, RISK_USAGE, TRUNCATE_FLAG, TRUNCATE_USAGE, risksFrom, truncationFrom } from '../commonPlanFlags.js';
import { itemHorizon, withoutPassedTruncation, type EvidenceDecision, type PlanFlagReader, type SequentialModel } from '../sequentialModel.js';
import { readableGradedPlan } from './gradedText.js';
import { designGradedPlan, gradedLiveState, type GradedDesign, type GradedLiveState } from './gradedDesign.js';
import { decideGraded, gradedBoundaries, gradedLimitRows, gradedPlan, gradedQuality, type GradedPlan } from './gradedPlan.js';

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

/** Graded: the demerit limits against n (accept null while acceptance is impossible). */
export interface GradedFrame {
  readonly model: 'graded';
  readonly horizon: number;
  readonly limits: GradedLimitRow[];
  readonly lnA: number;
  readonly lnB: number;
  readonly truncation: number | null;
  /** Demerits per item of each class (the first class 0, the second 1). */
  readonly demerits: Array<{ className: string; demerits: number }>;
}

/** --p0 or --p1: one probability per class of --classes. */
function classProbabilities(read: PlanFlagReader, name: 'p0' | 'p1', classes: readonly string[]): number[] {
  const allowed = `${classes.length} probabilities, comma-separated, one per class of --classes, summing to 1`;
  const value = read.given<number | number[]>(name);
  if (value === undefined) read.refuse(name, allowed, `--${name} is required for --model graded: ${allowed}`);
  if (!Array.isArray(value) || value.length !== classes.length) {
    read.refuse(name, allowed, `--${name} must be ${allowed} (got ${Array.isArray(value) ? value.length : 1})`);
  }
  return value;
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
  frame: GradedFrame;
}> = {
  name: 'graded',
  labels: { title: 'graded', quality: 't', hypotheses: ['p0', 'p1'], entry: ['item', 'items'], pooledRate: null },
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
  frame(plan, live) {
    // Far enough ahead to show where the run is expected to end under either hypothesis, and where
    // acceptance first becomes possible, so both lines are in view.
    const boundaries = gradedBoundaries(plan);
    const firstAcceptance = Math.ceil(boundaries.h1 / boundaries.slope);
    const horizon = itemHorizon(live.n, Math.max(live.expectedRemainingH0, live.expectedRemainingH1, firstAcceptance - live.n), plan.truncation);
    return {
      model: 'graded',
      horizon,
      limits: gradedLimitRows(plan, horizon),
      lnA: plan.lnA,
      lnB: plan.lnB,
      truncation: plan.truncation,
      demerits: boundaries.demerits,
    };
  },
  point: (state) => ({ n: state.n, total: state.total, llr: state.llr }),
  drawObservation(plan, _evidence, quality, uniform) {
    // The class by inversion of the cumulative of (1 - t) p0 + t p1 at t = quality.
    const probabilities = gradedQuality(plan, quality);
    const total = probabilities.reduce((sum, p) => sum + p, 0);
    let u = uniform() * total;
    let k = 0;
    while (k < probabilities.length - 1 && u >= probabilities[k]) u -= probabilities[k++];
    return { grade: plan.spec.classes[k] };
  },
  parseEntryText(plan, text) {
    const { classes } = plan.spec;
    const byName = gradeIndex(classes, text);
    const index = byName >= 0 ? byName : /^\d+$/.test(text) && Number(text) < classes.length ? Number(text) : -1;
    return index < 0
      ? { problem: `${JSON.stringify(text)} is not a class of this plan (${classes.join(', ')}) or its index 0 to ${classes.length - 1}` }
      : { result: { grade: classes[index] } };
  },
  flags: {
    own: [{ name: 'classes', kind: 'classNames' }, { name: 'p0', kind: 'probabilities' }, { name: 'p1', kind: 'probabilities' }, ...RISK_FLAGS, TRUNCATE_FLAG],
    usage: [
      '  --model graded             items graded into classes:',
      '     --classes a,b,c --p0 P,P,P --p1 P,P,P   (each list sums to 1; the first class is the reference)',
      RISK_USAGE,
      TRUNCATE_USAGE,
    ],
    spec(read) {
      const risks = risksFrom(read);
      const classes = read.need<string[]>('classes');
      return { model: 'graded', classes, p0: classProbabilities(read, 'p0', classes), p1: classProbabilities(read, 'p1', classes), ...risks, truncation: truncationFrom(read) };
    },
  },
  text: {
    result: (observation) => observation.grade,
    evidence: (state) => `n = ${state.n}, counts = ${state.counts.join('/')}, demerits = ${formatNumber(state.demerits)}`,
    evidenceColumn: 'evidence',
    evidenceCell: (state) => state.counts.join('/'),
    reached: (state) => `after ${countOf(state.n, 'entry', 'entries')}, ${state.counts.join('/')}`,
    design: readableGradedPlan,
  },
  json: {
    state: (state) => ({ counts: state.counts, demerits: state.demerits }),
    summary: (state) => ({ n: state.n, counts: state.counts }),
  },
  recordLines: gradedRecordLines,
};
