import { describe, expect, it } from 'vitest';
import { POOLING_CAVEAT, summariseSource, type SummaryRun } from '../../src-main/history/index.js';

/** A run of the fixture; the fields the summary ignores are filled the same way for every run. */
function run(runId: string, startedAt: string, fields: Partial<SummaryRun>): SummaryRun {
  return { runId, startedAt, model: 'passfail', outcome: 'accepted', itemsInspected: 0, nonconformingFound: 0, ...fields };
}

// Hand-counted fixture (common practice, no source): seven runs of one source, given out of order.
//   r1 02-01 accept  40 items 0 nc  passfail
//   r2 02-03 reject  12 items 3 nc  passfail
//   r3 02-05 accept  30 items 1 nc  passfail
//   r4 02-04 open    9 items  1 nc  passfail  (still inspecting)
//   r5 02-08 reject  10 items 6 nc  count     (nonconformities)
//   r6 02-06 reopened 25 items 0 nc passfail  (accepted, then reopened by an override)
//   r7 02-07 damaged  5 items  0 nc passfail  (its journal does not verify after 5 items)
const fixture: SummaryRun[] = [
  run('r3', '2026-02-05T08:00:00.000Z', { itemsInspected: 30, nonconformingFound: 1 }),
  run('r1', '2026-02-01T08:00:00.000Z', { itemsInspected: 40 }),
  run('r5', '2026-02-08T08:00:00.000Z', { model: 'count', outcome: 'rejected', itemsInspected: 10, nonconformingFound: 6 }),
  run('r2', '2026-02-03T08:00:00.000Z', { outcome: 'rejected', itemsInspected: 12, nonconformingFound: 3 }),
  run('r4', '2026-02-04T08:00:00.000Z', { outcome: 'open', itemsInspected: 9, nonconformingFound: 1 }),
  run('r6', '2026-02-06T08:00:00.000Z', { outcome: 'reopened', itemsInspected: 25 }),
  run('r7', '2026-02-07T08:00:00.000Z', { outcome: 'damaged', itemsInspected: 5 }),
];

describe('summariseSource', () => {
  it('counts accepted, rejected, open and damaged runs, items and nonconforming over every run', () => {
    const summary = summariseSource(fixture);
    // accepted r1 r3 = 2; rejected r2 r5 = 2; open r4 r6 = 2 (r6 stands reopened, so its accept does not stand); damaged r7.
    expect(summary).toMatchObject({ runs: 7, accepted: 2, rejected: 2, open: 2, damaged: 1 });
    // items 40 + 12 + 30 + 9 + 10 + 25 + 5 = 131; nonconforming 0 + 3 + 1 + 1 + 6 + 0 + 0 = 11.
    expect(summary.itemsInspected).toBe(131);
    expect(summary.nonconformingFound).toBe(11);
    expect(summary.firstRunAt).toBe('2026-02-01T08:00:00.000Z');
    expect(summary.lastRunAt).toBe('2026-02-08T08:00:00.000Z');
  });

  it('pools decided runs per data model, never adding a fraction to a rate', () => {
    const { pooled } = summariseSource(fixture);
    expect(pooled).toEqual([
      // count: r5 alone, 6 / 10.
      { model: 'count', runs: 1, itemsInspected: 10, nonconformingFound: 6, pooled: 0.6, unit: 'nonconformities per item' },
      // passfail decided: r1 r2 r3, (0 + 3 + 1) / (40 + 12 + 30) = 4 / 82.
      { model: 'passfail', runs: 3, itemsInspected: 82, nonconformingFound: 4, pooled: 4 / 82, unit: 'fraction nonconforming' },
    ]);
  });

  it('gives the running counts of decisions in the order the runs started', () => {
    const { trend } = summariseSource(fixture);
    // Decided in start order: r1 accept, r2 reject, r3 accept, r5 reject.
    expect(trend.time).toEqual(['2026-02-01', '2026-02-03', '2026-02-05', '2026-02-08'].map((day) => Date.parse(`${day}T08:00:00.000Z`) / 1000));
    expect(trend.acceptedSoFar).toEqual([1, 1, 2, 2]);
    expect(trend.rejectedSoFar).toEqual([0, 1, 1, 2]);
  });

  it('summarises a source without runs as zeros, no pooled figure and an empty trend', () => {
    expect(summariseSource([])).toEqual({
      runs: 0, accepted: 0, rejected: 0, open: 0, damaged: 0, itemsInspected: 0, nonconformingFound: 0,
      firstRunAt: null, lastRunAt: null, pooled: [], trend: { time: [], acceptedSoFar: [], rejectedSoFar: [] },
    });
  });

  it('gives a null pooled figure when decided runs inspected no item', () => {
    expect(summariseSource([run('r0', '2026-02-01T00:00:00.000Z', {})]).pooled[0].pooled).toBeNull();
  });

  it('states the caveat that a stopping rule biases naive pooling', () => {
    expect(POOLING_CAVEAT).toMatch(/biased/);
    expect(POOLING_CAVEAT).toMatch(/bias-adjusted/);
  });
});
