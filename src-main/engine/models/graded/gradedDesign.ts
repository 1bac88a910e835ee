import { PlanParameterError } from '../../errors.js';
import { lookAhead, type LookAhead } from '../../lookAhead.js';
import { classCountRecursion } from './classCountRecursion.js';
import { simulateGradedSprt } from './gradedSimulation.js';
import type { SimulatedPoint } from './gradedSimulation.js';
import type { Decision } from '../../integerLines.js';
import { waldOperatingPoint } from '../../waldCurve.js';
import type { GradedSpec } from '../../spec.js';
import { checkInteger } from '../../validate.js';
import { countOf } from '../../countWords.js';
import type { KlDivergences } from '../linearCountDefinition.js';
import { decideGraded, gradedBoundaries, gradedIncrementLaw, gradedKl, gradedPlan, gradedQuality } from './gradedPlan.js';
import type { GradedBoundaries, GradedPlan } from './gradedPlan.js';
import { gradedLimitRows } from './gradedPlan.js';

/** Largest item count the exact recursion runs to (k <= 3); beyond it the design simulates. */
export const GRADED_EXACT_LIMIT = 400;
const UNDECIDED_STOP = 1e-12;
/** An untruncated plan counts as exact only if the recursion leaves less than this undecided. */
const EXACT_REMAINDER = 1e-6;

export interface GradedCurvePoint {
  /** Position t in the family (1 - t) p0 + t p1 (0 = H0, 1 = H1). */
  theta: number;
  quality: number[];
  ocWald: number;
  asnWald: number;
  /** Exact values (null when simulated). */
  ocExact: number | null;
  asnExact: number | null;
  /** Simulated values with standard errors (null when exact). */
  simulated: SimulatedPoint | null;
}

export interface GradedDesign {
  model: 'graded';
  boundaries: GradedBoundaries;
  kl: KlDivergences;
  wald: { alpha: number; beta: number; asnH0: number; asnH1: number; asnMax: number };
  /** Exact recursion over class counts (k <= 3 and at most 400 items); null otherwise. */
  exact: { alpha: number; beta: number; asnH0: number; asnH1: number; undecided: number } | null;
  /** Seeded simulation, used when the exact recursion does not apply; null otherwise. */
  simulated: { h0: SimulatedPoint; h1: SimulatedPoint } | null;
  /** Demerit lines for n = 1..length: accept at most `accept` (null: not yet possible), reject at least `reject`. */
  limits: Array<{ n: number; accept: number | null; reject: number }>;
  curve: GradedCurvePoint[];
  quality: 't';
  /** The curve's family: quality(t) = (1 - t) p0 + t p1 for t in [0, familyEnd], familyEnd <= 1.5 so every entry stays >= 0. */
  family: { description: string; familyEnd: number };
  hypotheses: { p0: number[]; p1: number[] };
  risks: { alpha: number; beta: number };
  truncation: number | null;
  truncationRule: string;
  neutral: { theta: number; ocWald: number; asnWald: number };
}

export interface GradedDesignOptions {
  curvePoints?: number;
  /** Runs per quality when simulating: at H0 and H1 (default 20000) and on the curve (default a fifth). */
  simulationRuns?: number;
  seed?: number;
}

function exactApplies(plan: GradedPlan): boolean {
  return plan.classCount <= 3 && (plan.truncation === null || plan.truncation <= GRADED_EXACT_LIMIT);
}

/**
 * Designs a graded plan: LLR per class, demerit lines, KL, Wald's OC/ASN over the mixture family,
 * exact OC/ASN by recursion over class counts (k <= 3, up to 400 items) or a seeded simulation.
 *
 * Method: Wald's OC/ASN by waldOperatingPoint on the item LLR law at q(t) = (1 - t) p0 + t p1;
 * exact by classCountRecursion; if an untruncated recursion leaves more than 1e-6 undecided at 400
 * items, the design simulates instead.
 * References: Wald, A. (1947), Sequential Analysis, §3.2, §3.3; Aroian, L. A. (1968), Technometrics
 * 10(1); Wald 1947 ch. 3 (from memory), exact recursion over the integer lines (computed independently, checked by simulation) (truncation rule).
 *
 * @throws PlanParameterError for an invalid spec or options.
 */
