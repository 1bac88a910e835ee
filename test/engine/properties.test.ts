import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  createExactEvaluator,
  createPlanEvaluator,
  designLinearCountPlan,
  resolvePlan,
  suggestedTruncation,
  waldPoint,
} from '../../src-main/engine/index.js';
import type { LinearCountSpec } from '../../src-main/engine/index.js';

// Plans kept small enough (p1/p0 >= 1.5, p0 >= 0.02) for fast exact runs.
const passFailSpec = fc
  .record({
    p0: fc.double({ min: 0.02, max: 0.3, noNaN: true }),
    ratio: fc.double({ min: 1.5, max: 3, noNaN: true }),
    alpha: fc.double({ min: 0.01, max: 0.25, noNaN: true }),
    beta: fc.double({ min: 0.01, max: 0.25, noNaN: true }),
  })
  .map(({ p0, ratio, alpha, beta }): LinearCountSpec => ({ model: 'passfail', p0, p1: Math.min(0.9, p0 * ratio), alpha, beta }));

const countSpec = fc
  .record({
    lambda0: fc.double({ min: 0.2, max: 3, noNaN: true }),
    ratio: fc.double({ min: 1.5, max: 3, noNaN: true }),
    alpha: fc.double({ min: 0.01, max: 0.25, noNaN: true }),
    beta: fc.double({ min: 0.01, max: 0.25, noNaN: true }),
  })
  .map(({ lambda0, ratio, alpha, beta }): LinearCountSpec => ({ model: 'count', lambda0, lambda1: lambda0 * ratio, alpha, beta }));

const anySpec = fc.oneof(passFailSpec, countSpec);

function hypotheses(spec: LinearCountSpec) {
  return resolvePlan(spec).model.hypotheses(spec);
}

/** Qualities from 0 to twice the rejectable one, kept inside the model's range (p <= 1). */
function qualityAt(spec: LinearCountSpec, fraction: number): number {
  return Math.min(resolvePlan(spec).model.qualityUpperLimit, 2 * hypotheses(spec).theta1 * fraction);
}

describe('properties of the exact plan', () => {
  it('the exact OC never rises as quality worsens, truncated or not', () => {
    fc.assert(
      fc.property(anySpec, fc.option(fc.integer({ min: 1, max: 300 }), { nil: null }), (spec, truncation) => {
        const evaluator = createPlanEvaluator({ ...spec, truncation });
        let previous = 1;
        for (let i = 0; i <= 20; i++) {
          const oc = evaluator.evaluate(qualityAt(spec, i / 20)).accept;
          expect(oc).toBeLessThanOrEqual(previous + 1e-12);
          previous = oc;
        }
      }),
      { numRuns: 60 },
    );
  });

  it("the untruncated plan's exact alpha + beta stays within nominal alpha + beta (Wald's bound)", () => {
    // Wald (1947) §3, from memory (from memory); Wald 1947 ch. 3 (from memory): alpha' + beta' <= alpha + beta. Common practice.
    fc.assert(
      fc.property(anySpec, (spec) => {
        const evaluator = createPlanEvaluator(spec);
        const { theta0, theta1 } = hypotheses(spec);
        const alpha = evaluator.evaluate(theta0).reject;
        const beta = evaluator.evaluate(theta1).accept;
        expect(alpha + beta).toBeLessThanOrEqual(spec.alpha + spec.beta + 1e-9);
        expect(alpha).toBeLessThanOrEqual(spec.alpha / (1 - spec.beta) + 1e-9);
        expect(beta).toBeLessThanOrEqual(spec.beta / (1 - spec.alpha) + 1e-9);
      }),
      { numRuns: 80 },
    );
  });

  it('accept, reject and undecided probabilities add up to 1', () => {
    fc.assert(
      fc.property(anySpec, fc.double({ min: 0, max: 1, noNaN: true }), (spec, fraction) => {
        const point = createPlanEvaluator(spec).evaluate(qualityAt(spec, fraction));
        expect(point.accept + point.reject + point.undecided).toBeCloseTo(1, 12);
        expect(point.undecided).toBeLessThan(1e-12);
      }),
      { numRuns: 60 },
    );
  });

  it("Wald's OC never rises as quality worsens", () => {
    fc.assert(
      fc.property(anySpec, (spec) => {
        const plan = resolvePlan(spec);
        let previous = 1;
        for (let i = 0; i <= 40; i++) {
          const oc = waldPoint(plan.model, spec, plan.lnA, plan.lnB, Math.min(0.999999, qualityAt(spec, i / 40))).oc;
          expect(oc).toBeLessThanOrEqual(previous + 1e-12);
          previous = oc;
        }
      }),
      { numRuns: 60 },
    );
  });

  it('the suggested truncation keeps both exact risks within 10% of nominal', () => {
    fc.assert(
      fc.property(anySpec, (spec) => {
        const plan = resolvePlan(spec);
        const { theta0, theta1 } = hypotheses(spec);
        const truncation = suggestedTruncation(plan.lines, plan.model.countStep, { theta0, theta1 }, spec);
        if (truncation === null) return;
        // Independent of the one-pass scan: evaluate the truncated plan directly.
        const truncated = createExactEvaluator({ ...plan.lines, truncation }, plan.model.countStep);
        expect(truncated.evaluate(theta0).reject).toBeLessThanOrEqual(1.1 * spec.alpha + 1e-12);
        expect(truncated.evaluate(theta1).accept).toBeLessThanOrEqual(1.1 * spec.beta + 1e-12);
        if (truncation > 1) {
          const shorter = createExactEvaluator({ ...plan.lines, truncation: truncation - 1 }, plan.model.countStep);
          const fails =
            shorter.evaluate(theta0).reject > 1.1 * spec.alpha || shorter.evaluate(theta1).accept > 1.1 * spec.beta;
          expect(fails).toBe(true);
        }
      }),
      { numRuns: 30 },
    );
  });

  it('the exact-risk fit meets both nominal risks without raising the larger ASN', () => {
    fc.assert(
      fc.property(anySpec, fc.option(fc.integer({ min: 20, max: 200 }), { nil: null }), (spec, truncation) => {
        const fitted = designLinearCountPlan({ ...spec, truncation, fit: 'exact' }, { curvePoints: 2 });
        const wald = designLinearCountPlan({ ...spec, truncation }, { curvePoints: 2 });
        if (!fitted.fit.feasible) {
          // Only a short truncation can make both risks unreachable; then Wald's lines are kept.
          expect(truncation).not.toBeNull();
          expect(fitted.fit.h1).toBe(wald.boundaries.h1);
          return;
        }
        expect(fitted.exact.alpha).toBeLessThanOrEqual(spec.alpha);
        expect(fitted.exact.beta).toBeLessThanOrEqual(spec.beta);
        if (wald.exact.alpha <= spec.alpha && wald.exact.beta <= spec.beta) {
          expect(Math.max(fitted.exact.asnH0, fitted.exact.asnH1)).toBeLessThanOrEqual(
            Math.max(wald.exact.asnH0, wald.exact.asnH1) + 1e-9,
          );
        }
      }),
      { numRuns: 15 },
    );
  });
});
