import jstatModule from 'jstat';
import { describe, expect, it } from 'vitest';
import {
  PlanParameterError,
  decideMeasurement,
  designMeasurementPlan,
  measurementLiveState,
  measurementPlan,
  measurementWaldPoint,
  SIEGMUND_RHO,
} from '../../src-main/engine/index.js';
import type { MeasurementSpec } from '../../src-main/engine/index.js';
import { normalCdf, normalQuantile } from '../../src-main/engine/distributions/normal.js';
import { seededRandom } from '../../src-main/engine/numerics/seededRandom.js';
import { normalFixedSample, normalWaldToFixedRatio } from '../reference/referenceValues.js';
import { waldOperatingPoint } from '../../src-main/engine/waldCurve.js';

// jstat ships no types; the one call these tests use.
const jstat = jstatModule as unknown as { normal: { cdf(x: number, mean: number, sd: number): number } };

const spec = (alpha: number, beta: number, delta: number, extra: Partial<MeasurementSpec> = {}): MeasurementSpec => ({
  model: 'measurement', mu0: 0, mu1: delta, sigma: 1, alpha, beta, ...extra,
});

/** Independent check: plain simulation of the measurement SPRT, LLR limits (lower, upper), sign rule at the truncation. */
function simulate(plan: ReturnType<typeof measurementPlan>, mu: number, runs: number, seed: number) {
  const random = seededRandom(seed);
  let accepted = 0;
  let total = 0;
  for (let run = 0; run < runs; run++) {
    let n = 0;
    let sum = 0;
    for (;;) {
      n++;
      sum += mu + plan.spec.sigma * random.normal();
      const { decision } = decideMeasurement(plan, n, sum);
      if (decision !== 'continue') {
        if (decision === 'accept') accepted++;
        break;
      }
    }
    total += n;
  }
  return { accept: accepted / runs, acceptError: Math.sqrt((accepted / runs) * (1 - accepted / runs) / runs), asn: total / runs };
}