export function designGradedPlan(spec: GradedSpec, options: GradedDesignOptions = {}): GradedDesign {
  const curvePoints = options.curvePoints ?? 51;
  if (!Number.isInteger(curvePoints) || curvePoints < 2 || curvePoints > 10001) {
    throw new PlanParameterError('curvePoints', curvePoints, 'an integer from 2 to 10001');
  }
  const runs = options.simulationRuns ?? 20000;
  checkInteger('simulationRuns', runs, 100);
  const seed = options.seed ?? 1;
  const plan = gradedPlan(spec);
  const { lnA, lnB, weights } = plan;
  const kl = gradedKl(plan);
  const waldAt = (t: number) => waldOperatingPoint(gradedIncrementLaw(plan, gradedQuality(plan, t)), lnA, lnB);
  const exactAt = (t: number) =>
    classCountRecursion(weights, gradedQuality(plan, t), lnA, lnB, [0, 0, 0], plan.truncation, GRADED_EXACT_LIMIT, UNDECIDED_STOP);
  let exact0 = exactApplies(plan) ? exactAt(0) : null;
  let exact1 = exact0 === null ? null : exactAt(1);
  if (exact0 !== null && exact1 !== null && Math.max(exact0.undecided, exact1.undecided) > EXACT_REMAINDER) {
    exact0 = exact1 = null;
  }
  const simulate = (t: number, count: number) =>
    simulateGradedSprt(weights, gradedQuality(plan, t), lnA, lnB, plan.truncation, count, seed);
  const simulated = exact0 === null ? { h0: simulate(0, runs), h1: simulate(1, runs) } : null;
  const neutralT = kl.h0h1 / (kl.h0h1 + kl.h1h0);
  const neutral = waldAt(neutralT);
  const wald0 = waldAt(0);
  const wald1 = waldAt(1);

  const curve: GradedCurvePoint[] = [];
  for (let i = 0; i < curvePoints; i++) {
    const t = (plan.familyEnd * i) / (curvePoints - 1);
    const wald = waldAt(t);
    const exact = exact0 === null ? null : exactAt(t);
    curve.push({
      theta: t,
      quality: Array.from(gradedQuality(plan, t)),
      ocWald: wald.oc,
      asnWald: wald.asn,
      ocExact: exact === null ? null : exact.accept,
      asnExact: exact === null ? null : exact.asn,
      simulated: exact === null ? simulate(t, Math.max(100, Math.round(runs / 5))) : null,
    });
  }
  const boundaries = gradedBoundaries(plan);
  const length = plan.truncation ?? Math.ceil(3 * neutral.asn);
  const limits = gradedLimitRows(plan, length);
  return {
    model: 'graded',
    boundaries,
    kl,
    wald: { alpha: 1 - wald0.oc, beta: wald1.oc, asnH0: wald0.asn, asnH1: wald1.asn, asnMax: neutral.asn },
    exact:
      exact0 === null || exact1 === null
        ? null
        : {
            alpha: exact0.reject,
            beta: exact1.accept,
            asnH0: exact0.asn,
            asnH1: exact1.asn,
            undecided: Math.max(exact0.undecided, exact1.undecided),
          },
    simulated,
    limits,
    curve,
    quality: 't',
    family: { description: 'quality(t) = (1 - t) p0 + t p1', familyEnd: plan.familyEnd },
    hypotheses: { p0: [...spec.p0], p1: [...spec.p1] },
    risks: { alpha: spec.alpha, beta: spec.beta },
    truncation: plan.truncation,
    truncationRule:
      plan.truncation === null
        ? 'no truncation: inspection continues until a line is crossed'
        : `at n = ${plan.truncation}, if no line has been crossed: accept if the LLR is <= 0 (demerits <= ${boundaries.slope * plan.truncation}), otherwise reject`,
    neutral: { theta: neutralT, ocWald: neutral.oc, asnWald: neutral.asn },
  };
}

/** Where a graded run stands after its counts per class. */
export interface GradedLiveState extends LookAhead {
  counts: number[];
  n: number;
  /** Total demerits (second class = 1). */
  demerits: number;
  decision: Decision;
  rule: string;
  llr: number;
  /** Demerit lines at the current n (accept null while acceptance is impossible). */
  acceptDemerits: number | null;
  rejectDemerits: number;
  /** How the look-ahead under p0, p1 and the observed class shares was found: exact for k <= 3 within 400 items, else simulated. */
  method: 'exact' | 'simulated';
}

/**
 * The live state of a graded run from its counts per class.
 *
 * Method: decision as in decideGraded; look-ahead by classCountRecursion from the counts (k <= 3
 * and at most 400 items to go) or by a seeded simulation of 4000 runs from the current LLR.
 * References: Wald, A. (1947), Sequential Analysis, §3.1; Aroian, L. A. (1968), Technometrics 10(1).
 *
 * @throws PlanParameterError for an invalid spec or counts.
 */
export function gradedLiveState(spec: GradedSpec, counts: readonly number[]): GradedLiveState {
  const plan = gradedPlan(spec);
  if (!Array.isArray(counts) || counts.length !== plan.classCount) {
    throw new PlanParameterError('counts', counts, `${plan.classCount} whole numbers >= 0, one per class`);
  }
  counts.forEach((count, k) => checkInteger(`counts[${k}]`, count, 0));
  const n = counts.reduce((sum, count) => sum + count, 0);
  if (plan.truncation !== null && n > plan.truncation) {
    throw new PlanParameterError('counts', counts, `at most the truncation, ${countOf(plan.truncation, 'item')} in all`);
  }
  const { decision, rule, llr } = decideGraded(plan, counts);
  const boundaries = gradedBoundaries(plan);
  const demerits = counts.reduce((sum, count, k) => sum + count * boundaries.demerits[k].demerits, 0);
  const open = decision === 'continue';
  const stepsLeft = plan.truncation === null ? null : plan.truncation - n;
  const exact = plan.classCount <= 3 && (stepsLeft === null || stepsLeft <= GRADED_EXACT_LIMIT);
  const at = (q: Float64Array) => {
    if (!open) return { accept: decision === 'accept' ? 1 : 0, asn: 0 };
    if (exact) return classCountRecursion(plan.weights, q, plan.lnA, plan.lnB, counts, stepsLeft, GRADED_EXACT_LIMIT, UNDECIDED_STOP);
    return simulateGradedSprt(plan.weights, q, plan.lnA, plan.lnB, stepsLeft, 4000, 1, 100000, llr);
  };
  const atH0 = at(gradedQuality(plan, 0));
  const atH1 = at(gradedQuality(plan, 1));
  const shares = n > 0 ? Float64Array.from(counts, (count) => count / n) : null;
  const atEstimate = shares === null ? null : at(shares);
  const acceptLine = boundaries.slope * n - boundaries.h1;
  return {
    counts: [...counts],
    n,
    demerits,
    decision,
    rule,
    llr,
    acceptDemerits: acceptLine < 0 ? null : acceptLine,
    rejectDemerits: boundaries.slope * n + boundaries.h2,
    ...lookAhead(atH0, atH1, atEstimate),
    method: exact ? 'exact' : 'simulated',
  };
}
