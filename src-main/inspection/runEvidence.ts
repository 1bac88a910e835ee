/**
 * A run's accumulated evidence, per model, and the decision on it. Results enter one by one; a
 * void rebuilds the evidence from the results still counted, so for lifetime a voided time reading
 * gives back the previous accumulated time.
 *
 * - passfail / count: n items, total nonconforming items or nonconformities.
 * - measurement: n values and their sum.
 * - lifetime: accumulated test time T (a reading sets it; readings never go down) and failures r.
 *   A failure given with a time first moves T there; if that time alone reaches a decision (the
 *   accept line or the maximum time), the decision came before the failure, which is not counted.
 * - graded: the count of items per class.
 */
import {
  acceptTime,
  decide,
  decideGraded,
  decideLifetime,
  decideMeasurement,
  gradedBoundaries,
  gradedPlan,
  lifetimePlan,
  measurementPlan,
  type AnyPlanSpec,
  type GradedPlan,
  type LifetimePlan,
  type MeasurementPlan,
  type PlanSpec,
} from '../engine/index.js';
import { gradeIndex, resultTotal, runState } from './runState.js';
import type { ItemResult, RunState } from './runTypes.js';

type ModelPlan =
  | { model: 'linear'; spec: PlanSpec }
  | { model: 'measurement'; plan: MeasurementPlan }
  | { model: 'lifetime'; plan: LifetimePlan }
  | { model: 'graded'; plan: GradedPlan; demerits: number[] };

function modelPlan(spec: AnyPlanSpec): ModelPlan {
  switch (spec.model) {
    case 'measurement':
      return { model: 'measurement', plan: measurementPlan(spec) };
    case 'lifetime':
      return { model: 'lifetime', plan: lifetimePlan(spec) };
    case 'graded': {
      const plan = gradedPlan(spec);
      return { model: 'graded', plan, demerits: gradedBoundaries(plan).demerits.map((row) => row.demerits) };
    }
    default:
      return { model: 'linear', spec };
  }
}

export class RunEvidence {
  /** Counted results (passfail, count, measurement, graded items; lifetime entries). */
  n = 0;
  /** passfail / count total; measurement sum. */
  total = 0;
  /** Lifetime: accumulated test time and failures counted. */
  time = 0;
  failures = 0;
  /** Graded: items per class. */
  readonly counts: number[];
  private readonly plan: ModelPlan;
  private readonly classes: readonly string[];

  constructor(readonly spec: AnyPlanSpec) {
    this.plan = modelPlan(spec);
    this.classes = spec.model === 'graded' ? spec.classes : [];
    this.counts = this.classes.map(() => 0);
  }

  /** The evidence of the given counted results, in order. */
  static of(spec: AnyPlanSpec, results: readonly ItemResult[]): RunEvidence {
    const evidence = new RunEvidence(spec);
    for (const result of results) evidence.add(result);
    return evidence;
  }

  /** Adds one counted result (already checked with resultProblem). */
  add(result: ItemResult): void {
    this.n += 1;
    if (typeof result !== 'object') {
      this.total += resultTotal(result);
      return;
    }
    if ('value' in result) {
      this.total += result.value;
    } else if ('grade' in result) {
      const index = gradeIndex(this.classes, result.grade);
      if (index >= 0) this.counts[index] += 1;
    } else {
      if (result.time !== undefined) this.time = Math.max(this.time, result.time);
      if ('failure' in result && this.plan.model === 'lifetime') {
        // A failure reported at a time that already decided came after the decision.
        if (decideLifetime(this.plan.plan, this.time, this.failures).decision === 'continue') this.failures += 1;
      }
    }
  }

  /** The engine's decision on the evidence now, with its rule also while continuing ("between the lines"). */
  decision(): { decision: RunState['decision']; rule: string; llr: number } {
    const { plan } = this;
    if (plan.model === 'linear') return decide(plan.spec, this.n, this.total);
    if (plan.model === 'measurement') return decideMeasurement(plan.plan, this.n, this.total);
    if (plan.model === 'lifetime') return decideLifetime(plan.plan, this.time, this.failures);
    return decideGraded(plan.plan, this.counts);
  }

  /** The statistics now, with the engine's decision. */
  state(): RunState {
    const { plan } = this;
    if (plan.model === 'linear') return runState(plan.spec, this.n, this.total);
    if (plan.model === 'measurement') {
      const decided = decideMeasurement(plan.plan, this.n, this.total);
      return {
        model: 'measurement',
        decision: decided.decision,
        rule: decided.decision === 'continue' ? null : decided.rule,
        llr: decided.llr,
        n: this.n,
        total: this.total,
        sum: this.total,
        mean: this.n > 0 ? this.total / this.n : null,
      };
    }
    if (plan.model === 'lifetime') {
      const decided = decideLifetime(plan.plan, this.time, this.failures);
      // A time reading past a line decided where the line was reached, not at the reading.
      let time = decided.decision !== 'continue' && plan.plan.maxTime !== null ? Math.min(this.time, plan.plan.maxTime) : this.time;
      if (decided.rule === 'acceptance line crossed') time = Math.min(time, acceptTime(plan.plan, this.failures));
      const llr = decided.decision === 'continue' ? decided.llr : this.failures * plan.plan.llrPerFailure - time * plan.plan.llrPerTime;
      return {
        model: 'lifetime',
        decision: decided.decision,
        rule: decided.decision === 'continue' ? null : decided.rule,
        llr,
        n: this.n,
        total: this.failures,
        time,
        failures: this.failures,
      };
    }
    const decided = decideGraded(plan.plan, this.counts);
    const demerits = this.counts.reduce((sum, count, k) => sum + count * plan.demerits[k], 0);
    return {
      model: 'graded',
      decision: decided.decision,
      rule: decided.decision === 'continue' ? null : decided.rule,
      llr: decided.llr,
      n: this.n,
      total: demerits,
      counts: [...this.counts],
      demerits,
    };
  }
}
