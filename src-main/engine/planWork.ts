/**
 * How much work designing a plan takes, estimated before any of it is done, and the limits that keep
 * one spec from freezing the app: a plan's runs must be of a size an inspection can reach, and its
 * exact curves must be computable in about a second.
 */
import { formatValue, PlanParameterError } from './errors.js';
import { createNormalSprtEvaluator } from './continuous/normalSprtExact.js';
import { GRADED_EXACT_LIMIT } from './models/gradedDesign.js';
import { gradedIncrementLaw, gradedKl, gradedPlan, gradedQuality } from './models/graded.js';
import type { GradedPlan } from './models/graded.js';
import { lifetimeIncrementLaw, lifetimePlan, MAX_FAILURES } from './models/lifetime.js';
import { measurementPlan, measurementWaldPoint } from './models/measurement.js';
import { validatedModel } from './models/registry.js';
import { waldOperatingPoint } from './numerics/waldExponent.js';
import type { AnyPlanSpec, GradedSpec, LifetimeSpec, MeasurementSpec, PlanSpec } from './spec.js';
import { waldBoundaries, waldLimits } from './waldBoundaries.js';
import { neutralQuality, waldPoint } from './waldCurve.js';
import { MAX_TRUNCATION } from './validate.js';

/** The limits every plan is held to; README "Limits" states them for users. */
export const PLAN_LIMITS = {
  /** Largest truncation, in items (measurements for the measurement model); checked by the factories. */
  maxTruncation: MAX_TRUNCATION,
  /** Largest failure count at which a lifetime test stops; checked by lifetimePlan. */
  maxFailures: MAX_FAILURES,
  /** Largest expected run (Wald's ASN at the worst quality), in items, or failures for lifetime. */
  maxExpectedRun: 100_000,
  /** Largest estimated work of one design, in elementary updates of the exact recursions. */
  maxWork: 3e9,
  /** Largest number of qualities on the curves. */
  maxCurvePoints: 10_001,
} as const;

/** The design's own figures besides the curve: H0, H1, and the truncation search or the fit. */
const EXTRA_POINTS = 4;
/** Evaluations at H0 and H1 that fitting the lines to the exact risks takes at most (exactFit.ts). */
const FIT_EVALUATIONS = 110;
/** Untruncated recursions run until 1e-12 of the mass is left: about this many expected runs. */
const HORIZON_MULTIPLE = 30;
/** Hard cap of the untruncated recursions (exactEvaluator.ts). */
const RECURSION_CAP = 1_000_000;
/** Measured on the development machine (2 cores): relative cost of one quadrature update, and of one kernel value. */
const MEASUREMENT_COST = 1.6;
const KERNEL_COST = 25;
/**
 * Lifetime: the exact evaluation carries a piecewise polynomial per failure, about 30,000 cell
 * updates' worth each (measured), and its mass is gone after about 5 expected runs of failures.
 */
const LIFETIME_COST_PER_FAILURE = 30_000;
const LIFETIME_HORIZON_MULTIPLE = 5;
/** Graded: one simulated item per class costs about this many pass/fail cells (measured). */
const GRADED_SIMULATION_COST = 3;
/** Runs the graded simulation makes at H0 and H1, and per curve point (gradedDesign.ts). */
const GRADED_RUNS = { hypotheses: 2 * 20_000, perPoint: 4_000 };

/** The estimate behind a refusal, for messages and tests. */
export interface PlanWorkEstimate {
  /** Wald's ASN at the worst quality: items per run (failures for lifetime). */
  expectedRun: number;
  /** Estimated elementary updates of the whole design. */
  work: number;
  /** The spec's rejectable quality parameter, named in a refusal of the expected run. */
  gapParameter: string;
  /** The relative gap between the two qualities, |q1 - q0| / |q0|. */
  relativeGap: number;
}

/**
 * Estimates a design's work from the spec alone, in well under a millisecond.
 *
 * Method: work = (curve points + the design's own evaluations) x steps x cells per step, where
 * steps is the truncation, or for an untruncated plan 30 x Wald's peak ASN (the recursions run
 * until 1e-12 of the mass is left; the stopping time's tail is close to geometric with that mean),
 * and cells per step is the live band of counts (pass/fail), its square (count: a Poisson
 * convolution), the squared quadrature nodes (measurement), or the class count per simulated item
 * (graded beyond the exact recursion). Peak ASN = -ln A ln B / E[z^2] at E[z] = 0.
 * References: Wald, A. (1947), Sequential Analysis, §3.3 (ASN); the cost model is common practice, no source.
 *
 * @throws PlanParameterError for a spec its model's factory refuses.
 */
export function estimatePlanWork(spec: AnyPlanSpec, curvePoints: number, fit = false): PlanWorkEstimate {
  switch (spec.model) {
    case 'measurement':
      return measurementWork(spec, curvePoints);
    case 'lifetime':
      return lifetimeWork(spec, curvePoints);
    case 'graded':
      return gradedWork(spec, curvePoints);
    default:
      return linearWork(spec, curvePoints, fit || spec.fit === 'exact');
  }
}

