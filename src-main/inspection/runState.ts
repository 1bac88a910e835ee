/**
 * The run's statistics from the engine: the only place the inspection side calls it. Uses the
 * engine's `decide` (the decision, rule and LLR of `liveState` without its exact look-ahead), cheap
 * enough for every append; screens that show the look-ahead call `liveState` on (spec, n, total).
 */
import { decide, type PlanSpec } from '../engine/index.js';
import type { ItemResult, RunState } from './runTypes.js';

/** What one result adds to the total: 1 for a nonconforming item, the count for the count model. */
export function resultTotal(result: ItemResult): number {
  if (result === 'fail') return 1;
  if (result === 'pass') return 0;
  return result;
}

/** Check a result against the plan's model; returns a sentence when it does not fit. */
export function resultProblem(spec: PlanSpec, result: unknown): string | null {
  if (spec.model === 'passfail') {
    return result === 'pass' || result === 'fail' ? null : `a passfail plan takes "pass" or "fail", not ${JSON.stringify(result)}`;
  }
  return typeof result === 'number' && Number.isInteger(result) && result >= 0
    ? null
    : `a count plan takes a whole number of nonconformities (0 or more), not ${JSON.stringify(result)}`;
}

export function runState(spec: PlanSpec, n: number, total: number): RunState {
  const decided = decide(spec, n, total);
  return { decision: decided.decision, n, total, llr: decided.llr, rule: decided.decision === 'continue' ? null : decided.rule };
}
