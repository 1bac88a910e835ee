/**
 * Recomputes the check values the engine tests compare with, independently of the engine: nothing
 * here imports src-main. Probabilities of counts come from jstat 1.9.6 (a general-purpose statistics
 * library in devDependencies); recursions and sums are written out plainly, with compensated (Kahan)
 * summation, over every count, with no banding and no early exits beyond a stated remainder.
 *
 * Run `npx tsx test/reference/generateReferenceValues.ts` to print every value beside the one the
 * tests hold (test/reference/referenceValues.ts); test/reference/referenceValues.test.ts runs the same
 * functions and compares, two-sided, at the precision each value is printed with.
 */
import jStatModule from 'jstat';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

// jstat ships no types; the calls used here.
const jStat = jStatModule as unknown as {
  binomial: { cdf(k: number, n: number, p: number): number };
  normal: { inv(p: number, mean: number, sd: number): number };
  poisson: { pdf(k: number, rate: number): number; cdf(k: number, rate: number): number };
};

export type ReferenceSpec =
  | { model: 'passfail'; p0: number; p1: number; alpha: number; beta: number }
  | { model: 'count'; lambda0: number; lambda1: number; alpha: number; beta: number };

/** Compensated sum, so millions of small probabilities add up without drift (Kahan 1965). */
class KahanSum {
  private sum = 0;
  private carry = 0;
  add(x: number): void {
    const y = x - this.carry;
    const t = this.sum + y;
    this.carry = t - this.sum - y;
    this.sum = t;
  }
  get value(): number {
    return this.sum;
  }
}

/** ln A and ln B of Wald's limits: A = (1 - beta)/alpha, B = beta/(1 - alpha) (Wald 1947 §3.2). */
function waldLimits(spec: ReferenceSpec): { lnA: number; lnB: number } {
  return { lnA: Math.log((1 - spec.beta) / spec.alpha), lnB: Math.log(spec.beta / (1 - spec.alpha)) };
}

/**
 * LLR per nonconforming item (or per count) k and per item (or unit) offset c: LLR = k d - c n.
 * Pass/fail: k = ln(p1 q0/(p0 q1)), c = ln(q0/q1); count: k = ln(lambda1/lambda0), c = lambda1 - lambda0.
 */
function llrParts(spec: ReferenceSpec): { perCount: number; perItem: number } {
  if (spec.model === 'passfail') {
    const q0 = 1 - spec.p0;
    const q1 = 1 - spec.p1;
    return { perCount: Math.log((spec.p1 * q0) / (spec.p0 * q1)), perItem: Math.log(q0 / q1) };
  }
  return { perCount: Math.log(spec.lambda1 / spec.lambda0), perItem: spec.lambda1 - spec.lambda0 };
}

/**
 * The lines d = s n - h1 (accept on or below) and d = s n + h2 (reject on or above):
 * h1 = -ln B/k, h2 = ln A/k, s = c/k (NIST/SEMATECH e-Handbook §6.2.6, first-hand, for pass/fail).
 */
export function referenceLines(spec: ReferenceSpec): { h1: number; h2: number; slope: number } {
  const { lnA, lnB } = waldLimits(spec);
  const { perCount, perItem } = llrParts(spec);
  return { h1: -lnB / perCount, h2: lnA / perCount, slope: perItem / perCount };
}

/**
 * Exact OC, P(reject) and ASN of the integer plan at `quality`, optionally truncated (at n_t accept
 * iff d <= floor(s n_t)).
 *
 * Method: m_n(d) = P(undecided, count d after n items) over every d from 0 to the largest reachable;
 * each step convolves with the step law (Bernoulli(p), or Poisson(lambda) from jStat.poisson.pdf,
 * jumps while jStat.poisson.cdf leaves more than 1e-18), then removes d <= floor(s n - h1) as accepted
 * and d >= ceil(s n + h2) as rejected. Untruncated runs stop when the undecided mass is below 1e-15.
 */
