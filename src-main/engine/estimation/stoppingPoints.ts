import { PlanParameterError } from '../errors.js';
import { rawAcceptanceNumber, rejectionNumber } from '../integerLines.js';
import type { IntegerLines } from '../integerLines.js';
import type { CountStep } from '../models/linearCountDefinition.js';
import { StagewiseSide } from './stagewiseOrder.js';

/** The stopping points of a plan at one item count: which cumulative counts can end the run there. */
export interface StoppingPointsAt {
  itemCount: number;
  /** Counts that accept at this item count (before truncation), as an inclusive range, or null. */
  accept: { from: number; to: number } | null;
  /** Counts that reject here; `to` is Infinity for the count model (a unit can bring any number). */
  reject: { from: number; to: number } | null;
  /** At the truncation count: every reachable count stops; the rule decides accept or reject. */
  truncation: { from: number; to: number } | null;
  /** Counts still undecided after this item count (reachable and between the lines), or null. */
  undecided: { from: number; to: number } | null;
}

function range(from: number, to: number): { from: number; to: number } | null {
  return from <= to ? { from, to } : null;
}

/**
 * The reachable stopping points at item count n: which counts accept, reject or stop at truncation.
 *
 * Method: the counts still undecided after k items form one interval [low, high] (the count moves up
 * by 0 or 1 per item, or by any number of nonconformities per unit, and the lines cut an interval);
 * after item k+1 the reachable counts are [low, high + 1] (or [low, infinity) for counts per unit),
 * those <= Ac(k+1) accept, those >= Re(k+1) reject, and at the truncation count all stop.
 * References: Wald, A. (1947), Sequential Analysis, Wiley, ch. 5; NIST/SEMATECH e-Handbook of
 * Statistical Methods (2012), §6.2.6 (acceptance and rejection numbers).
 */
export function stoppingPointsAt(lines: IntegerLines, countStep: CountStep, itemCount: number): StoppingPointsAt {
  let low = 0;
  let high = 0;
  const none: StoppingPointsAt = { itemCount, accept: null, reject: null, truncation: null, undecided: null };
  for (let n = 1; n <= itemCount; n++) {
    if (low > high) return none; // every run has stopped before n
    const reachableHigh = countStep === 'bernoulli' ? high + 1 : Number.POSITIVE_INFINITY;
    const acceptance = rawAcceptanceNumber(lines, n);
    const rejection = rejectionNumber(lines, n);
    if (n === itemCount) {
      if (lines.truncation !== null && n >= lines.truncation) {
        return { ...none, truncation: range(low, reachableHigh) };
      }
      return {
        itemCount,
        accept: range(low, Math.min(acceptance, reachableHigh)),
        reject: range(Math.max(low, rejection), reachableHigh),
        truncation: null,
        undecided: range(Math.max(low, acceptance + 1), Math.min(reachableHigh, rejection - 1)),
      };
    }
    if (lines.truncation !== null && n >= lines.truncation) return none;
    low = Math.max(low, acceptance + 1);
    high = Math.min(reachableHigh, rejection - 1);
  }
  return none;
}

/** The side of a point in the stagewise ordering, or null when (n, total) is not a stopping point. */
export function stoppingSide(points: StoppingPointsAt, total: number): StagewiseSide | null {
  const inside = (r: { from: number; to: number } | null): boolean => r !== null && total >= r.from && total <= r.to;
  if (inside(points.truncation)) return StagewiseSide.truncation;
  if (inside(points.accept)) return StagewiseSide.accept;
  if (inside(points.reject)) return StagewiseSide.reject;
  return null;
}

function describe(r: { from: number; to: number }): string {
  if (r.to === Number.POSITIVE_INFINITY) return `${r.from} or more`;
  return r.from === r.to ? `${r.from}` : `${r.from} to ${r.to}`;
}

/**
 * Checks that (n, total) ends a run of this plan and returns its stagewise side; otherwise throws a
 * PlanParameterError that says which counts would stop the run at n (or that none can).
 *
 * Method: stoppingPointsAt at n, then membership of total in its ranges.
 * References: Jennison, C. and Turnbull, B. W. (2000), Group Sequential Methods with Applications
 * to Clinical Trials, §8.4 (the sample space of a sequential test is its set of stopping points).
 */
export function checkStoppingPoint(lines: IntegerLines, countStep: CountStep, itemCount: number, total: number): StagewiseSide {
  if (typeof itemCount !== 'number' || !Number.isInteger(itemCount) || itemCount < 1) {
    throw new PlanParameterError('n', itemCount, 'an integer >= 1 (the item count at which the run stopped)');
  }
  const upper = countStep === 'bernoulli' ? itemCount : Number.POSITIVE_INFINITY;
  if (typeof total !== 'number' || !Number.isInteger(total) || total < 0 || total > upper) {
    const allowed = countStep === 'bernoulli' ? `an integer from 0 to n = ${itemCount}` : 'an integer >= 0';
    throw new PlanParameterError('total', total, allowed);
  }
  const points = stoppingPointsAt(lines, countStep, itemCount);
  const side = stoppingSide(points, total);
  if (side !== null) return side;
  const here = `(n = ${itemCount}, total = ${total}) is not a stopping point of this plan`;
  const parts: string[] = [];
  if (points.accept !== null) parts.push(`total ${describe(points.accept)} (accept)`);
  if (points.reject !== null) parts.push(`total ${describe(points.reject)} (reject)`);
  if (points.truncation !== null) parts.push(`total ${describe(points.truncation)} (decided at truncation)`);
  let message: string;
  if (parts.length === 0) {
    message =
      lines.truncation !== null && itemCount > lines.truncation
        ? `${here}: the plan is truncated at n = ${lines.truncation}, so every run has stopped by then`
        : `${here}: no run of this plan can stop at n = ${itemCount}`;
  } else {
    message = `${here}: at n = ${itemCount} a run stops only at ${parts.join(' or ')}`;
    const undecided = points.undecided;
    if (undecided !== null && total >= undecided.from && total <= undecided.to) message += '; this point is still undecided';
    else message += '; this point cannot be reached, or the run would have stopped earlier';
  }
  throw new PlanParameterError('total', total, 'a count at which the plan stops at n', message);
}
