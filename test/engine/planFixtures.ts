// Plans the engine tests share. Inputs: NIST/SEMATECH e-Handbook §6.2.6 (NIST/SEMATECH e-Handbook §6.2.6 (first-hand),
// inputs (from memory), reproduced) and Montgomery's item-by-item example (Montgomery, Introduction to Statistical Quality Control, §15.5 (from memory) (from memory)).
import { waldBoundaries } from '../../src-main/engine/index.js';
import type { IntegerLines, LinearCountSpec } from '../../src-main/engine/index.js';

export const nist: LinearCountSpec = { model: 'passfail', p0: 0.01, p1: 0.1, alpha: 0.05, beta: 0.1 };
export const montgomery: LinearCountSpec = { model: 'passfail', p0: 0.01, p1: 0.06, alpha: 0.05, beta: 0.1 };

/** Wald's integer lines of a spec, with an optional truncation. */
export function linesOf(spec: LinearCountSpec, truncation: number | null = null): IntegerLines {
  const { h1, h2, slope } = waldBoundaries(spec);
  return { h1, h2, slope, truncation };
}