function horizon(truncation: number | null | undefined, expectedRun: number): number {
  return truncation ?? Math.min(RECURSION_CAP, HORIZON_MULTIPLE * Math.max(1, expectedRun));
}

function relativeGap(q0: number, q1: number): number {
  return Math.abs(q1 - q0) / Math.max(Math.abs(q0), Number.MIN_VALUE);
}

function linearWork(spec: PlanSpec, curvePoints: number, fit: boolean): PlanWorkEstimate {
  const boundaries = waldBoundaries(spec);
  const model = validatedModel(spec);
  const { lnA, lnB } = waldLimits(spec.alpha, spec.beta);
  const expectedRun = waldPoint(model, spec, lnA, lnB, neutralQuality(model, spec)).asn;
  const band = boundaries.h1 + boundaries.h2 + Math.max(1, boundaries.slope) + 4;
  // A Poisson step convolves the live counts (h1 + h2 wide) with the step law over the band.
  const cellsPerStep = spec.model === 'count' ? (boundaries.h1 + boundaries.h2 + 2) * band : band;
  const points = curvePoints + EXTRA_POINTS + (fit ? FIT_EVALUATIONS : 0);
  // Without truncation the design also searches a truncation over up to 100,000 items (truncation.ts).
  const search = spec.truncation == null ? 2 * Math.min(100_000, horizon(null, expectedRun)) * cellsPerStep : 0;
  const [q0, q1] = spec.model === 'passfail' ? [spec.p0, spec.p1] : [spec.lambda0, spec.lambda1];
  return {
    expectedRun,
    work: points * horizon(spec.truncation, expectedRun) * cellsPerStep + search,
    gapParameter: spec.model === 'passfail' ? 'p1' : 'lambda1',
    relativeGap: relativeGap(q0, q1),
  };
}

function measurementWork(spec: MeasurementSpec, curvePoints: number): PlanWorkEstimate {
  const plan = measurementPlan(spec);
  const expectedRun = measurementWaldPoint(plan, plan.midpoint, plan.rejectLimit, plan.acceptLimit).asn;
  const nodes = createNormalSprtEvaluator(plan.acceptLimit, plan.rejectLimit, plan.stepScale).nodes;
  // Untruncated: one dense solve per quality (nodes^3 / 3); truncated: nodes^2 per measurement until
  // the mass is gone; both after nodes^2 kernel values. Each update costs about 1.6 of a pass/fail cell.
  const kernel = KERNEL_COST * nodes * nodes;
  const solve = plan.truncation === null ? nodes ** 3 / 3 : Math.min(plan.truncation, horizon(null, expectedRun)) * nodes * nodes;
  const perPoint = MEASUREMENT_COST * (kernel + solve);
  return {
    expectedRun,
    work: (curvePoints + EXTRA_POINTS) * perPoint,
    gapParameter: 'mu1',
    relativeGap: relativeGap(spec.mu0, spec.mu1),
  };
}

function lifetimeWork(spec: LifetimeSpec, curvePoints: number): PlanWorkEstimate {
  const plan = lifetimePlan(spec);
  const neutralTheta = plan.llrPerFailure / plan.llrPerTime;
  const expectedTime = waldOperatingPoint(lifetimeIncrementLaw(plan, neutralTheta), plan.lnA, plan.lnB).asn;
  const expectedRun = expectedTime / neutralTheta;
  // Failures the exact evaluation walks through: the stopping failure count, or the expected run's tail.
  const atMaxTime = plan.maxTime === null ? Number.POSITIVE_INFINITY : (plan.maxTime * plan.llrPerTime) / plan.llrPerFailure + 1;
  const failures = Math.min(plan.maxFailures ?? Number.POSITIVE_INFINITY, atMaxTime, LIFETIME_HORIZON_MULTIPLE * Math.max(1, expectedRun));
  return {
    expectedRun,
    work: (curvePoints + EXTRA_POINTS) * failures * LIFETIME_COST_PER_FAILURE,
    gapParameter: 'theta1',
    relativeGap: relativeGap(spec.theta0, spec.theta1),
  };
}

