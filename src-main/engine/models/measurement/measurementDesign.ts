import { createNormalSprtEvaluator } from './normalSprtExact.js';
import { lookAhead, type LookAhead } from '../../lookAhead.js';
import type { NormalSprtEvaluator } from './normalSprtExact.js';
import { PlanParameterError } from '../../errors.js';
import type { Decision } from '../../integerLines.js';
import { normalQuantile } from '../../distributions/normal.js';
import type { MeasurementSpec } from '../../spec.js';
import { checkInteger } from '../../validate.js';
import type { KlDivergences } from '../linearCountDefinition.js';
import {
  decideMeasurement,
  measurementBoundaries,
  measurementDrift,
  measurementKl,
  measurementPlan,
  measurementWaldPoint,
  SIEGMUND_RHO,
} from './measurementPlan.js';
import type { MeasurementBoundaries, MeasurementPlan } from './measurementPlan.js';
import { measurementLimitRows } from './measurementPlan.js';

/** One quality on the measurement plan's curves; theta is the true mean. */
export interface MeasurementCurvePoint {
  theta: number;
  ocWald: number;
  asnWald: number;
  /** Wald's formulas with the limits in use moved outward by rho |mu1 - mu0|/sigma (Siegmund). */
  ocCorrected: number;
  asnCorrected: number;
  ocExact: number;
  asnExact: number;
}

/** Everything shown about a measurement plan; the first keys follow the pass/fail contract. */
export interface MeasurementDesign {
  model: 'measurement';
  boundaries: MeasurementBoundaries;
  kl: KlDivergences;
  /** Wald's approximations on the limits in use. */
  wald: { asnH0: number; asnH1: number; asnMax: number; alpha: number; beta: number };
  /** Siegmund's corrected approximation of the plan in use. */
  corrected: { alpha: number; beta: number; asnH0: number; asnH1: number };
  /** Integral-equation (untruncated) or density-recursion (truncated) values; undecided is the mass left. */
  exact: { alpha: number; beta: number; asnH0: number; asnH1: number; undecided: number; method: string; nodes: number };
  /** The fixed-sample plan meeting both OC points: n measurements, accept iff the mean is on mu0's side of criticalMean. */
  single: { n: number; exactN: number; criticalMean: number };
  /** Lines in sum units for n = 1..length (the truncation row holds the truncation rule: accept iff sum on the midpoint's acceptable side). */
  limits: Array<{ n: number; accept: number; reject: number }>;
  curve: MeasurementCurvePoint[];
  quality: 'mu';
  hypotheses: { theta0: number; theta1: number };
  risks: { alpha: number; beta: number };
  truncation: number | null;
  truncationRule: string;
  saving: { h0: number; h1: number };
  neutral: { theta: number; ocWald: number; asnWald: number };
  unit: string | null;
}

function exactAt(plan: MeasurementPlan, evaluator: NormalSprtEvaluator, mu: number, n: number, llr: number) {
  const stepsLeft = plan.truncation === null ? null : plan.truncation - n;
  return evaluator.evaluate(measurementDrift(plan, mu), llr, stepsLeft);
}

/**
 * Designs a measurement plan: lines in (n, sum), KL, Wald's and Siegmund's approximations, exact
 * OC/ASN, the equivalent fixed-sample plan, the limits table and the curves over the true mean.
 *
 * Method: Wald OC/ASN in closed form (measurementWaldPoint); exact values by
 * createNormalSprtEvaluator; fixed n = ((z_{1-alpha} + z_{1-beta}) sigma/|mu1 - mu0|)^2 rounded up,
 * critical mean mu0 + z_{1-alpha} sigma/sqrt(n) towards mu1; the curve covers mu0 - |d|/2 to
 * mu1 + |d|/2 in the direction of mu1.
 * References: Wald, A. (1947), Sequential Analysis, ch. 5; Siegmund, D. (1985), Sequential
 * Analysis, ch. 3; normal SPRT by the Fredholm integral equation (computed independently), Wald 1947 ASN against the fixed-sample n (computed independently).
 *
 * @throws PlanParameterError for an invalid spec or curvePoints.
 */
