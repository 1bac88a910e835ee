import jstatModule from 'jstat';
import { describe, expect, it } from 'vitest';
import {
  PlanParameterError,
  decideLifetime,
  designLifetimePlan,
  fixedDurationRisks,
  lifetimeBoundaries,
  lifetimeLiveState,
  lifetimePlan,
} from '../../src-main/engine/index.js';
import type { LifetimeSpec } from '../../src-main/engine/index.js';
import { seededRandom } from '../../src-main/engine/numerics/seededRandom.js';
import { fixedDurationPlans, lifetimeExactAndWald, lifetimeLines } from '../reference/referenceValues.js';

// jstat ships no types; the one call these tests use.
const jstat = jstatModule as unknown as { poisson: { cdf(k: number, mean: number): number } };

const spec = (d: number, risk: number, extra: Partial<LifetimeSpec> = {}): LifetimeSpec => ({
  model: 'lifetime', theta0: d, theta1: 1, alpha: risk, beta: risk, ...extra,
});

/** Independent check: simulate the failure process entry by entry through decideLifetime. */
function simulate(s: LifetimeSpec, theta: number, runs: number, seed: number) {
  const plan = lifetimePlan(s);
  const random = seededRandom(seed);
  let accepted = 0;
  let timeSum = 0;
  for (let run = 0; run < runs; run++) {
    let time = 0;
    let failures = 0;
    for (;;) {
      const next = time + theta * random.exponential();
      // Time runs on to the next failure; the test may accept (or reach its maximum time) first.
      const acceptAt = (failures * plan.llrPerFailure - plan.lnB) / plan.llrPerTime;
      const stop = Math.min(acceptAt, plan.maxTime ?? Infinity);
      if (next >= stop) {
        time = stop;
        if (decideLifetime(plan, time, failures).decision === 'accept') accepted++;
        break;
      }
      time = next;
      failures++;
      const state = decideLifetime(plan, time, failures);
      if (state.decision !== 'continue') {
        if (state.decision === 'accept') accepted++;
        break;
      }
    }
    timeSum += time;
  }
  const accept = accepted / runs;
  return { accept, acceptError: Math.sqrt((accept * (1 - accept)) / runs), expectedTime: timeSum / runs };
}

