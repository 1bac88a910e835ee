import { readFile, writeFile } from 'node:fs/promises';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { RecordChannelOutputs, RecordRunView } from '../../src-main/api/channels/recordChannels.js';
import { createDispatcher, type Dispatch } from '../../src-main/api/dispatcher.js';
import { createHandlers } from '../../src-main/api/handlers/index.js';
import type { ChannelResult } from '../../src-main/api/result.js';
import type { RunHistory } from '../../src-main/api/channels/recordChannels.js';
import { layout } from '../../src-main/store/index.js';
import type { ResultInput } from '../../src-main/inspection/index.js';
import { incomingSpec, passes, recordWorkspace, sourceWithPlan, type RecordWorkspace } from '../record/fromRunFixtures.js';

function value<T>(result: ChannelResult<unknown>): T {
  if (!result.ok) throw new Error(`expected success, got ${result.code}: ${result.message}`);
  return result.value as T;
}

/**
 * Seven runs, hand-counted (all names invented). Each starts at noon UTC, so its start date is the
 * same under any UTC offset of the test machine up to +/-11 h. Plan p0 1 %, p1 10 %, 5 % risks:
 * 31 passes accept; 2 nonconforming in the first 2 items reject (engine's decide).
 *
 *   #  source                       start        decision   n   nonconforming
 *   1  Kestrel Fasteners (inv.)     2025-03-03   accept     31  0
 *   2  Kestrel Fasteners (inv.)     2025-03-10   reject      2  2
 *   3  Kestrel Fasteners (inv.)     2025-03-20   undecided   5  0
 *   4  Brightwater Plastics (inv.)  2025-03-05   accept     31  0
 *   5  Brightwater Plastics (inv.)  2025-03-12   reject      2  2
 *   6  Brightwater Plastics (inv.)  2025-04-02   accept     31  0
 *   7  Fenwick Moulding (inv.)      2025-04-15   undecided   3  1
 */
const FIXTURE = [
  { source: 'Kestrel Fasteners (invented)', day: '2025-03-03', lot: 'KF-1', results: 'accept' },
  { source: 'Kestrel Fasteners (invented)', day: '2025-03-10', lot: 'KF-2', results: 'reject' },
  { source: 'Kestrel Fasteners (invented)', day: '2025-03-20', lot: 'KF-3', results: 'open' },
  { source: 'Brightwater Plastics (invented)', day: '2025-03-05', lot: 'BW-1', results: 'accept' },
  { source: 'Brightwater Plastics (invented)', day: '2025-03-12', lot: 'BW-2', results: 'reject' },
  { source: 'Brightwater Plastics (invented)', day: '2025-04-02', lot: 'BW-3', results: 'accept' },
  { source: 'Fenwick Moulding (invented)', day: '2025-04-15', lot: 'FM-1', results: 'open-with-failure' },
] as const;

function resultsFor(kind: (typeof FIXTURE)[number]['results'], lot: string): ResultInput[] {
  const actor = 'J. Marlow';
  switch (kind) {
    case 'accept':
      return [...passes(lot, 31, actor)];
    case 'reject':
      return [{ itemId: `${lot}-1`, result: 'fail', actor }, { itemId: `${lot}-2`, result: 'fail', actor }];
    case 'open':
      return [...passes(lot, 5, actor)];
    case 'open-with-failure':
      return [...passes(lot, 2, actor), { itemId: `${lot}-3`, result: 'fail', category: 'short shot', actor }];
  }
}

