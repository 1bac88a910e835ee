/**
 * The run's statistics from the engine: the only place the inspection side calls it. Uses the
 * engine's `decide` (the decision, rule and LLR of `liveState` without its exact look-ahead), cheap
 * enough for every append; screens that show the look-ahead call `liveState` on (spec, n, total).
 */
import { decide, type AnyPlanSpec, type PlanSpec } from '../engine/index.js';
import type { CountRunState, ItemResult } from './runTypes.js';

/** What one pass/fail or count result adds to the total: 1 for a nonconforming item, the count for the count model (0 for other models' results). */
export function resultTotal(result: ItemResult): number {
  if (result === 'fail') return 1;
  return typeof result === 'number' ? result : 0;
}

/** The class index of a graded result, matching names without regard to case or surrounding spaces; -1 if none. */
export function gradeIndex(classes: readonly string[], grade: string): number {
  const wanted = grade.trim().toLowerCase();
  return classes.findIndex((name) => name.toLowerCase() === wanted);
}

const isRecord = (value: unknown): value is Record<string, unknown> => typeof value === 'object' && value !== null && !Array.isArray(value);
const hasOnly = (value: Record<string, unknown>, keys: readonly string[]) => Object.keys(value).every((key) => keys.includes(key));
const isFinite = (value: unknown): value is number => typeof value === 'number' && Number.isFinite(value);

/**
 * Check a result against the plan's model; returns a sentence when it does not fit. `currentTime`
 * is a lifetime run's accumulated test time so far: a reading may not go below it.
 */
export function resultProblem(spec: AnyPlanSpec, result: unknown, currentTime = 0): string | null {
  const given = JSON.stringify(result);
  switch (spec.model) {
    case 'passfail':
      return result === 'pass' || result === 'fail' ? null : `a passfail plan takes "pass" or "fail", not ${given}`;
    case 'count':
      return typeof result === 'number' && Number.isInteger(result) && result >= 0
        ? null
        : `a count plan takes a whole number of nonconformities (0 or more), not ${given}`;
    case 'measurement':
      return isRecord(result) && hasOnly(result, ['value']) && isFinite(result.value)
        ? null
        : `a measurement plan takes a measured value { "value": number }${spec.unit ? ` in ${spec.unit}` : ''}, not ${given}`;
    case 'lifetime': {
      const allowed = '{ "time": T } (a reading of accumulated test time) or { "failure": true } with an optional "time"';
      const failure = isRecord(result) && result.failure === true && hasOnly(result, ['failure', 'time']);
      const reading = isRecord(result) && hasOnly(result, ['time']) && result.time !== undefined;
      if (!failure && !reading) return `a lifetime plan takes ${allowed}, not ${given}`;
      const time = (result as Record<string, unknown>).time;
      if (time === undefined) return null;
      if (!isFinite(time) || time < 0) return `a test time is a number of 0 or more, not ${JSON.stringify(time)}`;
      return time < currentTime ? `accumulated test time never goes down: it is ${currentTime} now, so ${time} is not allowed` : null;
    }
    case 'graded': {
      const allowed = spec.classes.map((name) => JSON.stringify(name)).join(', ');
      if (!(isRecord(result) && hasOnly(result, ['grade']) && typeof result.grade === 'string')) {
        return `a graded plan takes { "grade": class name } with a class of ${allowed}, not ${given}`;
      }
      return gradeIndex(spec.classes, result.grade) >= 0 ? null : `${JSON.stringify(result.grade)} names no class of this plan; its classes are ${allowed}`;
    }
  }
}

/** The state of a pass/fail or count run after n items with the given total. */
export function runState(spec: PlanSpec, n: number, total: number): CountRunState {
  const decided = decide(spec, n, total);
  return { decision: decided.decision, n, total, llr: decided.llr, rule: decided.decision === 'continue' ? null : decided.rule };
}
