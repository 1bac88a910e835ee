/**
 * The plan's parameters in one line for people, put above a copied table so the numbers travel
 * with what they belong to: "Plan: pass/fail, p0 = 1 %, p1 = 10 %, α = 5 %, β = 10 %, no truncation".
 */
import type { PlanSpec } from '../../../../src-main/engine/index.js';
import { percentText } from '../../lib/percent.js';

const plain = (value: number) => String(Number(value.toPrecision(6)));

export function planParametersLine(spec: PlanSpec): string {
  const risks = `α = ${percentText(spec.alpha)}, β = ${percentText(spec.beta)}`;
  const truncation = 'truncation' in spec && spec.truncation ? `truncated at ${spec.truncation}` : 'no truncation';
  switch (spec.model) {
    case 'passfail':
      return `Plan: pass/fail, p0 = ${percentText(spec.p0)}, p1 = ${percentText(spec.p1)}, ${risks}, ${truncation}`;
    case 'count':
      return `Plan: count, λ0 = ${plain(spec.lambda0)}, λ1 = ${plain(spec.lambda1)} nonconformities per unit, ${risks}, ${truncation}`;
    case 'measurement': {
      const unit = spec.unit ? ` ${spec.unit}` : '';
      return `Plan: measurement, μ0 = ${plain(spec.mu0)}${unit}, μ1 = ${plain(spec.mu1)}${unit}, σ = ${plain(spec.sigma)}${unit}, ${risks}, ${truncation}`;
    }
    case 'lifetime': {
      const unit = ` ${spec.unit ?? 'h'}`;
      const limits = [spec.maxTime ? `test time at most ${plain(spec.maxTime)}${unit}` : null, spec.maxFailures ? `at most ${spec.maxFailures} failures` : null].filter(Boolean);
      return `Plan: lifetime, θ0 = ${plain(spec.theta0)}${unit}, θ1 = ${plain(spec.theta1)}${unit}, ${risks}${limits.length ? `, ${limits.join(', ')}` : ''}`;
    }
    case 'graded': {
      const shares = (values: number[]) => spec.classes.map((name, k) => `${name} ${percentText(values[k])}`).join(' / ');
      return `Plan: graded, acceptable ${shares(spec.p0)}, rejectable ${shares(spec.p1)}, ${risks}, ${truncation}`;
    }
  }
}