export function exactOcAsn(spec: ReferenceSpec, quality: number, truncation: number | null = null): { oc: number; reject: number; asn: number } {
  const { h1, h2, slope } = referenceLines(spec);
  const stepLaw: number[] = [];
  if (spec.model === 'passfail') stepLaw.push(1 - quality, quality);
  else for (let j = 0; j === 0 || 1 - jStat.poisson.cdf(j - 1, quality) > 1e-18; j++) stepLaw.push(jStat.poisson.pdf(j, quality));
  let mass = [1];
  const accepted = new KahanSum();
  const rejected = new KahanSum();
  const asn = new KahanSum();
  for (let n = 1; ; n++) {
    const next = new Array<number>(mass.length + stepLaw.length - 1).fill(0);
    for (let d = 0; d < mass.length; d++) {
      if (mass[d] === 0) continue;
      for (let j = 0; j < stepLaw.length; j++) next[d + j] += mass[d] * stepLaw[j];
    }
    mass = next;
    const acceptUpTo = Math.floor(slope * n - h1);
    const rejectFrom = Math.ceil(slope * n + h2);
    const atTruncation = truncation !== null && n === truncation;
    let undecided = new KahanSum();
    for (let d = 0; d < mass.length; d++) {
      if (mass[d] === 0) continue;
      let decision: 'accept' | 'reject' | null = d <= acceptUpTo ? 'accept' : d >= rejectFrom ? 'reject' : null;
      if (decision === null && atTruncation) decision = d <= Math.floor(slope * n) ? 'accept' : 'reject';
      if (decision === null) {
        undecided.add(mass[d]);
        continue;
      }
      (decision === 'accept' ? accepted : rejected).add(mass[d]);
      asn.add(n * mass[d]);
      mass[d] = 0;
    }
    if (atTruncation || undecided.value < 1e-15) break;
    undecided = new KahanSum();
  }
  return { oc: accepted.value, reject: rejected.value, asn: asn.value };
}

/** ln E_theta[e^{h z}] of one item's (unit's) LLR increment z. */
function logMomentGenerating(spec: ReferenceSpec, quality: number, h: number): number {
  const { perCount, perItem } = llrParts(spec);
  if (spec.model === 'passfail') {
    // z = k x - c with x ~ Bernoulli(p): E[e^{hz}] = e^{-hc} (q + p e^{hk}).
    return -h * perItem + Math.log(1 - quality + quality * Math.exp(h * perCount));
  }
  // z = k x - c with x ~ Poisson(lambda): ln E[e^{hz}] = lambda (e^{hk} - 1) - h c.
  return quality * Math.expm1(h * perCount) - h * perItem;
}

/**
 * Wald's approximate OC and ASN at `quality` (Wald, A. (1947), Sequential Analysis, §3.2 and §3.3,
 * from memory): h != 0 solves E[e^{hz}] = 1, found here by plain bisection on the sign of
 * ln E[e^{hz}] over a bracket doubled until the sign changes; OC = (A^h - 1)/(A^h - B^h); ASN =
 * (OC ln B + (1 - OC) ln A)/E[z]. Where E[z] = 0: OC = ln A/(ln A - ln B), ASN = -ln A ln B/E[z^2].
 * At p = 0 (no root) OC = 1 and ASN = ln B/E[z].
 */
export function waldOcAsn(spec: ReferenceSpec, quality: number): { oc: number; asn: number } {
  const { lnA, lnB } = waldLimits(spec);
  const { perCount, perItem } = llrParts(spec);
  const mean = quality * perCount - perItem;
  const variance = spec.model === 'passfail' ? quality * (1 - quality) * perCount * perCount : quality * perCount * perCount;
  if (Math.abs(mean) < 1e-12) return { oc: lnA / (lnA - lnB), asn: (-lnA * lnB) / (variance + mean * mean) };
  if (spec.model === 'passfail' && quality === 0) return { oc: 1, asn: lnB / mean };
  const side = mean < 0 ? 1 : -1;
  let outside = side;
  while (!(logMomentGenerating(spec, quality, outside) > 0)) outside *= 2;
  let inside = 0;
  for (let i = 0; i < 2000; i++) {
    const middle = (inside + outside) / 2;
    if (middle === inside || middle === outside) break;
    if (logMomentGenerating(spec, quality, middle) > 0) outside = middle;
    else inside = middle;
  }
  const h = (inside + outside) / 2;
  const oc = (Math.exp(h * lnA) - 1) / (Math.exp(h * lnA) - Math.exp(h * lnB));
  return { oc, asn: (oc * lnB + (1 - oc) * lnA) / mean };
}

