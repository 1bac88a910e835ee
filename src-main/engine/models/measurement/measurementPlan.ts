import { PlanParameterError } from '../../errors.js';
import type { KlDivergences } from '../linearCountDefinition.js';
import type { MeasurementSpec } from '../../spec.js';
import { checkRisksAndTruncation } from '../../validate.js';
import { waldLimits } from '../../waldBoundaries.js';
import { waldOperatingPoint } from '../../waldCurve.js';
import type { IncrementLaw } from '../../waldCurve.js';
import type { Decision } from '../../integerLines.js';

/**
 * Siegmund's overshoot constant for normal random walks, rho = -zeta(1/2)/sqrt(2 pi) = 0.58260:
 * the expected overshoot of the LLR over a distant limit is about rho times one step's standard
 * deviation. zeta(1/2) = -1.4603545088095868 (Siegmund 1985 ch. 3 (from memory; rho computed from zeta(1/2)), computed).
 */
export const SIEGMUND_RHO = 1.4603545088095868 / Math.sqrt(2 * Math.PI);

/** A validated measurement plan: the constants every later call uses. */
export interface MeasurementPlan {
  readonly spec: MeasurementSpec;
  /** mu1 - mu0 (negative when the rejectable mean lies below the acceptable one). */
  readonly shift: number;
  /** (mu0 + mu1)/2: the slope of both lines in the (n, sum) plane. */
  readonly midpoint: number;
  /** ln of the likelihood ratio per unit of (sum - n midpoint): (mu1 - mu0)/sigma^2. */
  readonly llrPerUnit: number;
  /** Standard deviation of one LLR increment, |mu1 - mu0|/sigma. */
  readonly stepScale: number;
  /** Wald's ln A and ln B. */
  readonly lnA: number;
  readonly lnB: number;
  /** How far both limits were pulled inward (0 without the overshoot correction). */
  readonly correction: number;
  /** The LLR limits in use: accept at or below acceptLimit, reject at or above rejectLimit. */
  readonly acceptLimit: number;
  readonly rejectLimit: number;
  readonly truncation: number | null;
}

function checkFinite(parameter: string, value: unknown): asserts value is number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new PlanParameterError(parameter, value, 'a finite number');
  }
}

/**
 * Validates a measurement spec once and returns the plan's constants.
 *
 * Method: z = (mu1 - mu0)/sigma^2 (x - (mu0 + mu1)/2); Wald's limits ln A = ln((1-beta)/alpha),
 * ln B = ln(beta/(1-alpha)); with the overshoot correction both limits move inward by
 * rho |mu1 - mu0|/sigma, so that the Siegmund-corrected OC of the plan in use (its limits moved
 * back outward by the same amount) equals Wald's nominal one.
 * References: Wald, A. (1947), Sequential Analysis, ch. 5 (normal case); Siegmund, D. (1985),
 * Sequential Analysis: Tests and Confidence Intervals, Springer, ch. 3 (the corrected
 * approximation, from memory); normal SPRT by the Fredholm integral equation (computed independently), Siegmund 1985 ch. 3 (from memory; rho computed from zeta(1/2)).
 *
 * @throws PlanParameterError naming the parameter, its value and what is allowed.
 */
export function measurementPlan(spec: MeasurementSpec): MeasurementPlan {
  if (spec === null || typeof spec !== 'object') throw new PlanParameterError('spec', spec, 'a plan specification object');
  checkFinite('mu0', spec.mu0);
  checkFinite('mu1', spec.mu1);
  if (spec.mu1 === spec.mu0) {
    throw new PlanParameterError('mu1', spec.mu1, 'different from mu0', `mu1 must differ from mu0 (both ${spec.mu0})`);
  }
  if (typeof spec.sigma !== 'number' || !Number.isFinite(spec.sigma) || spec.sigma <= 0) {
    throw new PlanParameterError('sigma', spec.sigma, 'a number greater than 0');
  }
  checkRisksAndTruncation({ alpha: spec.alpha, beta: spec.beta, truncation: spec.truncation });
  const correct = spec.overshootCorrection ?? false;
  if (typeof correct !== 'boolean') throw new PlanParameterError('overshootCorrection', correct, 'true or false');
  if (spec.unit !== undefined && typeof spec.unit !== 'string') throw new PlanParameterError('unit', spec.unit, 'a text');
  const shift = spec.mu1 - spec.mu0;
  const stepScale = Math.abs(shift) / spec.sigma;
  const { lnA, lnB } = waldLimits(spec.alpha, spec.beta);
  const correction = correct ? SIEGMUND_RHO * stepScale : 0;
  if (correct && (lnA - correction <= 0 || lnB + correction >= 0)) {
    throw new PlanParameterError(
      'overshootCorrection',
      true,
      'false for this plan',
      `overshootCorrection would pull a limit past 0 (|mu1 - mu0|/sigma = ${stepScale} is too large for these risks)`,
    );
  }
  return {
    spec,
    shift,
    midpoint: 0.5 * (spec.mu0 + spec.mu1),
    llrPerUnit: shift / (spec.sigma * spec.sigma),
    stepScale,
    lnA,
    lnB,
    correction,
    acceptLimit: lnB + correction,
    rejectLimit: lnA - correction,
    truncation: spec.truncation ?? null,
  };
}

