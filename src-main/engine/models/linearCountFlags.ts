/** The plan flags of a pass/fail or count plan: its two hypotheses, the risks, --truncate and --fit. */
import type { FitMode, LinearCountSpec } from '../spec.js';
import { RISK_FLAGS, RISK_USAGE, TRUNCATE_FLAG, TRUNCATE_USAGE, risksFrom, truncationFrom } from './commonPlanFlags.js';
import type { ModelFlags, PlanFlag } from './sequentialModel.js';

const FIT_USAGE = "  --fit wald|exact           Wald's lines (default) or lines fitted to the exact risks";

/**
 * The flags of a linear-count model whose hypotheses are the flags `hypotheses` of the kind given
 * (`probabilities` is shared with graded, whose lists this model refuses).
 */
export function linearCountFlags<S extends LinearCountSpec>(
  model: S['model'],
  hypotheses: readonly [PlanFlag, PlanFlag],
  hypothesesUsage: string,
): ModelFlags<S> {
  return {
    own: [...hypotheses, ...RISK_FLAGS, TRUNCATE_FLAG, { name: 'fit', kind: 'choice', values: ['wald', 'exact'] }],
    usage: [hypothesesUsage, RISK_USAGE, TRUNCATE_USAGE, FIT_USAGE],
    spec(read) {
      for (const { name } of hypotheses) {
        if (Array.isArray(read.given(name))) read.refuse(name, 'a number in (0, 1)', `--${name} must be a number in (0, 1) for --model ${model} (got a list)`);
      }
      const risks = risksFrom(read);
      const [theta0, theta1] = hypotheses.map(({ name }) => [name, read.need<number>(name)] as const);
      return {
        model,
        [theta0[0]]: theta0[1],
        [theta1[0]]: theta1[1],
        ...risks,
        truncation: truncationFrom(read),
        fit: read.given<FitMode>('fit') ?? 'wald',
      } as unknown as S;
    },
  };
}