describe('lifetime model (exponential MTBF)', () => {
  // Epstein and Sobel 1955 lines, computed with lifetimeLinesOf (test/reference); times in units of theta1.
  it.each(lifetimeLines)('reproduces the Epstein and Sobel 1955 lines (computed independently) lines for d = %s, alpha = beta = %s', (d, risk, acceptAtZero, slope, firstReject) => {
    const b = lifetimeBoundaries(lifetimePlan(spec(d, risk)));
    expect(b.acceptTimeAtZero).toBeCloseTo(acceptAtZero, 4);
    expect(b.timePerFailure).toBeCloseTo(slope, 4);
    expect(b.firstRejectFailures).toBe(firstReject);
  });

  it('lists no reject time past the maximum test time and ends the limits table at the failure count that always rejects', () => {
    // d = 2 in unit-hours (theta0 1000, theta1 500), alpha = beta = 0.1, T = 1000: reject time at r failures is
    // 693.1 r - 2197 (hand computation), so failure 4 rejects until 575.4 and failure 5 at any time up to 1000.
    const design = designLifetimePlan({ model: 'lifetime', theta0: 1000, theta1: 500, alpha: 0.1, beta: 0.1, maxTime: 1000 });
    expect(design.limits.map((row) => row.failures)).toEqual([0, 1, 2, 3, 4, 5]);
    for (const row of design.limits) {
      if (row.rejectTime !== null) expect(row.rejectTime).toBeLessThanOrEqual(1000);
      if (row.acceptTime !== null) expect(row.acceptTime).toBeLessThanOrEqual(1000);
    }
    expect(design.limits[4].rejectTime).toBeCloseTo(575.4, 1);
    expect(design.limits[5].rejectTime).toBe(1000);
  });

  it('states the truncation rule with "at most 1 failure" in the singular', () => {
    // Accept at T = 1000 iff r <= floor(1000 x (1/500 - 1/1000)/ln 2) = floor(1.44) = 1 (hand computation).
    const design = designLifetimePlan({ model: 'lifetime', theta0: 1000, theta1: 500, alpha: 0.1, beta: 0.1, maxTime: 1000 });
    expect(design.truncationRule).toContain('accept with at most 1 failure (LLR <= 0)');
  });

  it('matches the MIL-HDBK-781A PRST accept times at zero failures (from memory, low confidence: +-0.05 theta1)', () => {
    // Epstein and Sobel 1955 lines (computed independently) (from memory): plans I-D, III-D, V-D (10/10 %, d = 1.5, 2, 3) accept at about 6.6, 4.40, 3.30.
    expect(Math.abs(lifetimeBoundaries(lifetimePlan(spec(1.5, 0.1))).acceptTimeAtZero - 6.6)).toBeLessThan(0.05);
    expect(Math.abs(lifetimeBoundaries(lifetimePlan(spec(2, 0.1))).acceptTimeAtZero - 4.4)).toBeLessThan(0.05);
    expect(Math.abs(lifetimeBoundaries(lifetimePlan(spec(3, 0.1))).acceptTimeAtZero - 3.3)).toBeLessThan(0.05);
  });

  // Exact columns: a recursion over failures on a time grid with Richardson extrapolation, computed independently
  // (stated tolerance +-2e-4 in P(accept), +-0.02 theta1 in E[T]); Wald columns computed with lifetimeWaldTime (test/reference).
  it.each(lifetimeExactAndWald)('reproduces exact recursion over failures (computed independently by a time grid) exact and Wald OC and E[T] for d = %s, alpha = beta = %s', (d, risk, oc0, time0, waldTime0, oc1, time1, waldTime1) => {
    const design = designLifetimePlan(spec(d, risk), { curvePoints: 2 });
    expect(Math.abs(1 - design.exact.alpha - oc0)).toBeLessThanOrEqual(2e-4);
    expect(Math.abs(design.exact.expectedTimeH0 - time0)).toBeLessThanOrEqual(0.02);
    expect(Math.abs(design.exact.beta - oc1)).toBeLessThanOrEqual(2e-4);
    expect(Math.abs(design.exact.expectedTimeH1 - time1)).toBeLessThanOrEqual(0.02);
    expect(design.wald.expectedTimeH0).toBeCloseTo(waldTime0, 3);
    expect(design.wald.expectedTimeH1).toBeCloseTo(waldTime1, 3);
    expect(design.exact.undecided).toBeLessThan(1e-11);
  });

  it('gives the exact recursion over failures (computed independently by a time grid) KL rates per theta1 of test time: ln d + 1/d - 1 and (d - 1 - ln d)/d', () => {
    const design = designLifetimePlan(spec(2, 0.1), { curvePoints: 2 });
    expect(design.kl.h1h0).toBeCloseTo(0.19315, 5);
    expect(design.kl.h0h1).toBeCloseTo(0.15343, 5);
    expect(design.klPerLifetime.h0h1).toBeCloseTo(0.30685, 5);
  });

  it('the exact recursion agrees with a seeded simulation of a plan truncated by time and failures', () => {
    const truncated = spec(2, 0.1, { maxTime: 9, maxFailures: 8 });
    const design = designLifetimePlan(truncated, { curvePoints: 3 });
    const theta = design.curve[1].theta;
    const simulated = simulate(truncated, theta, 40000, 3);
    expect(Math.abs(simulated.accept - design.curve[1].ocExact)).toBeLessThan(4 * simulated.acceptError);
    expect(simulated.expectedTime / design.curve[1].expectedTimeExact).toBeCloseTo(1, 1);
    expect(design.exact.undecided).toBeLessThan(1e-12);
  });

  it('reproduces the recomputed true risks of the MIL-HDBK-781A fixed-duration plans (MIL-HDBK-781A fixed-duration plans (table from memory, risks computed with a Poisson CDF): table (from memory), risks)', () => {
    // plan, d, T (theta1), accept <= c, alpha' %, beta' %: risks computed with fixedDurationRisksOf (jStat.poisson.cdf, test/reference).
    for (const [, d, time, c, alpha, beta] of fixedDurationPlans) {
      const risks = fixedDurationRisks(d, 1, time, c);
      expect(100 * risks.alpha).toBeCloseTo(alpha, 1);
      expect(100 * risks.beta).toBeCloseTo(beta, 1);
      // The Poisson CDF itself against jstat (a general-purpose stats library).
      expect(risks.beta).toBeCloseTo(jstat.poisson.cdf(c, time), 10);
    }
  });

  it('the designed fixed-duration test meets both OC points and is shortest: one failure fewer cannot', () => {
    const design = designLifetimePlan(spec(2, 0.1), { curvePoints: 2 });
    const { time, acceptFailures } = design.single;
    expect(design.single.alpha).toBeLessThanOrEqual(0.1);
    expect(design.single.beta).toBeLessThanOrEqual(0.1 + 1e-12);
    // Common practice, no source: with c - 1 the time meeting beta fails alpha.
    expect(fixedDurationRisks(2, 1, time, acceptFailures - 1).beta).toBeLessThan(0.1);
    expect(fixedDurationRisks(2, 1, time * 0.999, acceptFailures).beta).toBeGreaterThan(0.1);
  });

  it('linearCountLiveState at (T, r) continues the same test: from (0, 0) it equals the design, and it is memoryless', () => {
    const s = spec(2, 0.1);
    const design = designLifetimePlan(s, { curvePoints: 2 });
    const start = lifetimeLiveState(s, 0, 0);
    expect(start.probabilityAcceptH0).toBeCloseTo(1 - design.exact.alpha, 10); // both stop at 1e-12 undecided
    expect(start.timeToAccept).toBeCloseTo(4.3944, 4);
    expect(start.failuresToReject).toBe(4);
    // Law of total probability over the first event (Wald 1947 §3.1, a consequence, no table):
    // P(acc) = e^{-a0/theta} + int_0^a0 e^{-t/theta}/theta P(acc | (t, 1)) dt, by Simpson's rule.
    const a0 = 4.394449154672438;
    const m = 40;
    let integral = 0;
    for (let i = 0; i <= m; i++) {
      const t = (a0 * i) / m;
      const weight = i === 0 || i === m ? 1 : i % 2 === 1 ? 4 : 2;
      integral += weight * Math.exp(-t / 2) / 2 * lifetimeLiveState(s, t, 1).probabilityAcceptH0;
    }
    expect(Math.exp(-a0 / 2) + (integral * a0) / (3 * m)).toBeCloseTo(1 - design.exact.alpha, 6);
  });

  it.each([
    ['theta1', { theta1: 3 }, /theta1 must be less than theta0/],
    ['maxTime', { maxTime: -1 }, /maxTime must be a number greater than 0/],
    ['maxFailures', { maxFailures: 1.5 }, /maxFailures must be an integer from 1 to 10000 or none/],
  ])('rejects a bad %s with PlanParameterError naming it', (_, change, message) => {
    const call = () => lifetimePlan({ ...spec(2, 0.1), ...change } as LifetimeSpec);
    expect(call).toThrow(PlanParameterError);
    expect(call).toThrow(message);
  });
});
