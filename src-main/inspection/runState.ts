/**
 * Results checked against a run's plan, through the plan's model in the engine registry.
 */
import { planOf, type Observation, type PlanSpec } from '../engine/index.js';
import type { ItemResult } from './runTypes.js';

export { gradeIndex } from '../engine/index.js';

/** What one pass/fail or count result adds to the cumulative count: 1 for a nonconforming item, the count for the count model (0 for other models' results). */
export function resultTotal(result: ItemResult): number {
  if (result === 'fail') return 1;
  return typeof result === 'number' ? result : 0;
}

/** A sentence saying what is wrong with a result for the plan's model (before any entry), or null when it fits. */
export function resultProblem(spec: PlanSpec, result: unknown): string | null {
  const plan = planOf(spec);
  return plan.observationProblem(result, plan.emptyEvidence());
}

/** The result as the journal keeps it (a graded class spelled as the plan spells it). */
export function canonicalResult(spec: PlanSpec, result: ItemResult): ItemResult {
  return planOf(spec).canonical(result as Observation);
}
