import { PlanParameterError } from './errors.js';
import { createExactEvaluator } from './exactEvaluator.js';
import {
  acceptanceNumber,
  decisionAt,
  rawAcceptanceNumber,
  rejectionNumber,
  truncationAcceptanceNumber,
} from './integerLines.js';
import type { Decision, IntegerLines } from './integerLines.js';
import { resolvePlan } from './resolvePlan.js';
import type { ResolvedPlan } from './resolvePlan.js';
import type { LinearCountSpec } from './spec.js';
import { checkInteger } from './validate.js';
import { lookAhead, type LookAhead } from './lookAhead.js';

export interface LinearCountLiveState extends LookAhead {
  /** Absent: the pass/fail and count look-ahead has the shape it has always had; the other models name themselves. */
  readonly model?: undefined;
  n: number;
  total: number;
  decision: Decision;
  /** Which rule decided, in words; truncation decisions say "accept at truncation" / "reject at truncation". */
  rule: string;
  /** LLR = countWeight total - itemOffset n, in nats. */
  llr: number;
  acceptanceNumber: number | null;
  rejectionNumber: number;
  /** Items still needed for the earliest possible accept if all of them pass; 0 once accepted, null if impossible. */
  itemsToEarliestAccept: number | null;
  /** Items still needed for the earliest possible reject (pass/fail: all nonconforming; count: one unit). */
  itemsToEarliestReject: number | null;
  /** Nonconforming items (pass/fail) or nonconformities (count) still needed for that earliest reject. */
  nonconformingToReject: number | null;
  /** The current estimate of the quality: total / n (null before the first item). */
  estimate: number | null;
}

/** The decision alone, cheap enough for every entry of a replay. */
export interface QuickDecision {
  decision: Decision;
  rule: string;
  llr: number;
}

function checkState(plan: ResolvedPlan, n: number, total: number): void {
  checkInteger('n', n, 0);
  checkInteger('total', total, 0);
  if (plan.model.countStep === 'bernoulli' && total > n) {
    throw new PlanParameterError('total', total, `an integer from 0 to n = ${n}`);
  }
}

/**
 * The decision after n items with cumulative count `total`, without the exact look-ahead.
 *
 * Method: LLR = k total - b n; reject iff total >= Re(n), accept iff total <= Ac(n); at the truncation
 * accept iff total <= floor(s n_t).
 * References: Wald, A. (1947), Sequential Analysis, ch. 3; NIST/SEMATECH e-Handbook §6.2.6.
 */
export function decideLinearCount(spec: LinearCountSpec, n: number, total: number): QuickDecision {
  const plan = resolvePlan(spec);
  checkState(plan, n, total);
  const { decision, rule } = decisionAt(plan.lines, n, total);
  return { decision, rule, llr: plan.countWeight * total - plan.itemOffset * n };
}

function itemsToEarliestAccept(lines: IntegerLines, n: number, total: number): number | null {
  // Smallest m >= 1 with total <= Ac(n + m); start just below the line's solution, then step up.
  let m = Math.max(1, Math.floor((total + lines.h1) / lines.slope - n) - 1);
  while (rawAcceptanceNumber(lines, n + m) < total) m++;
  while (m > 1 && rawAcceptanceNumber(lines, n + m - 1) >= total) m--;
  if (lines.truncation === null || n + m <= lines.truncation) return m;
  return total <= (truncationAcceptanceNumber(lines) as number) ? lines.truncation - n : null;
}

function earliestReject(lines: IntegerLines, bernoulli: boolean, n: number, total: number): { items: number; count: number } {
  const atTruncation = truncationAcceptanceNumber(lines);
  if (!bernoulli) {
    // One unit can carry any number of nonconformities, so the next unit can reject.
    const needed = n + 1 === lines.truncation ? (atTruncation as number) + 1 : rejectionNumber(lines, n + 1);
    return { items: 1, count: needed - total };
  }
  // All of the next j items nonconforming: smallest j with total + j >= Re(n + j).
  let j = Math.max(1, Math.floor((lines.slope * n + lines.h2 - total) / (1 - lines.slope)) - 1);
  while (total + j < rejectionNumber(lines, n + j)) j++;
  while (j > 1 && total + j - 1 >= rejectionNumber(lines, n + j - 1)) j--;
  if (lines.truncation !== null && n + j >= lines.truncation) {
    const items = lines.truncation - n;
    return { items, count: Math.max(1, (atTruncation as number) + 1 - total) };
  }
  return { items: j, count: j };
}

/**
 * The live state of a run after n items with cumulative count `total`: decision, LLR, the shortest
 * ways to a decision, and the exact probability of eventually accepting and expected remaining items
 * under H0, H1 and the current estimate total / n.
 *
 * Method: decision as in `decide`; look-ahead by solving the line inequalities for the item count;
 * probabilities by the exact forward recursion started from (n, total).
 * References: Wald, A. (1947), Sequential Analysis, ch. 3; Aroian, L. A. (1968), "Sequential
 * analysis, direct method", Technometrics 10(1).
 *
 * @throws PlanParameterError for an invalid spec, n or total.
 */
export function linearCountLiveState(spec: LinearCountSpec, n: number, total: number): LinearCountLiveState {
  const plan = resolvePlan(spec);
  checkState(plan, n, total);
  const { lines, model } = plan;
  const { decision, rule } = decisionAt(lines, n, total);
  const { theta0, theta1 } = model.hypotheses(spec);
  const evaluator = createExactEvaluator(lines, model.countStep);
  const atH0 = evaluator.evaluateFrom(theta0, n, total);
  const atH1 = evaluator.evaluateFrom(theta1, n, total);
  const estimate = n > 0 ? Math.min(model.qualityUpperLimit, total / n) : null;
  const atEstimate = estimate === null ? null : evaluator.evaluateFrom(estimate, n, total);
  const reject = decision === 'continue' ? earliestReject(lines, model.countStep === 'bernoulli', n, total) : null;
  return {
    n,
    total,
    decision,
    rule,
    llr: plan.countWeight * total - plan.itemOffset * n,
    acceptanceNumber: acceptanceNumber(lines, n),
    rejectionNumber: rejectionNumber(lines, n),
    itemsToEarliestAccept:
      decision === 'accept' ? 0 : decision === 'reject' ? null : itemsToEarliestAccept(lines, n, total),
    itemsToEarliestReject: decision === 'reject' ? 0 : reject === null ? null : reject.items,
    nonconformingToReject: decision === 'reject' ? 0 : reject === null ? null : reject.count,
    estimate,
    ...lookAhead(atH0, atH1, atEstimate),
  };
}
