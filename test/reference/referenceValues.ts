/**
 * Check values the engine tests compare with, each set naming how it was computed. Every value here
 * is recomputed by test/reference/generateReferenceValues.ts (which does not use the engine) and
 * checked by referenceValues.test.ts at the precision it is written with, so any of them can be
 * re-derived: `npx tsx test/reference/generateReferenceValues.ts` prints them side by side.
 */
import {
  exactOcAsn,
  fixedDurationRisksOf,
  lifetimeLinesOf,
  lifetimeWaldTime,
  neutralQualityOf,
  normalFixedSampleSize,
  normalWaldAsnH0,
  waldAsnAllFailing,
  waldOcAsn,
} from './generateReferenceValues.js';
import type { ReferenceSpec } from './generateReferenceValues.js';

/** Inputs of the NIST/SEMATECH e-Handbook §6.2.6 example (first-hand). */
export const nistSpec = { model: 'passfail', p0: 0.01, p1: 0.1, alpha: 0.05, beta: 0.1 } as const;
/** Inputs of Montgomery's item-by-item example (Montgomery, Introduction to Statistical Quality Control, §15.5, from memory). */
export const montgomerySpec = { model: 'passfail', p0: 0.01, p1: 0.06, alpha: 0.05, beta: 0.1 } as const;
/** Count plans with no published example: lambda 1 -> 2 (alpha = beta = 0.1) and 0.5 -> 1 (alpha 0.05, beta 0.1). */
export const countSpecFirst = { model: 'count', lambda0: 1, lambda1: 2, alpha: 0.1, beta: 0.1 } as const;
export const countSpecSecond = { model: 'count', lambda0: 0.5, lambda1: 1, alpha: 0.05, beta: 0.1 } as const;

/** Exact OC and ASN of the untruncated NIST plan, computed with exactOcAsn(nistSpec, p). */
export const nistExactUntruncated: ReadonlyArray<readonly [quality: number, oc: number, asn: number]> = [
  [0.005, 0.9951, 27.09],
  [0.01, 0.97795, 30.213],
  [0.02, 0.8995, 35.67],
  [0.03, 0.7687, 38.77],
  [0.05, 0.4689, 37.12],
  [0.07, 0.2549, 30.83],
  [0.1, 0.09958, 22.369],
  [0.15, 0.0218, 14.33],
  [0.2, 0.0048, 10.35],
];
/** Exact OC and ASN of the untruncated NIST plan at p = s, computed with exactOcAsn(nistSpec, s). */
export const nistExactAtSlope = { oc: 0.61863, asn: 39.047 } as const;
/** True risks of the untruncated NIST plan: P(reject | p0) and P(accept | p1), computed with exactOcAsn (4 decimals). */
export const nistTrueRisks = { alpha: 0.022, beta: 0.0996 } as const;

/** Exact OC and ASN of the NIST plan truncated at 156 = 3 x 52, computed with exactOcAsn(nistSpec, p, 156). */
export const nistExactTruncated156: ReadonlyArray<readonly [quality: number, oc: number, asn: number]> = [
  [0.01, 0.97794, 30.209],
  [0.05, 0.4701, 36.94],
  [0.1, 0.09964, 22.366],
];
/** The same at p = s, computed with exactOcAsn(nistSpec, s, 156). */
export const nistExactTruncated156AtSlope = { oc: 0.61945, asn: 38.814 } as const;

/** Exact OC and ASN of the Montgomery plan, untruncated (truncation null) and truncated at 330, computed with exactOcAsn; quality 'slope' is p = s. */
export const montgomeryExact: ReadonlyArray<readonly [truncation: number | null, quality: number | 'slope', oc: number, asn: number]> = [
  [null, 0.01, 0.97142, 63.583],
  [null, 'slope', 0.60379, 86.435],
  [null, 0.06, 0.09892, 50.508],
  [330, 0.01, 0.97138, 63.57],
  [330, 'slope', 0.60412, 85.709],
  [330, 0.06, 0.09901, 50.496],
];

/** Exact OC and ASN of the two count plans at their hypotheses, computed with exactOcAsn. */
export const countExact: ReadonlyArray<readonly [plan: 'first' | 'second', rate: number, oc: number, asn: number]> = [
  ['first', 1, 0.94324, 7.3736],
  ['first', 2, 0.07592, 6.5947],
  ['second', 0.5, 0.96716, 14.8804],
  ['second', 1, 0.08251, 15.2471],
];

