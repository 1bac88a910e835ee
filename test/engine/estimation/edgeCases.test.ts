import { describe, expect, it } from 'vitest';
import { PlanParameterError, createPlanEvaluator } from '../../../src-main/engine/index.js';
import type { CountSpec, PassFailSpec } from '../../../src-main/engine/index.js';
import {
  ESTIMATION_METHOD,
  createStoppingEvaluator,
  estimateAfterStop,
} from '../../../src-main/engine/estimation/index.js';
import { nistExactTruncated156 } from '../../reference/referenceValues.js';
import { poissonCdf } from '../referenceDistributions.js';

// The NIST/SEMATECH e-Handbook §6.2.6 plan (NIST/SEMATECH e-Handbook §6.2.6 (first-hand)): rejection number 2 for n = 2..19,
// first acceptance (count 0) at n = 24.
const nist: PassFailSpec = { model: 'passfail', p0: 0.01, p1: 0.1, alpha: 0.05, beta: 0.1 };
const nistAt156: PassFailSpec = { ...nist, truncation: 156 };
const nistAt20: PassFailSpec = { ...nist, truncation: 20 };

function thrown(action: () => unknown): PlanParameterError {
  try {
    action();
  } catch (error) {
    expect(error).toBeInstanceOf(PlanParameterError);
    return error as PlanParameterError;
  }
  throw new Error('expected a PlanParameterError');
}

describe('estimateAfterStop at the edges of the sample space', () => {
  it('d = 0 at the first acceptance: lower limit 0, both estimates 0, upper limit 1 - 0.05^(1/24)', () => {
    const result = estimateAfterStop(nist, { n: 24, total: 0 });
    expect(result.decision).toBe('accept');
    expect(result.interval).toEqual({ lower: 0, upper: expect.any(Number), confidence: 0.9 });
    expect(result.naive).toBe(0);
    expect(result.biasAdjusted).toBe(0);
    expect(result.medianUnbiased).toBe(0);
    // The lowest outcome: P_p(T <= t) = (1-p)^24 (computed, closed form), so upper = 1 - 0.05^(1/24).
    expect(result.interval.upper).toBeCloseTo(1 - 0.05 ** (1 / 24), 9);
    expect(result.method).toBe(ESTIMATION_METHOD);
  });

  it('a reject after two items, both nonconforming: upper limit 1, lower sqrt(0.05)', () => {
    const result = estimateAfterStop(nistAt156, { n: 2, total: 2 });
    expect(result.decision).toBe('reject');
    // The highest outcome: P_p(T >= t) = p^2 (computed, closed form).
    expect(result.interval.lower).toBeCloseTo(Math.sqrt(0.05), 9);
    expect(result.interval.upper).toBe(1);
    expect(result.naive).toBe(1);
    expect(result.biasAdjusted).toBeCloseTo(1, 9);
    expect(result.pValue).toBeCloseTo(0.01 ** 2, 12);
  });

  it('a reject at n = 3: the lower limit solves p^2 + 2p^2(1-p) = gamma at confidence 0.8', () => {
    // T >= (3, 2) means reject at n = 2 or 3: P = p^2 + 2p^2(1-p) (computed, closed form).
    const result = estimateAfterStop(nist, { n: 3, total: 2, confidence: 0.8 });
    const atLeast = (p: number): number => p * p + 2 * p * p * (1 - p);
    expect(atLeast(result.interval.lower)).toBeCloseTo(0.1, 9);
    expect(result.interval.confidence).toBe(0.8);
  });

  it('truncation stops at n = 20 have closed-form limits', () => {
    // Truncated at 20 the NIST plan cannot accept earlier, so (20, 0) is the lowest outcome with
    // P_p = (1-p)^20, and T >= (20, 1) has probability 1 - (1-p)^20 (computed, closed form).
    const lowest = estimateAfterStop(nistAt20, { n: 20, total: 0 });
    expect(lowest.decision).toBe('accept');
    expect(lowest.interval.lower).toBe(0);
    expect(lowest.interval.upper).toBeCloseTo(1 - 0.05 ** (1 / 20), 9);
    const next = estimateAfterStop(nistAt20, { n: 20, total: 1 });
    expect(next.decision).toBe('reject'); // 1 > floor(s n_t) = floor(0.795) = 0: reject at truncation
    expect(next.interval.lower).toBeCloseTo(1 - 0.95 ** (1 / 20), 9);
  });

  it('a count-per-unit reject on the first unit: lower limit from the Poisson tail (jstat)', () => {
    const counts: CountSpec = { model: 'count', lambda0: 0.5, lambda1: 2, alpha: 0.05, beta: 0.1 };
    const evaluator = createStoppingEvaluator(counts);
    const first = evaluator.distribution(1).points[0];
    expect(first).toMatchObject({ itemCount: 1, decision: 'reject' });
    const observed = first.total + 2;
    const result = estimateAfterStop(evaluator, { n: 1, total: observed });
    // T >= (1, t) means t or more on the first unit: P = 1 - PoissonCdf(t - 1; lambda), from jstat 1.9.6.
    expect(1 - poissonCdf(observed - 1, result.interval.lower)).toBeCloseTo(0.05, 8);
    // P(T <= (1, t)) = 1 - P(T > (1, t)) = PoissonCdf(t; lambda), likewise.
    expect(poissonCdf(observed, result.interval.upper)).toBeCloseTo(0.05, 8);
  });

  it('the stopping distribution reproduces the truncated NIST OC and ASN of the reference recursion', () => {
    const evaluator = createStoppingEvaluator(nistAt156);
    // Computed with exactOcAsn(..., 156) (test/reference): truncated OC 0.97794 / 0.4701 / 0.09964, ASN 30.209 / 36.94 / 22.366.
    const cases = nistExactTruncated156;
    const engine = createPlanEvaluator(nistAt156);
    for (const [p, oc, asn] of cases) {
      const points = evaluator.distribution(p).points;
      const accept = points.filter((point) => point.decision === 'accept').reduce((sum, point) => sum + point.probability, 0);
      const mean = points.reduce((sum, point) => sum + point.itemCount * point.probability, 0);
      expect(Math.abs(accept - oc)).toBeLessThan(1e-4);
      expect(Math.abs(mean / asn - 1)).toBeLessThan(1e-3);
      expect(accept).toBeCloseTo(engine.evaluate(p).accept, 12); // the engine's own recursion
    }
  });
});

