import { createExactEvaluator } from './exactEvaluator.js';
import type { ExactEvaluator, ExactEvaluatorOptions } from './exactEvaluator.js';
import { resolvePlan } from './resolvePlan.js';
import type { LinearCountSpec } from './spec.js';

/** An exact OC/ASN evaluator for a plan spec, with the spec's model and lines resolved once. */
export interface PlanEvaluator extends ExactEvaluator {
  readonly spec: LinearCountSpec;
}

/**
 * Validates a spec once (and fits it when fit = 'exact') and returns the fast exact evaluator of its
 * integer plan: hot calls take plain numbers and preallocated Float64Arrays.
 *
 * Method: the forward recursion of createExactEvaluator over the plan's lines.
 * References: Aroian, L. A. (1968), "Sequential analysis, direct method", Technometrics 10(1).
 *
 * @throws PlanParameterError for an invalid spec.
 */
export function createPlanEvaluator(spec: LinearCountSpec, options: ExactEvaluatorOptions = {}): PlanEvaluator {
  const plan = resolvePlan(spec);
  return Object.assign(createExactEvaluator(plan.lines, plan.model.countStep, options), { spec });
}
