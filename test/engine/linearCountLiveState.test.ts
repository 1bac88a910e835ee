import { describe, expect, it } from 'vitest';
import { PlanParameterError, decideLinearCount, designLinearCountPlan, linearCountLiveState } from '../../src-main/engine/index.js';
import type { LinearCountSpec } from '../../src-main/engine/index.js';
import { nist } from './planFixtures.js';

const counts: LinearCountSpec = { model: 'count', lambda0: 1, lambda1: 2, alpha: 0.1, beta: 0.1 };

/** Feeds `result` repeatedly from (n, total) and returns how many items it took to decide `target`. */
function itemsUntil(spec: LinearCountSpec, n: number, total: number, result: number, target: 'accept' | 'reject'): number | null {
  for (let extra = 1; extra < 10_000; extra++) {
    const { decision } = decideLinearCount(spec, n + extra, total + extra * result);
    if (decision === target) return extra;
    if (decision !== 'continue') return null;
  }
  return null;
}

describe('linearCountLiveState', () => {
  it('at the start has the exact OC and ASN of the whole plan', () => {
    const design = designLinearCountPlan(nist, { curvePoints: 2 });
    const start = linearCountLiveState(nist, 0, 0);
    expect(start.decision).toBe('continue');
    expect(start.probabilityAcceptH0).toBeCloseTo(1 - design.exact.alpha, 11); // differs by the undecided remainder < 1e-12
    expect(start.probabilityAcceptH1).toBe(design.exact.beta);
    expect(start.expectedRemainingH0).toBeCloseTo(design.exact.asnH0, 10);
    expect(start.estimate).toBeNull();
    expect(start.probabilityAcceptEstimate).toBeNull();
  });

  it('counts the items to the earliest accept and reject the same way as feeding results one by one', () => {
    for (const [n, total] of [
      [0, 0],
      [10, 1],
      [30, 1],
      [60, 3],
      [100, 4],
    ]) {
      const state = linearCountLiveState(nist, n, total);
      expect(state.decision).toBe('continue');
      expect(state.itemsToEarliestAccept).toBe(itemsUntil(nist, n, total, 0, 'accept'));
      expect(state.itemsToEarliestReject).toBe(itemsUntil(nist, n, total, 1, 'reject'));
      expect(state.nonconformingToReject).toBe(state.itemsToEarliestReject);
    }
  });

  it('for count data asks for one more unit carrying enough nonconformities to reach the rejection number', () => {
    const state = linearCountLiveState(counts, 3, 4);
    // Lines of Poisson SPRT lines and exact recursion (computed independently; no published example): Re(4) = ceil(1.4427 x 4 + 3.1699) = 9.
    expect(state.itemsToEarliestReject).toBe(1);
    expect(state.nonconformingToReject).toBe(5);
    expect(decideLinearCount(counts, 4, 9).decision).toBe('reject');
    expect(decideLinearCount(counts, 4, 8).decision).toBe('continue');
  });

  it('reports the LLR in nats as k total - b n', () => {
    // NIST plan, NIST/SEMATECH e-Handbook §6.2.6 (first-hand): k = 2.39790 (ln), slope s = b / k = 0.039747.
    const state = linearCountLiveState(nist, 50, 2);
    expect(state.llr).toBeCloseTo(2 * 2.3979 - 50 * 0.039747 * 2.3979, 3);
  });

  it('names decisions at the truncation and leaves nothing remaining after them', () => {
    const truncated = { ...nist, truncation: 156 };
    const accepted = linearCountLiveState(truncated, 156, 6);
    expect(accepted.decision).toBe('accept');
    expect(accepted.rule).toMatch(/^accept at truncation/);
    expect(accepted.expectedRemainingH0).toBe(0);
    const rejected = linearCountLiveState(truncated, 156, 7);
    expect(rejected.rule).toMatch(/^reject at truncation/);
    expect(rejected.probabilityAcceptH0).toBe(0);
    // One item before the truncation the only ways left are the truncation rule or a line.
    const lastStep = linearCountLiveState(truncated, 155, 6);
    expect(lastStep.expectedRemainingH0).toBeCloseTo(1, 12);
    expect(lastStep.itemsToEarliestAccept).toBe(1);
  });

  it('rejects impossible states with a specific error', () => {
    expect(() => linearCountLiveState(nist, 5, 6)).toThrow(new PlanParameterError('total', 6, 'an integer from 0 to n = 5'));
    expect(() => linearCountLiveState(nist, -1, 0)).toThrow('n must be an integer >= 0 (got -1)');
    expect(() => linearCountLiveState(nist, 2.5, 0)).toThrow(PlanParameterError);
    expect(() => linearCountLiveState(counts, 1, 7)).not.toThrow();
  });
});