/**
 * LLR of n measurements with the given sum.
 *
 * Method: sum of z_i = (mu1 - mu0)/sigma^2 (sum - n (mu0 + mu1)/2).
 * References: Wald, A. (1947), Sequential Analysis, ch. 5.
 */
export function measurementLogLikelihoodRatio(plan: MeasurementPlan, n: number, sum: number): number {
  return plan.llrPerUnit * (sum - n * plan.midpoint);
}

/**
 * KL divergences per measurement, equal both ways.
 *
 * Method: D(N(mu0, s^2) || N(mu1, s^2)) = (mu1 - mu0)^2/(2 s^2).
 * References: Kullback, S. (1959), Information Theory and Statistics, Wiley, ch. 9.
 */
export function measurementKl(plan: MeasurementPlan): KlDivergences {
  const divergence = 0.5 * plan.stepScale * plan.stepScale;
  return { h0h1: divergence, h1h0: divergence };
}

/** Mean of one LLR increment when the true mean is mu. */
export function measurementDrift(plan: MeasurementPlan, mu: number): number {
  return plan.llrPerUnit * (mu - plan.midpoint);
}

/**
 * Wald's OC and ASN at true mean mu for LLR limits (lnA, lnB), in closed form.
 *
 * Method: z ~ N(m, s^2) with m = (mu1 - mu0)(mu - (mu0 + mu1)/2)/sigma^2, s = |mu1 - mu0|/sigma, so
 * E[e^{hz}] = 1 at h = -2m/s^2 = (mu1 + mu0 - 2 mu)/(mu1 - mu0); OC = (A^h - 1)/(A^h - B^h),
 * ASN = (OC ln B + (1 - OC) ln A)/m; at mu = midpoint OC = ln A/(ln A - ln B), ASN = -ln A ln B/s^2.
 * The formulas are the engine's one Wald solver (waldOperatingPoint), given the closed-form h.
 * References: Wald, A. (1947), Sequential Analysis, §3.2, §3.3 and ch. 5 (from memory).
 */
export function measurementWaldPoint(plan: MeasurementPlan, mu: number, lnA: number, lnB: number): { oc: number; asn: number } {
  const { oc, asn } = waldOperatingPoint(measurementIncrementLaw(plan, mu), lnA, lnB);
  return { oc, asn };
}

/** The law of one measurement's LLR increment at true mean mu: normal, so its Wald exponent is known. */
export function measurementIncrementLaw(plan: MeasurementPlan, mu: number): IncrementLaw {
  const drift = measurementDrift(plan, mu);
  const variance = plan.stepScale * plan.stepScale;
  return {
    mean: drift,
    secondMoment: variance + drift * drift,
    // z ~ N(m, s^2): ln E[e^{hz}] = h m + h^2 s^2/2, zero again at h = -2m/s^2.
    logMomentGenerating: (h) => h * drift + 0.5 * h * h * variance,
    exponent: (-2 * drift) / variance,
  };
}

/** Accept/reject lines for the cumulative sum of measurements against n. */
export interface MeasurementBoundaries {
  /** Wald's limits on the LLR (nominal). */
  lnA: number;
  lnB: number;
  /** The LLR limits in use (equal to ln B, ln A without the overshoot correction). */
  acceptLimit: number;
  rejectLimit: number;
  /** Slope of both lines: (mu0 + mu1)/2 per measurement. */
  slope: number;
  /** Distance of the acceptance line from slope n, in sum units (>= 0). */
  h1: number;
  /** Distance of the rejection line from slope n, in sum units (>= 0). */
  h2: number;
  /** 'above': reject when the sum is at or above slope n + h2, accept at or below slope n - h1; 'below': mirrored. */
  rejectWhen: 'above' | 'below';
  /** How far each limit was pulled inward, in nats (0 without correction). */
  correction: number;
}

