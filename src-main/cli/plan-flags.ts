/**
 * The flags that describe a plan, shared by `plan`, `replay` and later `run start`:
 * --model, --p0/--p1 or --lambda0/--lambda1, --alpha, --beta, --truncate, --fit.
 */
import type { PlanSpec } from '../engine/index.js';
import { flag, rejectFlags, requireFlag } from './flags.js';

export const planFlags = {
  model: flag.choice('passfail', 'count'),
  p0: flag.probability(),
  p1: flag.probability(),
  lambda0: flag.positive(),
  lambda1: flag.positive(),
  alpha: flag.probability(),
  beta: flag.probability(),
  truncate: flag.integer(1),
  fit: flag.choice('wald', 'exact'),
};

export const planFlagsUsage = [
  '  --model passfail|count     data model (required)',
  '  --p0 P --p1 P              passfail: acceptable and rejectable fraction nonconforming, 0 < p0 < p1 < 1',
  '  --lambda0 L --lambda1 L    count: acceptable and rejectable nonconformities per unit, 0 < lambda0 < lambda1',
  "  --alpha A --beta B         producer's and consumer's risk, each in (0, 1), alpha + beta < 1",
  '  --truncate N               decide at N items at the latest (accept iff LLR <= 0 there)',
  "  --fit wald|exact           Wald's lines (default) or lines fitted to the exact risks",
].join('\n');

/**
 * The plan spec from parsed plan flags; the engine then checks the relations (p0 < p1, alpha + beta < 1).
 *
 * @throws UsageError for a missing flag or one that belongs to the other model.
 */
export function planSpecFromFlags(values: Record<string, unknown>): PlanSpec {
  const model = requireFlag<PlanSpec['model']>(values, 'model', planFlags);
  const alpha = requireFlag<number>(values, 'alpha', planFlags);
  const beta = requireFlag<number>(values, 'beta', planFlags);
  const common = {
    alpha,
    beta,
    truncation: (values.truncate as number | undefined) ?? null,
    fit: (values.fit as 'wald' | 'exact' | undefined) ?? 'wald',
  };
  if (model === 'passfail') {
    rejectFlags(values, ['lambda0', 'lambda1'], 'belongs to --model count (use --p0 and --p1 for passfail)');
    return {
      model,
      p0: requireFlag<number>(values, 'p0', planFlags),
      p1: requireFlag<number>(values, 'p1', planFlags),
      ...common,
    };
  }
  rejectFlags(values, ['p0', 'p1'], 'belongs to --model passfail (use --lambda0 and --lambda1 for count)');
  return {
    model,
    lambda0: requireFlag<number>(values, 'lambda0', planFlags),
    lambda1: requireFlag<number>(values, 'lambda1', planFlags),
    ...common,
  };
}
