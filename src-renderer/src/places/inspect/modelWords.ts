/** The words and quality labels the Inspect place uses for a plan's model. */
import type { PlanSpec } from '../../../../src-main/engine/index';
import { percentText } from '../../lib/percent';

export interface ModelWords {
  /** What one entry counts: "items", "units", "measurements" or "readings". */
  readonly items: string;
  /** What the total counts: "nonconforming items", "nonconformities", "sum of the measurements", "failures", "demerits". */
  readonly counted: string;
  /** The same, short, for axes and tallies: "nonconforming" or "nonconformities". */
  readonly countedShort: string;
  /** The two hypotheses as the trade writes them, e.g. "p0 = 1 %". */
  readonly h0: string;
  readonly h1: string;
}

const percent = percentText;

const plain = (value: number) => Number(value.toPrecision(6));

export function modelWords(spec: PlanSpec): ModelWords {
  switch (spec.model) {
    case 'passfail':
      return { items: 'items', counted: 'nonconforming items', countedShort: 'nonconforming', h0: `p0 = ${percent(spec.p0)}`, h1: `p1 = ${percent(spec.p1)}` };
    case 'count':
      return {
        items: 'units',
        counted: 'nonconformities',
        countedShort: 'nonconformities',
        h0: `λ0 = ${plain(spec.lambda0)} per unit`,
        h1: `λ1 = ${plain(spec.lambda1)} per unit`,
      };
    case 'measurement': {
      const unit = spec.unit ? ` ${spec.unit}` : '';
      return { items: 'measurements', counted: 'sum of the measurements', countedShort: `sum${unit ? ` (${spec.unit})` : ''}`, h0: `μ0 = ${plain(spec.mu0)}${unit}`, h1: `μ1 = ${plain(spec.mu1)}${unit}` };
    }
    case 'lifetime':
      return { items: 'readings', counted: 'failures', countedShort: 'failures', h0: `θ0 = ${plain(spec.theta0)} h`, h1: `θ1 = ${plain(spec.theta1)} h` };
    case 'graded':
      return { items: 'items', counted: 'demerits', countedShort: 'demerits', h0: 'the acceptable shares', h1: 'the rejectable shares' };
  }
}