/**
 * The lines in the (n, sum of measurements) plane.
 *
 * Method: LLR <= acceptLimit <=> sum <= n (mu0 + mu1)/2 + acceptLimit sigma^2/(mu1 - mu0) when
 * mu1 > mu0 (reversed when mu1 < mu0); likewise for the rejection line.
 * References: Wald, A. (1947), Sequential Analysis, ch. 5; ISO 3951-5 form (intercepts and slope),
 * ISO 3951-5 form (from memory).
 */
export function measurementBoundaries(plan: MeasurementPlan): MeasurementBoundaries {
  const unitsPerNat = 1 / Math.abs(plan.llrPerUnit);
  return {
    lnA: plan.lnA,
    lnB: plan.lnB,
    acceptLimit: plan.acceptLimit,
    rejectLimit: plan.rejectLimit,
    slope: plan.midpoint,
    h1: -plan.acceptLimit * unitsPerNat,
    h2: plan.rejectLimit * unitsPerNat,
    rejectWhen: plan.shift > 0 ? 'above' : 'below',
    correction: plan.correction,
  };
}

/**
 * Relative size, against the magnitude of n measurements, within which a sum counts as on a line.
 * Adding the same decimals in another order changes a binary sum in its last bits (10.3 + 10.4 + 10.8
 * = 31.500000000000004, 10.3 + 10.8 + 10.4 = 31.5); a sum within this guard of a line is on it, so
 * the same data give the same decision in any order.
 */
export const MEASUREMENT_SUM_GUARD = 1e-12;

/**
 * The LLR guard after n measurements: MEASUREMENT_SUM_GUARD times the sum's scale n (|midpoint| +
 * |mu1 - mu0| + sigma), in LLR units.
 */
function measurementLlrGuard(plan: MeasurementPlan, n: number): number {
  const scale = n * (Math.abs(plan.midpoint) + Math.abs(plan.shift) + plan.spec.sigma);
  return MEASUREMENT_SUM_GUARD * scale * Math.abs(plan.llrPerUnit);
}

/** The decision after n measurements with the given sum. */
export interface MeasurementDecision {
  decision: Decision;
  rule: string;
  llr: number;
}

/**
 * The decision after n measurements with their sum.
 *
 * Method: reject iff LLR >= rejectLimit, accept iff LLR <= acceptLimit; at the truncation n_t,
 * accept iff LLR <= 0 (the sum on the acceptable side of n (mu0 + mu1)/2), else reject. A sum within
 * MEASUREMENT_SUM_GUARD of a line counts as on it.
 * References: Wald, A. (1947), Sequential Analysis, §3.1; exact recursion over the integer lines (computed independently, checked by simulation) (the truncation
 * rule is a stated choice).
 */
export function decideMeasurement(plan: MeasurementPlan, n: number, sum: number): MeasurementDecision {
  const llr = measurementLogLikelihoodRatio(plan, n, sum);
  const guard = measurementLlrGuard(plan, n);
  if (n > 0 && llr >= plan.rejectLimit - guard) return { decision: 'reject', rule: 'rejection line crossed', llr };
  if (n > 0 && llr <= plan.acceptLimit + guard) return { decision: 'accept', rule: 'acceptance line crossed', llr };
  if (plan.truncation !== null && n >= plan.truncation) {
    return llr <= guard
      ? { decision: 'accept', rule: 'accept at truncation', llr }
      : { decision: 'reject', rule: 'reject at truncation', llr };
  }
  return { decision: 'continue', rule: 'between the lines', llr };
}

/**
 * Measurement lines in sum units for n = 1..length; the truncation row holds the truncation rule.
 *
 * Method: sum limit = n (mu0 + mu1)/2 + limit / ((mu1 - mu0)/sigma^2) for the LLR limits in use;
 * at the truncation both are n (mu0 + mu1)/2 (LLR = 0).
 * References: Wald, A. (1947), Sequential Analysis, ch. 5.
 */
export function measurementLimitRows(plan: MeasurementPlan, length: number): Array<{ n: number; accept: number; reject: number }> {
  const rows = [];
  for (let n = 1; n <= length; n++) {
    const atTruncation = n === plan.truncation;
    rows.push({
      n,
      accept: plan.midpoint * n + (atTruncation ? 0 : plan.acceptLimit / plan.llrPerUnit),
      reject: plan.midpoint * n + (atTruncation ? 0 : plan.rejectLimit / plan.llrPerUnit),
    });
  }
  return rows;
}