/** Wald's ASN at p0, at p = s and at p1, and the OC at p = s, computed with waldOcAsn. */
export const waldSpecialPoints: ReadonlyArray<readonly [plan: 'nist' | 'montgomery', asnH0: number, asnNeutral: number, asnH1: number, ocNeutral: number]> = [
  ['nist', 27.957, 29.65, 16.447, 0.56215],
  ['montgomery', 59.726, 70.075, 40.419, 0.56215],
];
/** Wald's ASN of the NIST plan at p = 0 and as p -> 1, computed with waldOcAsn(nistSpec, 0) and waldAsnAllFailing(nistSpec). */
export const nistWaldAsnLimits = { atZero: 23.621, allFailing: 1.2553 } as const;
/** Wald's OC and ASN of the NIST plan, printed to 4 decimals (OC) and 2 (ASN), computed with waldOcAsn(nistSpec, p). */
export const nistWaldColumns: ReadonlyArray<readonly [quality: number, oc: number, asn: number]> = [
  [0.005, 0.984, 26.04],
  [0.02, 0.8415, 30.34],
  [0.03, 0.7019, 30.75],
  [0.05, 0.4305, 27.53],
  [0.07, 0.2432, 22.6],
  [0.15, 0.023, 10.49],
  [0.2, 0.0052, 7.45],
];
/** Wald's ASN of the two count plans at their hypotheses, computed with waldOcAsn. */
export const countWaldAsn: ReadonlyArray<readonly [plan: 'first' | 'second', rate: number, asn: number]> = [
  ['first', 1, 5.728],
  ['first', 2, 4.55],
  ['second', 0.5, 12.998],
  ['second', 1, 12.303],
];

/**
 * MIL-HDBK-781A fixed-duration test plans (table from memory): discrimination ratio d, test time in
 * units of theta1, accept with at most c failures; the true risks in percent, computed with
 * fixedDurationRisksOf (jStat.poisson.cdf).
 */
export const fixedDurationPlans: ReadonlyArray<readonly [plan: string, discrimination: number, time: number, acceptFailures: number, alphaPercent: number, betaPercent: number]> = [
  ['IX-D', 1.5, 45.0, 36, 11.96, 9.94],
  ['XII-D', 2.0, 18.8, 13, 9.58, 10.62],
  ['XV-D', 3.0, 9.3, 5, 9.43, 9.86],
  ['XXI-D', 3.0, 1.1, 0, 30.7, 33.29],
];

/** Lifetime lines in units of theta1 (d, alpha = beta, accept time at 0 failures, time per failure, first rejecting failure count), computed with lifetimeLinesOf. */
export const lifetimeLines: ReadonlyArray<readonly [discrimination: number, risk: number, acceptAtZero: number, timePerFailure: number, firstReject: number]> = [
  [1.5, 0.1, 6.5917, 1.2164, 6],
  [2, 0.1, 4.3944, 1.3863, 4],
  [3, 0.1, 3.2958, 1.6479, 3],
  [2, 0.2, 2.7726, 1.3863, 3],
];

/**
 * Lifetime plans (d, alpha = beta): exact P(accept) and E[T] at theta0 and theta1 (units of theta1)
 * from a recursion over failures on a time grid with Richardson extrapolation, computed
 * independently, stated tolerance +-2e-4 and +-0.02 (not re-derived here: the generator has no
 * continuous-time recursion); Wald's E[T] columns computed with lifetimeWaldTime.
 */
export const lifetimeExactAndWald: ReadonlyArray<
  readonly [discrimination: number, risk: number, oc0: number, time0: number, waldTime0: number, oc1: number, time1: number, waldTime1: number]
> = [
  [2, 0.1, 0.9207, 11.94, 11.457, 0.1023, 10.18, 9.101],
  [1.5, 0.1, 0.9128, 28.6, 27.891, 0.1014, 26.02, 24.369],
  [3, 0.1, 0.9313, 6.23, 5.85, 0.1035, 4.875, 4.069],
  [2, 0.2, 0.8439, 5.99, 5.421, 0.211, 5.16, 4.306],
];

