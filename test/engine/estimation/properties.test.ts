import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { createPlanEvaluator } from '../../../src-main/engine/index.js';
import type { PassFailSpec } from '../../../src-main/engine/index.js';
import { createStoppingEvaluator, stagewiseInference } from '../../../src-main/engine/estimation/index.js';

// Random pass/fail plans (common practice, no source): hypotheses a factor 3 to 10 apart, risks 2-20 %,
// truncated at 10-80 items or not at all. Closer hypotheses work too but need thousands of items per
// recursion, too slow for a property run.
const plans = fc.record({
  model: fc.constant('passfail' as const),
  p0: fc.double({ min: 0.01, max: 0.08, noNaN: true }),
  ratio: fc.double({ min: 3, max: 10, noNaN: true }),
  alpha: fc.double({ min: 0.02, max: 0.2, noNaN: true }),
  beta: fc.double({ min: 0.02, max: 0.2, noNaN: true }),
  truncation: fc.option(fc.integer({ min: 10, max: 80 }), { nil: null }),
}).map(({ ratio, ...rest }): PassFailSpec => ({ ...rest, p1: Math.min(0.9, rest.p0 * ratio) }));

describe('properties of the stopping distribution and the stagewise interval', () => {
  it('the stopping probabilities add up to one and give the engine exact OC', () => {
    fc.assert(
      fc.property(plans, fc.double({ min: 0.001, max: 0.6, noNaN: true }), (spec, p) => {
        const distribution = createStoppingEvaluator(spec).distribution(p);
        const total = distribution.points.reduce((sum, point) => sum + point.probability, 0);
        expect(total + distribution.undecided).toBeCloseTo(1, 10);
        const accept = distribution.points.filter((point) => point.decision === 'accept').reduce((sum, point) => sum + point.probability, 0);
        expect(accept).toBeCloseTo(createPlanEvaluator(spec).evaluate(p).accept, 10);
      }),
      { numRuns: 40 },
    );
  });

  it('P_p(outcome >= observed) rises with p for every stopping point (what makes the interval exact)', () => {
    fc.assert(
      fc.property(plans, fc.double({ min: 0.001, max: 0.5, noNaN: true }), fc.double({ min: 0.001, max: 0.5, noNaN: true }), fc.nat(), (spec, a, b, pick) => {
        const evaluator = createStoppingEvaluator(spec);
        const points = evaluator.distribution(0.5 * (spec.p0 + spec.p1)).points;
        const observed = points[pick % points.length];
        const [low, high] = a < b ? [a, b] : [b, a];
        const atLow = evaluator.tail(low, observed.side, observed.itemCount, observed.total);
        const lowAtLeast = atLow.above + atLow.equal;
        const atHigh = evaluator.tail(high, observed.side, observed.itemCount, observed.total);
        expect(lowAtLeast).toBeLessThanOrEqual(atHigh.above + atHigh.equal + 1e-12);
      }),
      { numRuns: 60 },
    );
  });

  it('the interval holds the median-unbiased estimate and widens with the confidence level', () => {
    fc.assert(
      fc.property(plans, fc.nat(), (spec, pick) => {
        const evaluator = createStoppingEvaluator(spec);
        const points = evaluator.distribution(spec.p1).points;
        const { itemCount: n, total } = points[pick % points.length];
        const narrow = stagewiseInference(evaluator, { n, total }, 0.8);
        const wide = stagewiseInference(evaluator, { n, total }, 0.95);
        expect(narrow.lower).toBeLessThanOrEqual(narrow.medianUnbiased + 1e-12);
        expect(narrow.medianUnbiased).toBeLessThanOrEqual(narrow.upper + 1e-12);
        expect(wide.lower).toBeLessThanOrEqual(narrow.lower + 1e-12);
        expect(wide.upper).toBeGreaterThanOrEqual(narrow.upper - 1e-12);
      }),
      { numRuns: 30 },
    );
  });
});
