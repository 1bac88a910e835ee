import { PlanParameterError } from '../errors.js';
import type { LinearCountSpec } from '../spec.js';
import { countDefinition } from './count/countDefinition.js';
import type { LinearCountDefinition } from './linearCountDefinition.js';
import { passFailDefinition } from './passfail/passFailDefinition.js';

const definitions = {
  passfail: passFailDefinition,
  count: countDefinition,
} as const satisfies { [K in LinearCountSpec['model']]: LinearCountDefinition<Extract<LinearCountSpec, { model: K }>> };

/**
 * Validates a linear-count spec once (throws PlanParameterError) and returns its definition,
 * untyped in the spec so the shared integer-line code can use it.
 *
 * Method: the definition's own checks (qualities ordered and in range) and the shared ones
 * (risks in (0, 1) with alpha + beta < 1, truncation a positive integer).
 * References: Wald, A. (1947), Sequential Analysis, §3.2 (why alpha + beta < 1: A > 1 > B).
 */
export function validatedDefinition(spec: LinearCountSpec): LinearCountDefinition<LinearCountSpec> {
  if (spec === null || typeof spec !== 'object') {
    throw new PlanParameterError('spec', spec, 'a plan specification object');
  }
  const name = (spec as { model?: unknown }).model;
  if (typeof name !== 'string' || !Object.hasOwn(definitions, name)) {
    throw new PlanParameterError('model', name, `one of ${Object.keys(definitions).join(', ')}`);
  }
  const definition = definitions[name as LinearCountSpec['model']] as unknown as LinearCountDefinition<LinearCountSpec>;
  definition.validate(spec);
  return definition;
}

/** True for a spec of a linear-count model (pass/fail, count): one with integer acceptance and rejection numbers. */
export function isLinearCountSpec(spec: { model: string }): spec is LinearCountSpec {
  return Object.hasOwn(definitions, spec.model);
}