/** Normal fixed-sample n (alpha, beta, shift in sigmas, n), computed with normalFixedSampleSize (jStat.normal.inv). */
export const normalFixedSample: ReadonlyArray<readonly [alpha: number, beta: number, delta: number, n: number]> = [
  [0.05, 0.1, 1, 8.564],
  [0.01, 0.01, 0.5, 86.59],
];
/** Wald's E_0(N) over the fixed-sample n at alpha = beta = 0.05, computed with normalWaldAsnH0 / normalFixedSampleSize. */
export const normalWaldToFixedRatio = 0.4897;

/** One held value and how to recompute it. */
export interface ReferenceValue {
  label: string;
  held: number;
  /** Decimals the value is written with; the recomputed value must round to it (within half a unit). */
  decimals: number;
  compute(): number;
}

export interface ReferenceSet {
  name: string;
  source: string;
  values: ReferenceValue[];
}

/** Decimals of a value as written in source (0.0996 -> 4); `written` overrides where a trailing zero was dropped. */
function decimalsOf(value: number, written?: number): number {
  if (written !== undefined) return written;
  const text = String(value);
  const point = text.indexOf('.');
  return point < 0 ? 0 : text.length - point - 1;
}

function value(label: string, held: number, compute: () => number, written?: number): ReferenceValue {
  return { label, held, decimals: decimalsOf(held, written), compute };
}

const specs: Record<string, ReferenceSpec> = {
  nist: nistSpec,
  montgomery: montgomerySpec,
  first: countSpecFirst,
  second: countSpecSecond,
};

