import { describe, expect, it } from 'vitest';
import { resolvePlan } from '../../../src-main/engine/index.js';
import type { PassFailSpec } from '../../../src-main/engine/index.js';
import {
  StagewiseSide,
  createStoppingEvaluator,
  stagewiseInference,
} from '../../../src-main/engine/estimation/index.js';
import { bisect, enumerateAllSequences, enumeratedProbability, enumeratedTails } from './sequences.js';

// Plans small enough to enumerate every sequence (2^n_t of them):
// - the NIST/SEMATECH e-Handbook §6.2.6 plan (NIST/SEMATECH e-Handbook §6.2.6 (first-hand)) truncated at 20, before its first
//   possible acceptance at n = 24, so every accept is a truncation stop;
// - a plan with wide hypotheses (common practice, no source) that accepts at n = 8 and n = 15, rejects
//   from n = 2 and truncates at 16.
const nistAt20: PassFailSpec = { model: 'passfail', p0: 0.01, p1: 0.1, alpha: 0.05, beta: 0.1, truncation: 20 };
const wideAt16: PassFailSpec = { model: 'passfail', p0: 0.05, p1: 0.3, alpha: 0.1, beta: 0.1, truncation: 16 };
const qualities = [0.01, 0.05, 0.1, 0.2, 0.4];

describe.each([
  ['NIST plan truncated at 20', nistAt20],
  ['wide plan truncated at 16', wideAt16],
])('stopping distribution of the %s against every enumerated sequence', (_name, spec) => {
  const stops = enumerateAllSequences(resolvePlan(spec).lines);
  const evaluator = createStoppingEvaluator(spec);
  const sideOf = (stop: (typeof stops)[number]): StagewiseSide =>
    stop.itemCount === spec.truncation ? StagewiseSide.truncation : stop.crossedLower ? StagewiseSide.accept : StagewiseSide.reject;

  it('has the same stopping points, decisions and probabilities at every quality tried', () => {
    for (const p of qualities) {
      const distribution = evaluator.distribution(p);
      expect(distribution.undecided).toBe(0);
      const found = new Map(distribution.points.map((point) => [`${point.itemCount}:${point.total}`, point]));
      expect(found.size).toBe(stops.length);
      for (const stop of stops) {
        const point = found.get(`${stop.itemCount}:${stop.total}`);
        expect(point, `point (${stop.itemCount}, ${stop.total})`).toBeDefined();
        expect(point!.decision).toBe(stop.decision);
        expect(point!.side).toBe(sideOf(stop));
        // Computed, independent method (enumeration): relative 1e-10, absolute 1e-15.
        expect(Math.abs(point!.probability - enumeratedProbability(stop, p))).toBeLessThanOrEqual(
          1e-10 * enumeratedProbability(stop, p) + 1e-15,
        );
      }
    }
  });

  it('gives the same stagewise tail probabilities for every observed point', () => {
    const tail = { below: 0, equal: 0, above: 0, meanNaive: 0, undecided: 0 };
    for (const p of [0.03, 0.15]) {
      for (const observed of stops) {
        evaluator.tail(p, sideOf(observed), observed.itemCount, observed.total, tail);
        const reference = enumeratedTails(stops, observed, p); // computed, independent method
        expect(tail.above + tail.equal).toBeCloseTo(reference.atLeast, 12);
        expect(tail.below + tail.equal).toBeCloseTo(reference.atMost, 12);
      }
    }
  });

  it('gives the same interval ends as bisection on the enumerated tails', () => {
    const gamma = 0.05;
    for (const observed of stops) {
      const result = stagewiseInference(evaluator, { n: observed.itemCount, total: observed.total }, 0.9);
      // Computed, independent method: the test's own bisection on the enumerated tails.
      const lower = bisect((p) => enumeratedTails(stops, observed, p).atLeast, gamma);
      const upper = bisect((p) => -enumeratedTails(stops, observed, p).atMost, -gamma);
      expect(result.lower).toBeCloseTo(lower, 8);
      expect(result.upper).toBeCloseTo(upper, 8);
      expect(result.lower).toBeLessThanOrEqual(result.medianUnbiased);
      expect(result.medianUnbiased).toBeLessThanOrEqual(result.upper);
    }
  });

  it('gives the mean of d/n as the enumerated sum', () => {
    for (const p of qualities) {
      const mean = stops.reduce((sum, stop) => sum + (enumeratedProbability(stop, p) * stop.total) / stop.itemCount, 0);
      const tail = evaluator.tail(p, StagewiseSide.accept, 0, 0);
      expect(tail.meanNaive).toBeCloseTo(mean, 12); // computed, independent method
    }
  });
});
