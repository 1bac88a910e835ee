import { describe, expect, it } from 'vitest';
import { checkPlanSpec, designPlan, estimatePlanWork, PLAN_LIMITS, PlanParameterError } from '../../src-main/engine/index.js';
import type { PlanSpec } from '../../src-main/engine/index.js';
import { unboundedSpecs } from './unboundedSpecs.js';

function refusal(run: () => unknown): PlanParameterError {
  try {
    run();
  } catch (error) {
    if (error instanceof PlanParameterError) return error;
    throw error;
  }
  throw new Error('expected a PlanParameterError, got none');
}

// A hang is a failure: each case would run for minutes (or out of memory) without the check, so a
// few seconds of test timeout is the bound, not a speed target.
describe('the one spec check bounds the work of a design', () => {
  for (const { name, spec, parameter, message } of unboundedSpecs) {
    it(`refuses ${name}, naming ${parameter} and what is allowed`, { timeout: 5000 }, () => {
      const checked = refusal(() => checkPlanSpec(spec));
      expect(checked.parameter).toBe(parameter);
      expect(checked.message).toMatch(message);
      expect(checked.message).not.toContain('\n');
      // designPlan runs the same check first, so it refuses the same way before computing anything.
      expect(refusal(() => designPlan(spec)).message).toBe(checked.message);
    });
  }

  it('refuses p1 next to p0 with its message instead of a typed-array RangeError', { timeout: 5000 }, () => {
    for (const p1 of [0.010000001, 0.0100001, 0.010001]) {
      const error = refusal(() => designPlan({ model: 'passfail', p0: 0.01, p1, alpha: 0.05, beta: 0.1 }));
      expect(error.parameter).toBe('p1');
      expect(error.message).toMatch(/widen the gap/);
    }
  });

  it('refuses more curve points than the curves allow', () => {
    const spec: PlanSpec = { model: 'passfail', p0: 0.01, p1: 0.1, alpha: 0.05, beta: 0.1 };
    expect(refusal(() => checkPlanSpec(spec, { curvePoints: PLAN_LIMITS.maxCurvePoints + 1 })).parameter).toBe('curvePoints');
  });
});

describe('the limits leave the plans a real inspection needs', () => {
  // Inputs of the NIST/SEMATECH e-Handbook §6.2.6 example (p0 0.01, p1 0.10, alpha 0.05, beta 0.10), first-hand.
  const nist = { model: 'passfail', p0: 0.01, p1: 0.1, alpha: 0.05, beta: 0.1 } as const;
  const allowed: Array<[string, PlanSpec]> = [
    ['pass/fail truncated at the largest truncation', { ...nist, truncation: PLAN_LIMITS.maxTruncation }],
    ['pass/fail with p0 0.001 against p1 0.002, untruncated (about 12,500 items at worst)', { model: 'passfail', p0: 0.001, p1: 0.002, alpha: 0.05, beta: 0.05 }],
    ['pass/fail with p0 0.001 against p1 0.002 truncated at 20,000', { model: 'passfail', p0: 0.001, p1: 0.002, alpha: 0.05, beta: 0.05, truncation: 20_000 }],
    ['count with lambda 1000 against 1100 per unit', { model: 'count', lambda0: 1000, lambda1: 1100, alpha: 0.05, beta: 0.1 }],
    ['measurement with a half-sigma shift truncated at 200', { model: 'measurement', mu0: 10, mu1: 10.5, sigma: 1, alpha: 0.05, beta: 0.1, truncation: 200 }],
    ['lifetime with theta1 = 0.9 theta0 stopping at the 800th failure', { model: 'lifetime', theta0: 1000, theta1: 900, alpha: 0.1, beta: 0.1, maxFailures: 800 }],
    ['lifetime stopping at the largest failure count', { model: 'lifetime', theta0: 1000, theta1: 500, alpha: 0.1, beta: 0.1, maxFailures: PLAN_LIMITS.maxFailures }],
    [
      'graded with 5 classes truncated at the largest truncation',
      { model: 'graded', classes: ['a', 'b', 'c', 'd', 'e'], p0: [0.8, 0.1, 0.05, 0.03, 0.02], p1: [0.6, 0.2, 0.1, 0.06, 0.04], alpha: 0.05, beta: 0.1, truncation: PLAN_LIMITS.maxTruncation },
    ],
  ];
  for (const [name, spec] of allowed) {
    it(`accepts ${name}`, () => {
      expect(() => checkPlanSpec(spec)).not.toThrow();
      expect(estimatePlanWork(spec, 51).work).toBeLessThanOrEqual(PLAN_LIMITS.maxWork);
    });
  }

  it('designs a pass/fail plan truncated at the largest truncation, with one limits row per item', () => {
    const design = designPlan({ ...nist, truncation: PLAN_LIMITS.maxTruncation }, { curvePoints: 11 });
    expect(design.model).toBe('passfail');
    expect(design.limits).toHaveLength(PLAN_LIMITS.maxTruncation);
  });

  it('estimates more work for a longer truncation and for more curve points', () => {
    const spec = { model: 'passfail', p0: 0.001, p1: 0.002, alpha: 0.05, beta: 0.05 } as const;
    expect(estimatePlanWork({ ...spec, truncation: 20_000 }, 51).work).toBeGreaterThan(estimatePlanWork({ ...spec, truncation: 10_000 }, 51).work);
    expect(estimatePlanWork(spec, 401).work).toBeGreaterThan(estimatePlanWork(spec, 51).work);
  });
});
