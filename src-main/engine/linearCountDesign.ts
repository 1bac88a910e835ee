import { createExactEvaluator } from './exactEvaluator.js';
import { acceptanceNumber, rejectionNumber, truncationAcceptanceNumber } from './integerLines.js';
import type { IntegerLines } from './integerLines.js';
import { PlanParameterError } from './errors.js';
import type { CurvePoint, LimitRow, LinearCountDesign } from './planDesignTypes.js';
import { resolvePlan } from './resolvePlan.js';
import { sampleSizeQuantiles } from './sampleSizeQuantiles.js';
import { singleSamplingPlan } from './singlePlan.js';
import type { LinearCountSpec } from './spec.js';
import { suggestedTruncation } from './truncation.js';
import { neutralQuality, waldPoint } from './waldCurve.js';

export interface DesignOptions {
  /** Number of qualities on the OC/ASN curve, 2..10001. Default 51. */
  curvePoints?: number;
}

/** Rows of the limits table when the plan is untruncated, as a multiple of the single plan's n. */
const LIMITS_SINGLE_MULTIPLE = 3;

/**
 * Designs a sequential plan and everything shown about it: Wald's lines and ASN, the exact risks,
 * ASN and sample-size quantiles of the integer plan, the equivalent single plan, the table of
 * acceptance/rejection numbers, and the OC/ASN curves (Wald and exact side by side).
 *
 * Method: Wald ASN(H0) = ((1-alpha) ln B + alpha ln A)/(-D(H0||H1)),
 * ASN(H1) = (beta ln B + (1-beta) ln A)/D(H1||H0), peak ASN = -ln A ln B / E[z^2] where E[z] = 0;
 * exact values by the forward recursion (createExactEvaluator); curve qualities evenly spaced over
 * the model's range.
 * References: Wald, A. (1947), Sequential Analysis, ch. 3; NIST/SEMATECH e-Handbook §6.2.6;
 * Wald 1947 OC/ASN formulas (computed independently), exact recursion over the integer lines (computed independently, checked by simulation), Montgomery §15.2.3 (first-hand), minimal plans computed independently.
 *
 * @throws PlanParameterError for an invalid spec or curvePoints.
 */
export function designLinearCountPlan(spec: LinearCountSpec, options: DesignOptions = {}): LinearCountDesign {
  const curvePoints = options.curvePoints ?? 51;
  if (!Number.isInteger(curvePoints) || curvePoints < 2 || curvePoints > 10001) {
    throw new PlanParameterError('curvePoints', curvePoints, 'an integer from 2 to 10001');
  }
  const plan = resolvePlan(spec);
  const { model, lines, lnA: waldLnA, lnB: waldLnB } = plan;
  const hypotheses = model.hypotheses(spec);
  const kl = model.klDivergences(spec);
  const evaluator = createExactEvaluator(lines, model.countStep);

  const atH0 = evaluator.sampleSizeDistribution(hypotheses.theta0);
  const atH1 = evaluator.sampleSizeDistribution(hypotheses.theta1);
  const single = singleSamplingPlan(model, spec);
  const neutralTheta = neutralQuality(model, spec);
  const neutral = waldPoint(model, spec, waldLnA, waldLnB, neutralTheta);

  const curve: CurvePoint[] = [];
  const range = model.curveRange(spec);
  for (let i = 0; i < curvePoints; i++) {
    const theta = range.from + ((range.to - range.from) * i) / (curvePoints - 1);
    const wald = waldPoint(model, spec, waldLnA, waldLnB, theta);
    const exact = evaluator.evaluate(theta);
    curve.push({ theta, ocWald: wald.oc, asnWald: wald.asn, ocExact: exact.accept, asnExact: exact.asn });
  }

  const threeTimesSingle = single === null ? null : LIMITS_SINGLE_MULTIPLE * single.n;
  const limitsLength = lines.truncation ?? threeTimesSingle ?? Math.ceil(3 * neutral.asn);
  return {
    boundaries: { lnA: lines.h2 * plan.countWeight, lnB: -lines.h1 * plan.countWeight, h1: lines.h1, h2: lines.h2, slope: lines.slope },
    kl,
    wald: {
      asnH0: ((1 - spec.alpha) * waldLnB + spec.alpha * waldLnA) / -kl.h0h1,
      asnH1: (spec.beta * waldLnB + (1 - spec.beta) * waldLnA) / kl.h1h0,
      asnMax: neutral.asn,
    },
    exact: {
      alpha: atH0.point.reject,
      beta: atH1.point.accept,
      asnH0: atH0.point.asn,
      asnH1: atH1.point.asn,
      undecided: Math.max(atH0.point.undecided, atH1.point.undecided),
      quantilesH0: sampleSizeQuantiles(atH0.probabilities),
      quantilesH1: sampleSizeQuantiles(atH1.probabilities),
    },
    single,
    limits: linearCountLimitRows(lines, limitsLength),
    curve,
    model: spec.model,
    quality: model.qualityName,
    hypotheses,
    risks: { alpha: spec.alpha, beta: spec.beta },
    truncation: lines.truncation,
    truncationRule: truncationRule(lines),
    suggestedTruncation: suggestedTruncation(lines, model.countStep, hypotheses, spec),
    threeTimesSingle,
    saving: single === null ? null : { h0: 1 - atH0.point.asn / single.n, h1: 1 - atH1.point.asn / single.n },
    fit: {
      mode: spec.fit ?? 'wald',
      waldH1: plan.waldLines.h1,
      waldH2: plan.waldLines.h2,
      h1: lines.h1,
      h2: lines.h2,
      feasible: plan.fit?.feasible ?? true,
    },
    neutral: { theta: neutralTheta, ocWald: neutral.oc, asnWald: neutral.asn },
    sampleSizeDistribution: { h0: Array.from(atH0.probabilities), h1: Array.from(atH1.probabilities) },
  };
}

/**
 * Acceptance/rejection numbers for n = 1..length; at the truncation the row holds the truncation rule.
 *
 * Method: Ac(n) = floor(s n - h1) (null while negative), Re(n) = ceil(s n + h2); at n_t accept at
 * most floor(s n_t), reject from one more.
 * References: NIST/SEMATECH e-Handbook §6.2.6 (the table form); NIST/SEMATECH e-Handbook §6.2.6 (first-hand) and exact recursion over the integer lines (computed independently, checked by simulation).
 */
export function linearCountLimitRows(lines: IntegerLines, length: number): LimitRow[] {
  const rows: LimitRow[] = [];
  const atTruncation = truncationAcceptanceNumber(lines);
  for (let n = 1; n <= length; n++) {
    if (atTruncation !== null && n === lines.truncation) {
      rows.push({ n, accept: atTruncation, reject: atTruncation + 1 });
    } else {
      rows.push({ n, accept: acceptanceNumber(lines, n), reject: rejectionNumber(lines, n) });
    }
  }
  return rows;
}

/**
 * The truncation rule in words.
 *
 * Method: at n_t accept iff LLR <= 0, i.e. cumulative count <= floor(s n_t).
 * References: exact recursion over the integer lines (computed independently, checked by simulation) (the rule is a stated choice).
 */
export function truncationRule(lines: IntegerLines): string {
  const atTruncation = truncationAcceptanceNumber(lines);
  if (atTruncation === null) return 'no truncation: inspection continues until a line is crossed';
  return (
    `at n = ${lines.truncation}, if no line has been crossed: accept if the cumulative count is at most ` +
    `${atTruncation} (LLR <= 0, count <= slope x n), otherwise reject`
  );
}
