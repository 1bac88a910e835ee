import { describe, expect, it } from 'vitest';
import { PlanParameterError, klDivergences, waldBoundaries } from '../../src-main/engine/index.js';

const nist = { model: 'passfail', p0: 0.01, p1: 0.1, alpha: 0.05, beta: 0.1 } as const;
const montgomery = { model: 'passfail', p0: 0.01, p1: 0.06, alpha: 0.05, beta: 0.1 } as const;

describe('waldBoundaries', () => {
  it('reproduces the NIST example lines h1 0.939, h2 1.205, slope 0.0397', () => {
    // NIST/SEMATECH e-Handbook §6.2.6, printed values (from memory); recomputed in NIST/SEMATECH e-Handbook §6.2.6 (first-hand).
    const lines = waldBoundaries(nist);
    expect(lines.h1).toBeCloseTo(0.939, 3);
    expect(lines.h2).toBeCloseTo(1.205, 3);
    expect(lines.slope).toBeCloseTo(0.0397, 4);
    // NIST/SEMATECH e-Handbook §6.2.6 (first-hand): h1 = 0.938862, h2 = 1.205379, s = 0.039747.
    expect(lines.h1).toBeCloseTo(0.938862, 6);
    expect(lines.h2).toBeCloseTo(1.205379, 6);
    expect(lines.slope).toBeCloseTo(0.039747, 6);
  });

  it('gives ln A and ln B from the risks alone', () => {
    // Wald 1947 ch. 3 (from memory): alpha 0.05, beta 0.10 -> ln A 2.89037, ln B -2.25129.
    const lines = waldBoundaries(nist);
    expect(lines.lnA).toBeCloseTo(2.89037, 5);
    expect(lines.lnB).toBeCloseTo(-2.25129, 5);
  });

  it('reproduces the Montgomery lines, which are the same in any log base', () => {
    // Montgomery, Introduction to SQC, §15.5 (6th ed.), printed with base-10 logs: h1 1.22, h2 1.57, s 0.028 (from memory);
    // Montgomery, Introduction to Statistical Quality Control, §15.5 (from memory): h1 = 1.221149, h2 = 1.567800, s = 0.028111. Only k depends on the base
    // (0.80066 in log10), so the engine's natural-log k is 0.800658 * ln 10.
    const lines = waldBoundaries(montgomery);
    expect(lines.h1).toBeCloseTo(1.22, 2);
    expect(lines.h2).toBeCloseTo(1.57, 2);
    expect(lines.slope).toBeCloseTo(0.028, 3);
    expect(lines.h1).toBeCloseTo(1.221149, 6);
    expect(lines.h2).toBeCloseTo(1.5678, 6);
    const naturalLogK = lines.lnA / lines.h2;
    expect(naturalLogK / Math.LN10).toBeCloseTo(0.800658, 5);
    expect(naturalLogK).toBeCloseTo(1.84358, 5);
  });

  it('gives the Poisson lines of Poisson SPRT lines and exact recursion (computed independently; no published example) for lambda 1 -> 2', () => {
    // Poisson SPRT lines and exact recursion (computed independently; no published example): h1 = h2 = 3.1699, s = 1.4427.
    const lines = waldBoundaries({ model: 'count', lambda0: 1, lambda1: 2, alpha: 0.1, beta: 0.1 });
    expect(lines.h1).toBeCloseTo(3.1699, 4);
    expect(lines.h2).toBeCloseTo(3.1699, 4);
    expect(lines.slope).toBeCloseTo(1.4427, 4);
    const other = waldBoundaries({ model: 'count', lambda0: 0.5, lambda1: 1, alpha: 0.05, beta: 0.1 });
    // Poisson SPRT lines and exact recursion (computed independently; no published example): 3.2479, 4.1699, 0.7213.
    expect(other.h1).toBeCloseTo(3.2479, 4);
    expect(other.h2).toBeCloseTo(4.1699, 4);
    expect(other.slope).toBeCloseTo(0.7213, 4);
  });
});

describe('klDivergences', () => {
  it('matches the NIST and Montgomery plans in nats', () => {
    // Wald 1947 OC/ASN formulas (computed independently).
    expect(klDivergences(nist).h0h1).toBeCloseTo(0.071331, 6);
    expect(klDivergences(nist).h1h0).toBeCloseTo(0.144479, 6);
    expect(klDivergences(montgomery).h0h1).toBeCloseTo(0.033389, 6);
    expect(klDivergences(montgomery).h1h0).toBeCloseTo(0.05879, 6);
  });

  it('matches the Poisson divergences of Poisson SPRT lines and exact recursion (computed independently; no published example)', () => {
    // Poisson SPRT lines and exact recursion (computed independently; no published example): 0.30685 and 0.38629 for lambda 1 -> 2.
    const kl = klDivergences({ model: 'count', lambda0: 1, lambda1: 2, alpha: 0.1, beta: 0.1 });
    expect(kl.h0h1).toBeCloseTo(0.30685, 5);
    expect(kl.h1h0).toBeCloseTo(0.38629, 5);
  });
});

describe('invalid plans', () => {
  const cases: Array<[string, object, string]> = [
    ['p1 not above p0', { ...nist, p1: 0.005 }, 'p1 must be greater than p0 (got p0 = 0.01, p1 = 0.005)'],
    ['p0 outside (0, 1)', { ...nist, p0: 0 }, 'p0 must be a number in (0, 1) (got 0)'],
    ['p1 outside (0, 1)', { ...nist, p1: 1 }, 'p1 must be a number in (0, 1) (got 1)'],
    ['alpha not a number', { ...nist, alpha: Number.NaN }, 'alpha must be a number in (0, 1) (got NaN)'],
    ['alpha + beta >= 1', { ...nist, alpha: 0.6, beta: 0.4 }, 'alpha + beta must be less than 1 (got alpha = 0.6, beta = 0.4)'],
    ['a fractional truncation', { ...nist, truncation: 2.5 }, 'truncation must be an integer from 1 to 100000 or none (got 2.5)'],
    ['a zero truncation', { ...nist, truncation: 0 }, 'truncation must be an integer from 1 to 100000 or none (got 0)'],
    ['lambda1 not above lambda0', { model: 'count', lambda0: 2, lambda1: 2, alpha: 0.1, beta: 0.1 }, 'lambda1 must be greater than lambda0 (got lambda0 = 2, lambda1 = 2)'],
    ['a negative rate', { model: 'count', lambda0: -1, lambda1: 2, alpha: 0.1, beta: 0.1 }, 'lambda0 must be a number greater than 0 (got -1)'],
    ['an unknown model', { ...nist, model: 'weight' }, 'model must be one of passfail, count (got "weight")'],
  ];
  it.each(cases)('a plan with %s throws PlanParameterError with a specific message', (_, spec, message) => {
    let caught: unknown;
    try {
      waldBoundaries(spec as never);
    } catch (error) {
      caught = error;
    }
    expect(caught).toBeInstanceOf(PlanParameterError);
    expect((caught as Error).message).toBe(message);
  });

  it('names the parameter, the value and the allowed range on the error', () => {
    try {
      klDivergences({ ...nist, beta: 1.5 });
      expect.unreachable();
    } catch (error) {
      expect(error).toMatchObject({ parameter: 'beta', value: 1.5, allowed: 'a number in (0, 1)' });
    }
  });
});