export function designMeasurementPlan(spec: MeasurementSpec, options: { curvePoints?: number } = {}): MeasurementDesign {
  const curvePoints = options.curvePoints ?? 51;
  if (!Number.isInteger(curvePoints) || curvePoints < 2 || curvePoints > 10001) {
    throw new PlanParameterError('curvePoints', curvePoints, 'an integer from 2 to 10001');
  }
  const plan = measurementPlan(spec);
  const { acceptLimit: lower, rejectLimit: upper } = plan;
  // Siegmund: the expected overshoot is about rho step deviations, so move each limit out by that.
  const outward = SIEGMUND_RHO * plan.stepScale;
  const evaluator = createNormalSprtEvaluator(lower, upper, plan.stepScale);
  const wald0 = measurementWaldPoint(plan, spec.mu0, upper, lower);
  const wald1 = measurementWaldPoint(plan, spec.mu1, upper, lower);
  const corrected0 = measurementWaldPoint(plan, spec.mu0, upper + outward, lower - outward);
  const corrected1 = measurementWaldPoint(plan, spec.mu1, upper + outward, lower - outward);
  const exact0 = exactAt(plan, evaluator, spec.mu0, 0, 0);
  const exact1 = exactAt(plan, evaluator, spec.mu1, 0, 0);
  const neutral = measurementWaldPoint(plan, plan.midpoint, upper, lower);

  const zSum = normalQuantile(1 - spec.alpha) + normalQuantile(1 - spec.beta);
  const exactN = (zSum / plan.stepScale) ** 2;
  const singleN = Math.ceil(exactN - 1e-9);
  const criticalMean = spec.mu0 + Math.sign(plan.shift) * normalQuantile(1 - spec.alpha) * (spec.sigma / Math.sqrt(singleN));

  const curve: MeasurementCurvePoint[] = [];
  const from = spec.mu0 - 0.5 * plan.shift;
  const to = spec.mu1 + 0.5 * plan.shift;
  for (let i = 0; i < curvePoints; i++) {
    const mu = from + ((to - from) * i) / (curvePoints - 1);
    const wald = measurementWaldPoint(plan, mu, upper, lower);
    const corrected = measurementWaldPoint(plan, mu, upper + outward, lower - outward);
    const exact = exactAt(plan, evaluator, mu, 0, 0);
    curve.push({
      theta: mu,
      ocWald: wald.oc,
      asnWald: wald.asn,
      ocCorrected: corrected.oc,
      asnCorrected: corrected.asn,
      ocExact: exact.accept,
      asnExact: exact.asn,
    });
  }

  const boundaries = measurementBoundaries(plan);
  const length = plan.truncation ?? 3 * singleN;
  const limits = measurementLimitRows(plan, length);
  return {
    model: 'measurement',
    boundaries,
    kl: measurementKl(plan),
    wald: { asnH0: wald0.asn, asnH1: wald1.asn, asnMax: neutral.asn, alpha: 1 - wald0.oc, beta: wald1.oc },
    corrected: { alpha: 1 - corrected0.oc, beta: corrected1.oc, asnH0: corrected0.asn, asnH1: corrected1.asn },
    exact: {
      alpha: 1 - exact0.accept - exact0.undecided,
      beta: exact1.accept,
      asnH0: exact0.asn,
      asnH1: exact1.asn,
      undecided: Math.max(exact0.undecided, exact1.undecided),
      method: plan.truncation === null ? 'Fredholm integral equations, Nystrom on Gauss-Legendre nodes' : 'density recursion on Gauss-Legendre nodes',
      nodes: evaluator.nodes,
    },
    single: { n: singleN, exactN, criticalMean },
    limits,
    curve,
    quality: 'mu',
    hypotheses: { theta0: spec.mu0, theta1: spec.mu1 },
    risks: { alpha: spec.alpha, beta: spec.beta },
    truncation: plan.truncation,
    truncationRule: measurementTruncationRule(plan),
    saving: { h0: 1 - exact0.asn / singleN, h1: 1 - exact1.asn / singleN },
    neutral: { theta: plan.midpoint, ocWald: neutral.oc, asnWald: neutral.asn },
    unit: spec.unit ?? null,
  };
}

