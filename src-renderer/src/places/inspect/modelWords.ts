/** The words and quality labels the Inspect place uses for a plan's model. */
import type { PlanSpec } from '../../../../src-main/engine/index';

export interface ModelWords {
  /** What one entry counts: "items" or "units". */
  readonly items: string;
  /** What the total counts: "nonconforming items" or "nonconformities". */
  readonly counted: string;
  /** The same, short, for axes and tallies: "nonconforming" or "nonconformities". */
  readonly countedShort: string;
  /** The two hypotheses as the trade writes them, e.g. "p0 = 1 %". */
  readonly h0: string;
  readonly h1: string;
}

/** A quality level without trailing zeros: 0.015 → "1.5 %". */
function percent(fraction: number): string {
  return `${Number((fraction * 100).toPrecision(6))} %`;
}

export function modelWords(spec: PlanSpec): ModelWords {
  if (spec.model === 'passfail') {
    return { items: 'items', counted: 'nonconforming items', countedShort: 'nonconforming', h0: `p0 = ${percent(spec.p0)}`, h1: `p1 = ${percent(spec.p1)}` };
  }
  return {
    items: 'units',
    counted: 'nonconformities',
    countedShort: 'nonconformities',
    h0: `λ0 = ${Number(spec.lambda0.toPrecision(6))} per unit`,
    h1: `λ1 = ${Number(spec.lambda1.toPrecision(6))} per unit`,
  };
}
