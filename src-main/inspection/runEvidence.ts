/**
 * A run's accumulated evidence and the decision on it, through the plan's model (engine registry).
 * Results enter one by one; a void rebuilds the evidence from the results still counted, so for
 * lifetime a voided time reading gives back the previous accumulated time.
 */
import { planOf, type Evidence, type Observation, type PlanSpec, type SequentialPlan } from '../engine/index.js';
import type { ItemResult, RunState } from './runTypes.js';

export class RunEvidence {
  private readonly plan: SequentialPlan;
  private evidence: Evidence;

  constructor(readonly spec: PlanSpec) {
    this.plan = planOf(spec);
    this.evidence = this.plan.emptyEvidence();
  }

  /** The evidence of the given counted results, in order. */
  static of(spec: PlanSpec, results: readonly ItemResult[]): RunEvidence {
    const evidence = new RunEvidence(spec);
    for (const result of results) evidence.add(result);
    return evidence;
  }

  /** Counted results (items, measurements, lifetime entries). */
  get n(): number {
    return this.evidence.n;
  }

  /** The running total in natural units (nonconforming items, nonconformities, sum, failures, demerits). */
  get total(): number {
    return this.state().total;
  }

  /** A lifetime run's accumulated test time so far (0 for the other models): a reading may not go below it. */
  get time(): number {
    return 'time' in this.evidence ? this.evidence.time : 0;
  }

  /** A sentence saying what is wrong with a result for this run's plan, or null when it fits. */
  problem(result: unknown): string | null {
    return this.plan.observationProblem(result, this.evidence);
  }

  /** Adds one counted result (already checked with `problem`). */
  add(result: ItemResult): void {
    this.evidence = this.plan.observe(this.evidence, result as Observation);
  }

  /** The statistics now, with the engine's decision. */
  state(): RunState {
    return this.plan.state(this.evidence);
  }
}