/**
 * The truncation rule in words.
 *
 * Method: at n_t accept iff LLR <= 0, i.e. the sum is on mu0's side of n_t (mu0 + mu1)/2.
 * References: exact recursion over the integer lines (computed independently, checked by simulation) (the rule is a stated choice).
 */
export function measurementTruncationRule(plan: MeasurementPlan): string {
  if (plan.truncation === null) return 'no truncation: measuring continues until a line is crossed';
  const side = plan.shift > 0 ? 'at most' : 'at least';
  return (
    `at n = ${plan.truncation}, if no line has been crossed: accept if the sum is ${side} ` +
    `${plan.truncation} x ${plan.midpoint} (mean ${side} ${plan.midpoint}, LLR <= 0), otherwise reject`
  );
}

/** Where a measurement run stands after n values with the given sum. */
export interface MeasurementLiveState extends LookAhead {
  n: number;
  sum: number;
  /** sum / n, null before the first value. */
  mean: number | null;
  decision: Decision;
  rule: string;
  llr: number;
  /** The next value accepts at once if at most (rejectWhen 'above') or at least ('below') this; null if decided or the next step is the truncation. */
  nextValueAccepts: number | null;
  /** The next value rejects at once if at least ('above') or at most ('below') this. */
  nextValueRejects: number | null;
}

/**
 * The live state of a measurement run from its accumulated evidence (n values, their sum).
 *
 * Method: decision as in decideMeasurement; the next value's thresholds from the lines at n + 1;
 * P(accept) and expected remaining measurements from the current LLR by the exact evaluator, under
 * mu0, mu1 and the current mean.
 * References: Wald, A. (1947), Sequential Analysis, ch. 5; common practice, no source.
 *
 * @throws PlanParameterError for an invalid spec, n or sum.
 */
export function measurementLiveState(spec: MeasurementSpec, n: number, sum: number): MeasurementLiveState {
  const plan = measurementPlan(spec);
  checkInteger('n', n, 0);
  if (typeof sum !== 'number' || !Number.isFinite(sum)) throw new PlanParameterError('sum', sum, 'a finite number');
  if (plan.truncation !== null && n > plan.truncation) {
    throw new PlanParameterError('n', n, `an integer from 0 to the truncation ${plan.truncation}`);
  }
  const { decision, rule, llr } = decideMeasurement(plan, n, sum);
  const mean = n > 0 ? sum / n : null;
  const open = decision === 'continue';
  const evaluator = open ? createNormalSprtEvaluator(plan.acceptLimit, plan.rejectLimit, plan.stepScale) : null;
  const settled = { accept: decision === 'accept' ? 1 : 0, asn: 0, undecided: 0 };
  const at = (mu: number) => (evaluator === null ? settled : exactAt(plan, evaluator, mu, n, llr));
  const atH0 = at(spec.mu0);
  const atH1 = at(spec.mu1);
  const atEstimate = mean === null ? null : at(mean);
  const lastStep = plan.truncation !== null && n + 1 === plan.truncation;
  const valueAt = (limit: number) => plan.midpoint * (n + 1) + limit / plan.llrPerUnit - sum;
  return {
    n,
    sum,
    mean,
    decision,
    rule,
    llr,
    nextValueAccepts: open ? valueAt(lastStep ? 0 : plan.acceptLimit) : null,
    nextValueRejects: open ? valueAt(lastStep ? 0 : plan.rejectLimit) : null,
    ...lookAhead(atH0, atH1, atEstimate),
  };
}
