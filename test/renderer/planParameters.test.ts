import { describe, expect, it } from 'vitest';
import { planParametersLine } from '../../src-renderer/src/places/plan/planParameters.js';

describe('the plan parameters line above a copied table', () => {
  it('states a pass/fail plan in percent with its risks and truncation', () => {
    // The NIST/SEMATECH e-Handbook §6.2.6 example plan (first-hand).
    expect(planParametersLine({ model: 'passfail', p0: 0.01, p1: 0.1, alpha: 0.05, beta: 0.1 })).toBe(
      'Plan: pass/fail, p0 = 1 %, p1 = 10 %, α = 5 %, β = 10 %, no truncation',
    );
  });

  it('states a count plan in rates per unit and a truncation when there is one', () => {
    expect(planParametersLine({ model: 'count', lambda0: 0.5, lambda1: 2, alpha: 0.05, beta: 0.05, truncation: 40 })).toBe(
      'Plan: count, λ0 = 0.5, λ1 = 2 nonconformities per unit, α = 5 %, β = 5 %, truncated at 40',
    );
  });
});