function gradedWork(spec: GradedSpec, curvePoints: number): PlanWorkEstimate {
  const plan: GradedPlan = gradedPlan(spec);
  const kl = gradedKl(plan);
  const neutralT = kl.h0h1 / (kl.h0h1 + kl.h1h0);
  const expectedRun = waldOperatingPoint(gradedIncrementLaw(plan, gradedQuality(plan, neutralT)), plan.lnA, plan.lnB).asn;
  const steps = Math.min(horizon(plan.truncation, expectedRun), plan.truncation ?? Number.POSITIVE_INFINITY, 4 * Math.max(1, expectedRun));
  // Up to three classes within 400 items: the recursion over class counts, about n^(k-1)/(k-1)! states at item n.
  const exactSteps = Math.min(GRADED_EXACT_LIMIT, horizon(plan.truncation, expectedRun));
  const exact = plan.classCount <= 3 && (plan.truncation === null || plan.truncation <= GRADED_EXACT_LIMIT);
  const exactWork = (curvePoints + EXTRA_POINTS) * (plan.classCount === 2 ? exactSteps ** 2 / 2 : exactSteps ** 3 / 6);
  // Simulated runs stop near the expected run; each simulated item draws a class (about 3 cells' worth per class).
  const simulatedWork = GRADED_SIMULATION_COST * (GRADED_RUNS.hypotheses + curvePoints * GRADED_RUNS.perPoint) * steps * plan.classCount;
  // The exact recursion falls back to simulation when it leaves mass undecided at 400 items.
  const work = exact ? exactWork + (horizon(plan.truncation, expectedRun) > GRADED_EXACT_LIMIT ? simulatedWork : 0) : simulatedWork;
  const differing = spec.p0.findIndex((p, k) => p !== spec.p1[k]);
  return {
    expectedRun,
    work,
    gapParameter: 'p1',
    relativeGap: differing < 0 ? 0 : relativeGap(spec.p0[differing], spec.p1[differing]),
  };
}

function formatCount(value: number): string {
  if (!Number.isFinite(value)) return 'without end';
  if (value >= 1e12) return `about ${value.toExponential(1).replace('e+', 'e')}`;
  if (value >= 1e9) return `about ${Number((value / 1e9).toPrecision(2))} billion`;
  if (value >= 1e6) return `about ${Number((value / 1e6).toPrecision(2))} million`;
  return `about ${Math.round(value).toLocaleString('en-US')}`;
}

function formatPercent(fraction: number): string {
  return `${Number((100 * fraction).toPrecision(2))} %`;
}

/** A spec's parameter by name, for messages. */
function spec0(spec: AnyPlanSpec, name: string): unknown {
  return (spec as unknown as Record<string, unknown>)[name];
}

/**
 * Refuses a spec whose runs or design would be too large to compute, with what is allowed and why.
 *
 * Method: the bounds of PLAN_LIMITS on truncation and failures (in the model factories), the
 * expected run and the estimated work (estimatePlanWork).
 * References: common practice, no source.
 *
 * @throws PlanParameterError naming the parameter to change.
 */
export function checkPlanWork(spec: AnyPlanSpec, curvePoints: number, fit = false): void {
  if (!Number.isInteger(curvePoints) || curvePoints < 2 || curvePoints > PLAN_LIMITS.maxCurvePoints) {
    throw new PlanParameterError('curvePoints', curvePoints, `an integer from 2 to ${PLAN_LIMITS.maxCurvePoints}`);
  }
  const estimate = estimatePlanWork(spec, curvePoints, fit);
  const unit = spec.model === 'lifetime' ? 'failures' : spec.model === 'measurement' ? 'measurements' : 'items';
  const stopsEarly = spec.model === 'lifetime' ? spec.maxFailures != null || spec.maxTime != null : spec.truncation != null;
  if (!stopsEarly && !(estimate.expectedRun <= PLAN_LIMITS.maxExpectedRun)) {
    const q1 = estimate.gapParameter;
    const q0 = q1.replace('1', '0');
    throw new PlanParameterError(
      q1,
      spec0(spec, q1),
      `far enough from ${q0} for a run of at most ${PLAN_LIMITS.maxExpectedRun.toLocaleString('en-US')} ${unit} on average`,
      `${estimate.relativeGap < 0.1 ? `${q1} within ${formatPercent(estimate.relativeGap)} of ${q0}` : `${q0} = ${formatValue(spec0(spec, q0))} and ${q1} = ${formatValue(spec0(spec, q1))}`} would need ${formatCount(estimate.expectedRun)} ${unit} per run ` +
        `(at most ${PLAN_LIMITS.maxExpectedRun.toLocaleString('en-US')} allowed); widen the gap or set a truncation`,
    );
  }
  if (!(estimate.work <= PLAN_LIMITS.maxWork)) {
    const parameter = spec.model === 'lifetime' ? (spec.maxFailures != null ? 'maxFailures' : 'maxTime') : 'truncation';
    throw new PlanParameterError(
      stopsEarly ? parameter : estimate.gapParameter,
      spec0(spec, stopsEarly ? parameter : estimate.gapParameter),
      'a plan whose exact curves take at most a few seconds',
      `this plan's exact curves would take ${formatCount(estimate.work)} steps (curve points x ${unit} x states), ` +
        `at most ${formatCount(PLAN_LIMITS.maxWork).replace('about ', '')} allowed; ` +
        (stopsEarly ? `lower the ${parameter === 'truncation' ? 'truncation' : parameter}, ` : '') +
        'use fewer curve points or widen the gap between the two qualities',
    );
  }
}
