import { PlanParameterError } from '../errors.js';
import type { PlanSpec } from '../spec.js';
import { countModel } from './count.js';
import type { ModelDefinition } from './model.js';
import { passFailModel } from './passfail.js';

const models = {
  passfail: passFailModel,
  count: countModel,
} as const satisfies { [K in PlanSpec['model']]: ModelDefinition<Extract<PlanSpec, { model: K }>> };

export const modelNames = Object.keys(models) as PlanSpec['model'][];

/**
 * The model definition for a spec, untyped in the spec so generic code can use it.
 *
 * Method: lookup on spec.model in the registry of models.
 * References: none (plumbing).
 */
export function modelOf(spec: PlanSpec): ModelDefinition<PlanSpec> {
  const name = (spec as { model?: unknown }).model;
  if (typeof name !== 'string' || !Object.hasOwn(models, name)) {
    throw new PlanParameterError('model', name, `one of ${modelNames.join(', ')}`);
  }
  return models[name as PlanSpec['model']] as unknown as ModelDefinition<PlanSpec>;
}

/**
 * Validates the spec once (throws PlanParameterError) and returns its model definition.
 *
 * Method: the model's own checks (qualities ordered and in range) and the shared ones
 * (risks in (0, 1) with alpha + beta < 1, truncation a positive integer).
 * References: Wald, A. (1947), Sequential Analysis, §3.2 (why alpha + beta < 1: A > 1 > B).
 */
export function validatedModel(spec: PlanSpec): ModelDefinition<PlanSpec> {
  if (spec === null || typeof spec !== 'object') {
    throw new PlanParameterError('spec', spec, 'a plan specification object');
  }
  const model = modelOf(spec);
  model.validate(spec);
  return model;
}