describe('the record channels over a hand-counted history', () => {
  let space: RecordWorkspace;
  let dispatch: Dispatch;
  const runIds = new Map<string, string>();
  const sourceIds = new Map<string, string>();
  let at = 0;

  beforeAll(async () => {
    space = await recordWorkspace(() => new Date((at += 20_000)));
    for (const run of FIXTURE) {
      at = Date.parse(`${run.day}T12:00:00.000Z`);
      const { source, plan } = await sourceWithPlan(space, run.source, 'Incoming check', incomingSpec);
      sourceIds.set(run.source, source.id);
      const started = await space.service.startRun({ planId: plan.id, sourceId: source.id, lot: run.lot, inspector: 'J. Marlow' });
      for (const result of resultsFor(run.results, run.lot)) await space.service.recordResult(started.run.id, result);
      runIds.set(run.lot, started.run.id);
    }
    dispatch = createDispatcher(createHandlers({ dataDirectory: space.data }));
  }, 60_000);
  afterAll(() => space.cleanup());

  async function lots(filter: object): Promise<string[]> {
    const history = value<RunHistory>(await dispatch('record.history', filter));
    return history.rows.map((row) => row.lot ?? '');
  }

  it('lists every run, newest start first, with source, lot, plan, dates, outcome and counts', async () => {
    const history = value<RunHistory>(await dispatch('record.history', {}));
    expect(history.totalRuns).toBe(7);
    expect(history.rows.map((row) => row.lot)).toEqual(['FM-1', 'BW-3', 'KF-3', 'BW-2', 'KF-2', 'BW-1', 'KF-1']);
    expect(history.sources.map((source) => source.name)).toEqual(['Brightwater Plastics (invented)', 'Fenwick Moulding (invented)', 'Kestrel Fasteners (invented)']);
    const kf2 = history.rows.find((row) => row.lot === 'KF-2')!;
    expect(kf2).toMatchObject({
      runId: runIds.get('KF-2'),
      sourceName: 'Kestrel Fasteners (invented)',
      planName: 'Incoming check',
      planVersion: 1,
      outcome: 'rejected',
      itemsInspected: 2,
      nonconformingFound: 2,
      damage: null,
    });
    expect(kf2.startedAt?.slice(0, 10)).toBe('2025-03-10');
    expect(kf2.endedAt).not.toBeNull();
    expect(history.rows.find((row) => row.lot === 'KF-1')).toMatchObject({ outcome: 'accepted', itemsInspected: 31, nonconformingFound: 0 });
    expect(history.rows.find((row) => row.lot === 'FM-1')).toMatchObject({ outcome: 'open', endedAt: null, itemsInspected: 3, nonconformingFound: 1, rule: null });
  });

  it('filters by source', async () => {
    expect(await lots({ sourceId: sourceIds.get('Kestrel Fasteners (invented)') })).toEqual(['KF-3', 'KF-2', 'KF-1']);
    expect(await lots({ sourceId: sourceIds.get('Fenwick Moulding (invented)') })).toEqual(['FM-1']);
    expect(await lots({ sourceId: 'src-19990101-00000000' })).toEqual([]);
  });

  it('filters by outcome', async () => {
    expect(await lots({ outcome: 'accepted' })).toEqual(['BW-3', 'BW-1', 'KF-1']);
    expect(await lots({ outcome: 'rejected' })).toEqual(['BW-2', 'KF-2']);
    expect(await lots({ outcome: 'open' })).toEqual(['FM-1', 'KF-3']);
  });

  it('filters by period on the start date, both ends included', async () => {
    expect(await lots({ from: '2025-03-01', to: '2025-03-31' })).toEqual(['KF-3', 'BW-2', 'KF-2', 'BW-1', 'KF-1']);
    expect(await lots({ from: '2025-03-10', to: '2025-03-12' })).toEqual(['BW-2', 'KF-2']);
    expect(await lots({ from: '2025-04-01' })).toEqual(['FM-1', 'BW-3']);
    expect(await lots({ to: '2025-03-04' })).toEqual(['KF-1']);
  });

  it('combines the filters', async () => {
    expect(await lots({ sourceId: sourceIds.get('Kestrel Fasteners (invented)'), from: '2025-03-01', to: '2025-03-31', outcome: 'accepted' })).toEqual(['KF-1']);
    expect(await lots({ sourceId: sourceIds.get('Brightwater Plastics (invented)'), outcome: 'rejected' })).toEqual(['BW-2']);
    expect(await lots({ sourceId: sourceIds.get('Brightwater Plastics (invented)'), outcome: 'open' })).toEqual([]);
  });

  it('refuses a malformed date and a period that ends before it starts, naming the field', async () => {
    expect(await dispatch('record.history', { from: '03/01/2025' })).toMatchObject({ ok: false, code: 'invalid-payload', field: 'from' });
    expect(await dispatch('record.history', { from: '2025-04-01', to: '2025-03-01' })).toMatchObject({
      ok: false,
      code: 'invalid-payload',
      field: 'to',
      message: 'to: The period ends before it starts.',
    });
    expect(await dispatch('record.history', { outcome: 'maybe' })).toMatchObject({ ok: false, code: 'invalid-payload', field: 'outcome' });
  });

  it('record.open shows a decided run read-only with its evidence path, steps and sequential estimate', async () => {
    const view = value<RecordRunView>(await dispatch('record.open', { runId: runIds.get('KF-2') }));
    expect(view.interim).toBe(false);
    expect(view.decision).toMatchObject({ state: 'reject', itemsInspected: 2, nonconformingFound: 2 });
    expect(view.entries.map((entry) => entry.after)).toEqual([
      { n: 1, total: 1, llr: expect.closeTo(Math.log(0.1 / 0.01), 9) },
      // Two nonconforming: 2 ln(p1/p0) = 2 ln 10 = 4.6052 >= ln A = ln 19 = 2.9444 (Wald 1947, worked by hand).
      { n: 2, total: 2, llr: expect.closeTo(2 * Math.log(10), 9) },
    ]);
    expect(view.frame.limits[1]).toEqual({ n: 2, accept: null, reject: 2 });
    expect(view.frame.lnA).toBeCloseTo(Math.log(19), 9);
    expect(view.estimate?.pointEstimateName).toBe('bias-adjusted');
    expect(view.estimate?.methodName).toContain('Whitehead 1986');
  });

  it('record.open leaves an undecided run writable: it takes no lock', async () => {
    const runId = runIds.get('FM-1')!;
    const view = value<RecordRunView>(await dispatch('record.open', { runId }));
    expect(view.interim).toBe(true);
    expect(view.estimate?.methodName).toMatch(/^Interim, the run is undecided: Naive fraction/);
    await space.service.recordResult(runId, { itemId: 'FM-1-4', result: 'pass', actor: 'J. Marlow' });
    expect(value<RecordRunView>(await dispatch('record.open', { runId })).decision.itemsInspected).toBe(4);
  });

  it('record.pdf answers the record as base64 PDF bytes with a file name naming the lot; record.csv the entries', async () => {
    const pdf = value<RecordChannelOutputs['record.pdf']>(await dispatch('record.pdf', { runId: runIds.get('BW-1') }));
    expect(Buffer.from(pdf.base64, 'base64').subarray(0, 5).toString('latin1')).toBe('%PDF-');
    expect(pdf.fileName).toMatch(/^record-BW-1-DR-[0-9a-f]{8}-[0-9a-f]{8}\.pdf$/);
    expect(pdf.interim).toBe(false);
    const interim = value<RecordChannelOutputs['record.pdf']>(await dispatch('record.pdf', { runId: runIds.get('KF-3') }));
    expect(interim).toMatchObject({ interim: true, fileName: expect.stringMatching(/^interim-record-KF-3-/) });
    const csv = value<RecordChannelOutputs['record.csv']>(await dispatch('record.csv', { runId: runIds.get('KF-2') }));
    expect(csv.text.split('\r\n')).toHaveLength(1 + 2 + 1);
    expect(csv.fileName).toMatch(/^entries-KF-2-DR-.*\.csv$/);
  }, 30_000);

  it('answers not-found for a missing run and conflict for a journal that no longer verifies', async () => {
    expect(await dispatch('record.pdf', { runId: 'run-19990101-00000000' })).toMatchObject({ ok: false, code: 'not-found', field: 'runId' });
    const runId = runIds.get('BW-3')!;
    const journal = layout.runJournal(space.data, runId);
    const original = await readFile(journal, 'utf8');
    await writeFile(journal, original.replace('"itemId":"BW-3-0005","result":"pass"', '"itemId":"BW-3-0005","result":"fail"'));
    try {
      const refused = await dispatch('record.pdf', { runId });
      expect(refused).toMatchObject({ ok: false, code: 'conflict', field: 'runId' });
      expect(refused.ok === false && refused.message).toMatch(/the journal does not verify .*entry 5/);
      // History still lists it, as damaged from the edited entry, so the damage is seen.
      const history = value<RunHistory>(await dispatch('record.history', { outcome: 'damaged' }));
      expect(history.rows.map((row) => row.lot)).toEqual(['BW-3']);
      expect(history.rows[0].damage).toMatchObject({ firstBadSeq: 5 });
    } finally {
      await writeFile(journal, original);
    }
  });
});