describe('measurement model (normal mean, sigma known)', () => {
  it('decides the same on the same values in any order when their sum lies exactly on the truncation line', () => {
    const plan = measurementPlan({ model: 'measurement', mu0: 10, mu1: 11, sigma: 1, alpha: 0.1, beta: 0.1, truncation: 3 });
    // The decimals 10.3, 10.4, 10.8 sum to exactly 31.5 = 3 x (10 + 11)/2: LLR 0 accepts at the truncation.
    const oneOrder = 10.3 + 10.4 + 10.8;
    const otherOrder = 10.3 + 10.8 + 10.4;
    expect(oneOrder).not.toBe(otherOrder); // binary addition depends on the order
    expect(decideMeasurement(plan, 3, oneOrder)).toMatchObject({ decision: 'accept', rule: 'accept at truncation' });
    expect(decideMeasurement(plan, 3, otherOrder)).toMatchObject({ decision: 'accept', rule: 'accept at truncation' });
    // Well off the line, the order-free guard changes nothing: 31.5 + 1e-9 is above it.
    expect(decideMeasurement(plan, 3, 31.5 + 1e-9).decision).toBe('reject');
  });

  // normal SPRT by the Fredholm integral equation (computed independently): exact (Fredholm) and Siegmund-corrected columns; tolerances 1e-4 for
  // probabilities and 1e-3 relative for ASN, as the notes suggest for values.
  const rows: Array<[number, number, number, number, number, number, number, number]> = [
    // alpha, beta, delta, theta, exact OC, exact ASN, corrected OC, corrected ASN
    [0.05, 0.1, 1, 0, 0.97066, 5.565, 0.97075, 5.299],
    [0.05, 0.1, 1, 0.5, 0.55071, 10.091, 0.55067, 9.842],
    [0.05, 0.1, 1, 1, 0.05731, 6.492, 0.05706, 6.226],
    [0.05, 0.05, 1, 0, 0.97136, 6.92, 0.97145, 6.651],
    [0.05, 0.05, 1, 0.5, 0.5, 12.691, 0.5, 12.44],
    [0.05, 0.05, 0.5, 0, 0.96214, 24.186, 0.96216, 23.927],
    [0.01, 0.01, 0.5, 0, 0.9925, 38.766, 0.99251, 38.506],
  ];
  it.each(rows)('reproduces normal SPRT by the Fredholm integral equation (computed independently) exact and Siegmund-corrected OC/ASN (alpha %s, beta %s, delta %s, mu %s)', (alpha, beta, delta, mu, oc, asn, ocCorrected, asnCorrected) => {
    const design = designMeasurementPlan(spec(alpha, beta, delta), { curvePoints: 5 }); // mu = -d/2, 0, d/2, d, 3d/2
    const point = design.curve.find((p) => Math.abs(p.theta - mu) < 1e-12) ?? design.curve[0];
    expect(point.theta).toBeCloseTo(mu, 12);
    expect(point.ocExact).toBeCloseTo(oc, 4);
    expect(point.asnExact / asn).toBeCloseTo(1, 3);
    expect(point.ocCorrected).toBeCloseTo(ocCorrected, 4);
    expect(point.asnCorrected / asnCorrected).toBeCloseTo(1, 3);
  });

  it('checks the normal SPRT by the Fredholm integral equation (computed independently) exact OC at delta = 1 by a seeded simulation (normal SPRT by the Fredholm integral equation (computed independently) quotes 0.97133 +- 0.00026 from 4e5 runs)', () => {
    const plan = measurementPlan(spec(0.05, 0.05, 1));
    const design = designMeasurementPlan(spec(0.05, 0.05, 1), { curvePoints: 2 });
    const simulated = simulate(plan, 0, 60000, 17);
    expect(Math.abs(simulated.accept - (1 - design.exact.alpha))).toBeLessThan(4 * simulated.acceptError);
    expect(simulated.asn / design.exact.asnH0).toBeCloseTo(1, 1);
  });

  it('gives the fixed-sample n of normal SPRT by the Fredholm integral equation (computed independently) and Wald 1947 ASN against the fixed-sample n (computed independently): ((z_(1-alpha) + z_(1-beta))/delta)^2', () => {
    // Computed with normalFixedSampleSize (jStat.normal.inv, test/reference).
    for (const [alpha, beta, delta, n] of normalFixedSample) {
      expect(Math.abs(designMeasurementPlan(spec(alpha, beta, delta), { curvePoints: 2 }).single.exactN / n - 1)).toBeLessThan(5e-5); // half a unit of the written decimals
    }
    // Wald 1947 ASN against the fixed-sample n, computed with normalWaldAsnH0 (test/reference): 0.4897 for alpha = beta = 0.05.
    const design = designMeasurementPlan(spec(0.05, 0.05, 1), { curvePoints: 2 });
    expect(design.wald.asnH0 / design.single.exactN).toBeCloseTo(normalWaldToFixedRatio, 4);
  });

  it('uses Siegmund rho = -zeta(1/2)/sqrt(2 pi) = 0.58260 (Siegmund 1985 ch. 3 (from memory; rho computed from zeta(1/2)), computed)', () => {
    expect(SIEGMUND_RHO).toBeCloseTo(0.5826, 4);
  });

  it('with the overshoot correction, the exact risks come to nominal (Fredholm, and a seeded simulation)', () => {
    // Common practice, no source: the corrected limits aim at the nominal risks; Wald's plain limits give 0.029 (normal SPRT by the Fredholm integral equation (computed independently)).
    const corrected = spec(0.05, 0.05, 1, { overshootCorrection: true });
    const design = designMeasurementPlan(corrected, { curvePoints: 2 });
    expect(Math.abs(design.exact.alpha - 0.05)).toBeLessThan(0.003);
    expect(Math.abs(design.exact.beta - 0.05)).toBeLessThan(0.003);
    const simulated = simulate(measurementPlan(corrected), 0, 40000, 5);
    expect(Math.abs(1 - simulated.accept - design.exact.alpha)).toBeLessThan(4 * simulated.acceptError);
  });

  it('the truncated density recursion agrees with a seeded simulation of the truncated plan', () => {
    const truncated = spec(0.05, 0.1, 0.5, { truncation: 20 });
    const design = designMeasurementPlan(truncated, { curvePoints: 2 });
    const simulated = simulate(measurementPlan(truncated), 0.5, 40000, 9);
    expect(Math.abs(simulated.accept - design.exact.beta)).toBeLessThan(4 * simulated.acceptError);
    expect(simulated.asn / design.exact.asnH1).toBeCloseTo(1, 1);
    // A truncation far beyond the tail changes nothing: same as the untruncated integral equations.
    const far = designMeasurementPlan(spec(0.05, 0.1, 1, { truncation: 400 }), { curvePoints: 2 });
    expect(far.exact.alpha).toBeCloseTo(1 - 0.97066, 4);
  });

  it('Wald closed form equals the general root-finding solution of E[exp(h z)] = 1', () => {
    const plan = measurementPlan(spec(0.05, 0.1, 0.7));
    for (const mu of [-0.3, 0.1, 0.35, 0.6, 1.1]) {
      const m = plan.llrPerUnit * (mu - plan.midpoint);
      const s2 = plan.stepScale ** 2;
      const general = waldOperatingPoint({ mean: m, secondMoment: s2 + m * m, logMomentGenerating: (h) => h * m + 0.5 * h * h * s2 }, plan.lnA, plan.lnB);
      const closed = measurementWaldPoint(plan, mu, plan.lnA, plan.lnB);
      expect(closed.oc).toBeCloseTo(general.oc, 10);
      expect(closed.asn).toBeCloseTo(general.asn, 8);
    }
  });

  it('a rejectable mean below mu0 mirrors the plan (same risks, lines below)', () => {
    const up = designMeasurementPlan({ ...spec(0.05, 0.1, 1), mu0: 10, mu1: 11 }, { curvePoints: 2 });
    const down = designMeasurementPlan({ ...spec(0.05, 0.1, 1), mu0: 10, mu1: 9 }, { curvePoints: 2 });
    expect(down.boundaries.rejectWhen).toBe('below');
    expect(down.exact.alpha).toBeCloseTo(up.exact.alpha, 10);
    expect(down.exact.asnH1).toBeCloseTo(up.exact.asnH1, 8);
    // Mirrored about mu0 = 10 for one measurement.
    expect(down.limits[0].reject).toBeCloseTo(2 * 10 - up.limits[0].reject, 10);
  });

  it('the normal distribution function matches jstat to 1e-14 and the quantile inverts it', () => {
    for (let x = -8; x <= 8; x += 0.37) expect(Math.abs(normalCdf(x) - jstat.normal.cdf(x, 0, 1))).toBeLessThan(1e-14);
    for (const p of [1e-6, 0.01, 0.3, 0.9, 0.999]) expect(normalCdf(normalQuantile(p))).toBeCloseTo(p, 14);
  });

  it('linearCountLiveState reads the evidence (n, sum): decision, next-value thresholds and the look-ahead', () => {
    const plain = spec(0.05, 0.1, 1);
    const start = measurementLiveState(plain, 0, 0);
    const design = designMeasurementPlan(plain, { curvePoints: 2 });
    expect(start.probabilityAcceptH0).toBeCloseTo(1 - design.exact.alpha, 10);
    expect(start.expectedRemainingH1).toBeCloseTo(design.exact.asnH1, 8);
    // The next value at the threshold lands exactly on the line (Wald 1947 §3.1: on the line decides).
    const after = measurementLiveState(plain, 2, 1.2);
    expect(decideMeasurement(measurementPlan(plain), 3, 1.2 + (after.nextValueRejects as number)).decision).toBe('reject');
    expect(decideMeasurement(measurementPlan(plain), 3, 1.2 + (after.nextValueAccepts as number)).decision).toBe('accept');
    expect(measurementLiveState(plain, 3, 6).decision).toBe('reject');
    expect(measurementLiveState(plain, 3, 6).probabilityAcceptH0).toBe(0);
  });

  it.each([
    ['sigma', { sigma: 0 }, /sigma must be a number greater than 0/],
    ['mu1', { mu1: 0 }, /mu1 must differ from mu0/],
    ['truncation', { truncation: 0 }, /truncation must be an integer from 1 to 100000/],
    ['overshootCorrection', { mu1: 6, overshootCorrection: true }, /overshootCorrection would pull a limit past 0/],
  ])('rejects a bad %s with PlanParameterError naming it', (parameter, change, message) => {
    const call = () => measurementPlan({ ...spec(0.05, 0.1, 1), ...change } as MeasurementSpec);
    expect(call).toThrow(PlanParameterError);
    expect(call).toThrow(message);
  });
});