describe('estimateAfterStop refuses points that do not end a run', () => {
  it('names the counts that stop a run at n when total is still undecided there', () => {
    const error = thrown(() => estimateAfterStop(nistAt156, { n: 30, total: 1 }));
    expect(error.parameter).toBe('total');
    expect(error.message).toBe(
      '(n = 30, total = 1) is not a stopping point of this plan: at n = 30 a run stops only at total 3 (reject); this point is still undecided',
    );
  });

  it('says when the run would have stopped earlier', () => {
    const error = thrown(() => estimateAfterStop(nistAt156, { n: 30, total: 5 }));
    expect(error.message).toContain('would have stopped earlier');
  });

  it('says that a truncated plan has stopped every run by its truncation count', () => {
    const error = thrown(() => estimateAfterStop(nistAt20, { n: 21, total: 0 }));
    expect(error.message).toContain('truncated at n = 20');
  });

  it('rejects a non-integer or impossible n, total and confidence by name', () => {
    expect(thrown(() => estimateAfterStop(nist, { n: 0, total: 0 })).parameter).toBe('n');
    expect(thrown(() => estimateAfterStop(nist, { n: 2.5, total: 2 })).parameter).toBe('n');
    expect(thrown(() => estimateAfterStop(nist, { n: 2, total: 3 })).allowed).toBe('an integer from 0 to n = 2');
    expect(thrown(() => estimateAfterStop(nist, { n: 2, total: 2, confidence: 1 })).parameter).toBe('confidence');
    expect(thrown(() => estimateAfterStop({ ...nist, p1: 0.005 }, { n: 2, total: 2 })).parameter).toBe('p1');
  });
});
