/**
 * The engine states proportions as fractions (p0 = 0.01); the Plan place asks for them in percent.
 * Its messages are rewritten into the units the engineer typed, so "1" and "0.5" are not answered
 * with "0.01" and "0.005".
 */
import type { PlanSpec } from '../../../../src-main/engine/index.js';

const percentNames = (model: PlanSpec['model']) => (model === 'passfail' ? ['p0', 'p1', 'alpha', 'beta'] : ['alpha', 'beta']);

function percent(fraction: number): string {
  return `${Number((fraction * 100).toPrecision(6))} %`;
}

export function messageInScreenUnits(message: string, model: PlanSpec['model']): string {
  let rewritten = message;
  for (const name of percentNames(model)) {
    // "p1 must be a number in (0, 1) (got 1)": the value typed was 100 %, so the answer says 100 %.
    if (rewritten.startsWith(`${name} must be`)) {
      rewritten = rewritten.replace(/\(got (-?[0-9.]+(?:e-?[0-9]+)?)\)$/, (_, value: string) => `(got ${percent(Number(value))})`);
    }
    rewritten = rewritten.replace(new RegExp(`\\b${name} = (-?[0-9.]+(?:e-?[0-9]+)?)`, 'g'), (_, value: string) => `${name} = ${percent(Number(value))}`);
  }
  return rewritten.replace('a number in (0, 1)', 'above 0 % and below 100 %').replace('alpha + beta must be less than 1', 'alpha + beta must be less than 100 %');
}