/** Every set of held values, with its recomputation. */
export const referenceSets: ReferenceSet[] = [
  {
    name: 'NIST plan, untruncated: exact OC and ASN',
    source: 'computed with exactOcAsn (plain recursion over every count, Kahan sums)',
    values: [
      ...nistExactUntruncated.flatMap(([p, oc, asn]) => [
        value(`OC at p = ${p}`, oc, () => exactOcAsn(nistSpec, p).oc),
        value(`ASN at p = ${p}`, asn, () => exactOcAsn(nistSpec, p).asn),
      ]),
      value('OC at p = s', nistExactAtSlope.oc, () => exactOcAsn(nistSpec, neutralQualityOf(nistSpec)).oc),
      value('ASN at p = s', nistExactAtSlope.asn, () => exactOcAsn(nistSpec, neutralQualityOf(nistSpec)).asn),
      value('true alpha', nistTrueRisks.alpha, () => exactOcAsn(nistSpec, nistSpec.p0).reject, 4),
      value('true beta', nistTrueRisks.beta, () => exactOcAsn(nistSpec, nistSpec.p1).oc),
    ],
  },
  {
    name: 'NIST plan truncated at 156: exact OC and ASN',
    source: 'computed with exactOcAsn(..., 156)',
    values: [
      ...nistExactTruncated156.flatMap(([p, oc, asn]) => [
        value(`OC at p = ${p}`, oc, () => exactOcAsn(nistSpec, p, 156).oc),
        value(`ASN at p = ${p}`, asn, () => exactOcAsn(nistSpec, p, 156).asn),
      ]),
      value('OC at p = s', nistExactTruncated156AtSlope.oc, () => exactOcAsn(nistSpec, neutralQualityOf(nistSpec), 156).oc),
      value('ASN at p = s', nistExactTruncated156AtSlope.asn, () => exactOcAsn(nistSpec, neutralQualityOf(nistSpec), 156).asn),
    ],
  },
  {
    name: 'Montgomery plan, untruncated and truncated at 330: exact OC and ASN',
    source: 'computed with exactOcAsn',
    values: montgomeryExact.flatMap(([truncation, quality, oc, asn]) => {
      const p = quality === 'slope' ? neutralQualityOf(montgomerySpec) : quality;
      const where = `p = ${quality === 'slope' ? 's' : quality}, truncation ${truncation ?? 'none'}`;
      return [
        value(`OC at ${where}`, oc, () => exactOcAsn(montgomerySpec, p, truncation).oc),
        value(`ASN at ${where}`, asn, () => exactOcAsn(montgomerySpec, p, truncation).asn),
      ];
    }),
  },
  {
    name: 'Count plans: exact OC and ASN',
    source: 'computed with exactOcAsn (Poisson steps from jStat.poisson.pdf)',
    values: countExact.flatMap(([plan, rate, oc, asn]) => [
      value(`${plan} plan, OC at lambda = ${rate}`, oc, () => exactOcAsn(specs[plan], rate).oc),
      value(`${plan} plan, ASN at lambda = ${rate}`, asn, () => exactOcAsn(specs[plan], rate).asn),
    ]),
  },
  {
    name: "Wald's OC and ASN",
    source: 'computed with waldOcAsn (Wald 1947 §3.2, §3.3 formulas, h by bisection)',
    values: [
      ...waldSpecialPoints.flatMap(([plan, asnH0, asnNeutral, asnH1, ocNeutral]) => {
        const spec = specs[plan] as ReferenceSpec & { model: 'passfail' };
        return [
          value(`${plan}: ASN at p0`, asnH0, () => waldOcAsn(spec, spec.p0).asn),
          value(`${plan}: ASN at p = s`, asnNeutral, () => waldOcAsn(spec, neutralQualityOf(spec)).asn),
          value(`${plan}: ASN at p1`, asnH1, () => waldOcAsn(spec, spec.p1).asn),
          value(`${plan}: OC at p = s`, ocNeutral, () => waldOcAsn(spec, neutralQualityOf(spec)).oc),
        ];
      }),
      value('nist: ASN at p = 0', nistWaldAsnLimits.atZero, () => waldOcAsn(nistSpec, 0).asn),
      value('nist: ASN as p -> 1', nistWaldAsnLimits.allFailing, () => waldAsnAllFailing(nistSpec)),
      ...nistWaldColumns.flatMap(([p, oc, asn]) => [
        value(`nist: OC at p = ${p}`, oc, () => waldOcAsn(nistSpec, p).oc, 4),
        value(`nist: ASN at p = ${p}`, asn, () => waldOcAsn(nistSpec, p).asn, 2),
      ]),
      ...countWaldAsn.map(([plan, rate, asn]) => value(`${plan} count plan: ASN at lambda = ${rate}`, asn, () => waldOcAsn(specs[plan], rate).asn, 3)),
    ],
  },
  {
    name: 'Lifetime plans: lines and Wald expected test time (units of theta1)',
    source: 'computed with lifetimeLinesOf and lifetimeWaldTime (the failure process as a count plan per unit time)',
    values: [
      ...lifetimeLines.flatMap(([d, risk, acceptAtZero, timePerFailure, firstReject]) => [
        value(`d = ${d}, risk ${risk}: accept time at 0 failures`, acceptAtZero, () => lifetimeLinesOf(d, risk).acceptAtZero),
        value(`d = ${d}, risk ${risk}: time per failure`, timePerFailure, () => lifetimeLinesOf(d, risk).timePerFailure),
        value(`d = ${d}, risk ${risk}: first rejecting failure count`, firstReject, () => lifetimeLinesOf(d, risk).firstReject),
      ]),
      ...lifetimeExactAndWald.flatMap(([d, risk, , , waldTime0, , , waldTime1]) => [
        value(`d = ${d}, risk ${risk}: Wald E[T] at theta0`, waldTime0, () => lifetimeWaldTime(d, risk, false)),
        value(`d = ${d}, risk ${risk}: Wald E[T] at theta1`, waldTime1, () => lifetimeWaldTime(d, risk, true)),
      ]),
    ],
  },
  {
    name: 'Normal plans: fixed-sample n and Wald ratio',
    source: 'computed with normalFixedSampleSize (jStat.normal.inv) and normalWaldAsnH0',
    values: [
      ...normalFixedSample.map(([alpha, beta, delta, n]) => value(`n for alpha ${alpha}, beta ${beta}, delta ${delta}`, n, () => normalFixedSampleSize(alpha, beta, delta))),
      value('E_0(N)/n at alpha = beta = 0.05, delta 1', normalWaldToFixedRatio, () => normalWaldAsnH0(0.05, 0.05, 1) / normalFixedSampleSize(0.05, 0.05, 1)),
    ],
  },
  {
    name: 'MIL-HDBK-781A fixed-duration plans: true risks in percent',
    source: 'computed with fixedDurationRisksOf (jStat.poisson.cdf)',
    values: fixedDurationPlans.flatMap(([plan, d, time, c, alphaPercent, betaPercent]) => [
      value(`${plan}: alpha %`, alphaPercent, () => 100 * fixedDurationRisksOf(d, time, c).alpha),
      value(`${plan}: beta %`, betaPercent, () => 100 * fixedDurationRisksOf(d, time, c).beta),
    ]),
  },
];