/** Wald's ASN as p -> 1 for a pass/fail plan: every item fails, ASN = ln A/(k - c). */
export function waldAsnAllFailing(spec: ReferenceSpec & { model: 'passfail' }): number {
  const { lnA } = waldLimits(spec);
  const { perCount, perItem } = llrParts(spec);
  return lnA / (perCount - perItem);
}

/** The quality where E[z] = 0, the slope s of the lines (Wald 1947 §3.3, from memory). */
export function neutralQualityOf(spec: ReferenceSpec): number {
  return referenceLines(spec).slope;
}

/**
 * True risks of a fixed-duration test: run for `time` (in units of theta1), accept iff failures <= c;
 * failures ~ Poisson(time/theta) (Epstein, B. (1960), Technometrics 2(4), from memory), by jStat.poisson.cdf.
 */
export function fixedDurationRisksOf(discrimination: number, time: number, acceptFailures: number): { alpha: number; beta: number } {
  return {
    alpha: 1 - jStat.poisson.cdf(acceptFailures, time / discrimination),
    beta: jStat.poisson.cdf(acceptFailures, time),
  };
}

/**
 * A lifetime plan (exponential MTBF, discrimination d = theta0/theta1, time in units of theta1) as the
 * count plan of its Poisson failure process per unit time: failure rate 1/d under H0 and 1 under H1,
 * so LLR = r ln d - T (1 - 1/d) (Epstein, B. and Sobel, M. (1955), from memory).
 */
export function lifetimeAsCountSpec(discrimination: number, risk: number): ReferenceSpec {
  return { model: 'count', lambda0: 1 / discrimination, lambda1: 1, alpha: risk, beta: risk };
}

/**
 * Lifetime lines: accept time at 0 failures h1/s, time per failure 1/s, and the fewest failures that
 * reject at a positive time (r ln d > ln A, i.e. r > h2): floor(h2) + 1.
 */
export function lifetimeLinesOf(discrimination: number, risk: number): { acceptAtZero: number; timePerFailure: number; firstReject: number } {
  const { h1, h2, slope } = referenceLines(lifetimeAsCountSpec(discrimination, risk));
  return { acceptAtZero: h1 / slope, timePerFailure: 1 / slope, firstReject: Math.floor(h2) + 1 };
}

/** Wald's expected test time (units of theta1) at MTBF theta0 (atH1 false) or theta1, by waldOcAsn on the failure process. */
export function lifetimeWaldTime(discrimination: number, risk: number, atH1: boolean): number {
  return waldOcAsn(lifetimeAsCountSpec(discrimination, risk), atH1 ? 1 : 1 / discrimination).asn;
}

/** Fixed-sample size of a one-sided normal test: ((z_(1-alpha) + z_(1-beta))/delta)^2, quantiles by jStat.normal.inv. */
export function normalFixedSampleSize(alpha: number, beta: number, delta: number): number {
  return ((jStat.normal.inv(1 - alpha, 0, 1) + jStat.normal.inv(1 - beta, 0, 1)) / delta) ** 2;
}

/** Wald's ASN at mu0 of the normal SPRT (shift delta sigma): ((1 - alpha) ln B + alpha ln A)/(-delta^2/2) (Wald 1947 §3.3, from memory). */
export function normalWaldAsnH0(alpha: number, beta: number, delta: number): number {
  const lnA = Math.log((1 - beta) / alpha);
  const lnB = Math.log(beta / (1 - alpha));
  return ((1 - alpha) * lnB + alpha * lnA) / (-0.5 * delta * delta);
}

/** P(X <= k) for X ~ Binomial(n, p), by jStat.binomial.cdf. */
export function binomialCdfOf(k: number, n: number, p: number): number {
  return jStat.binomial.cdf(k, n, p);
}

async function main(): Promise<void> {
  const { referenceSets } = await import('./referenceValues.js');
  for (const set of referenceSets) {
    console.log(`\n${set.name}\n  ${set.source}`);
    for (const value of set.values) {
      const computed = value.compute();
      console.log(`  ${value.label.padEnd(48)} held ${String(value.held).padEnd(10)} computed ${computed.toPrecision(10)}`);
    }
  }
}

if (process.argv[1] !== undefined && path.resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  // Not awaited at the top level: referenceValues.ts imports this module back, and a pending top-level
  // await would leave that import waiting forever.
  main().catch((error: unknown) => {
    console.error(error);
    process.exitCode = 1;
  });
}
