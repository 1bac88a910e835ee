import { appendFile, mkdtemp, readFile, rm, writeFile } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { RunHistory } from '../../src-main/api/channels/recordChannels.js';
import type { SourceSummaryView } from '../../src-main/api/channels/sourceChannels.js';
import { createDispatcher, type Dispatch } from '../../src-main/api/dispatcher.js';
import { createHandlers } from '../../src-main/api/handlers/index.js';
import type { ChannelResult } from '../../src-main/api/result.js';
import type { CliIo, Command } from '../../src-main/cli/command.js';
import { runCommand } from '../../src-main/cli/command.js';
import { feedLines } from '../../src-main/cli/feed.js';
import { command as recordCommand } from '../../src-main/cli/record.js';
import { showCommand } from '../../src-main/cli/run.js';
import { command as verifyCommand } from '../../src-main/cli/verify.js';
import { createRunCatalogue, createRunService, type RunRow, type RunService } from '../../src-main/inspection/index.js';
import { PlanRepository, SourceRepository, layout, type PlanVersion, type Source } from '../../src-main/store/index.js';
import { passFailSpec, workspace } from './helpers.js';

function value<T>(result: ChannelResult<unknown>): T {
  if (!result.ok) throw new Error(`${result.code}: ${result.message}`);
  return result.value as T;
}

/** A command run in this process, with what it printed. */
async function cli(name: string, command: Command, args: readonly string[]): Promise<{ code: number; stdout: string; stderr: string }> {
  let stdout = '';
  let stderr = '';
  const io: CliIo = { stdout: (text) => void (stdout += text), stderr: (text) => void (stderr += text), readText: () => Promise.reject(new Error('no input')), inputLines: () => ({ lines: (async function* () {})(), close: () => undefined }) };
  const code = await runCommand(name, command, args, io);
  return { code, stdout, stderr };
}

/** A run of the passfail plan (p0 1 %, p1 10 %, 5 % risks) fed passes until its acceptance closes it. */
async function acceptedRun(service: RunService, source: Source, plan: PlanVersion): Promise<string> {
  const { run } = await service.startRun({ planId: plan.id, sourceId: source.id, lot: 'ACC-1', inspector: 'Ana' });
  for (let item = 0; item < 200; item += 1) {
    if ((await service.recordResult(run.id, { result: 'pass', actor: 'Ana' })).closedWith !== null) return run.id;
  }
  throw new Error('the run never accepted');
}

describe('the run catalogue', () => {
  it('names a run reopened after its decision "reopened" and keeps every decision and override with reason, actor and time', async () => {
    const { service, source, plan, data } = await workspace();
    const runId = await acceptedRun(service, source, plan);
    const catalogue = createRunCatalogue(data);
    expect((await catalogue.listRuns())[0]).toMatchObject({ runId, outcome: 'accepted', rule: expect.stringContaining('accept') });

    await service.overrideAfterDecision(runId, 'recount of the tray', 'Ben');
    // A nonconforming item takes the evidence back between the lines: the run stays open, no decision stands.
    expect((await service.recordResult(runId, { result: 'fail', actor: 'Ben' })).closedWith).toBeNull();
    const read = await catalogue.readRun(runId);
    expect(read.row).toMatchObject({ outcome: 'reopened', rule: null, endedAt: null, damage: null });
    expect(read.history).toEqual([
      expect.objectContaining({ kind: 'decision', decision: 'accept', actor: 'Ana', at: expect.stringMatching(/^\d{4}-\d\d-\d\dT/) }),
      expect.objectContaining({ kind: 'reopened', reason: 'recount of the tray', actor: 'Ben' }),
    ]);
    expect((await catalogue.listRuns({ outcome: 'reopened' })).map((row) => row.runId)).toEqual([runId]);
    expect(await catalogue.listRuns({ outcome: 'accepted' })).toEqual([]);
  });

  it('lists unchanged journals from memory and re-verifies only a journal that changed', async () => {
    const { service, source, plan, data } = await workspace();
    const ids: string[] = [];
    for (const lot of ['A', 'B', 'C']) ids.push((await service.startRun({ planId: plan.id, sourceId: source.id, lot })).run.id);
    const catalogue = createRunCatalogue(data);
    expect(await catalogue.listRuns()).toHaveLength(3);
    expect(catalogue.journalsRead).toBe(3);
    await catalogue.listRuns();
    expect(catalogue.journalsRead).toBe(3);

    await service.recordResult(ids[1], { result: 'fail', actor: 'Ana' });
    const rows = await catalogue.listRuns();
    expect(catalogue.journalsRead).toBe(4);
    expect(rows.find((row) => row.runId === ids[1])).toMatchObject({ itemsInspected: 1, nonconformingFound: 1 });

    // An edit that keeps the size is still seen: it changes the file's change time.
    const journal = layout.runJournal(data, ids[1]);
    await service.close();
    const text = await readFile(journal, 'utf8');
    await writeFile(journal, text.replace('"lot":"B"', '"lot":"D"'));
    expect((await catalogue.listRuns()).find((row) => row.runId === ids[1])).toMatchObject({ outcome: 'damaged', damage: { firstBadSeq: 0 } });
    expect(catalogue.journalsRead).toBe(5);
  });

  it('leaves a torn final line to be cut off on open: the run is listed by its outcome, the tear among its problems', async () => {
    const { service, source, plan, data } = await workspace();
    const { run } = await service.startRun({ planId: plan.id, sourceId: source.id, lot: 'T' });
    await service.recordResult(run.id, { result: 'pass', actor: 'Ana' });
    await service.close();
    await appendFile(layout.runJournal(data, run.id), '{"seq":2,"time":"2026-');
    const read = await createRunCatalogue(data).readRun(run.id);
    expect(read.row).toMatchObject({ outcome: 'open', itemsInspected: 1, damage: null });
    expect(read.problems).toEqual([expect.objectContaining({ seq: 2, kind: 'torn' })]);
  });
});

describe('a damaged journal among 20 good runs', () => {
  const RUNS = 20;
  let data: string;
  let sourceId: string;
  let damagedId: string;
  let journal: string;
  let original: string;
  let dispatch: Dispatch;

  beforeAll(async () => {
    data = await mkdtemp(path.join(os.tmpdir(), 'tallyline-damaged-'));
    const source = await new SourceRepository(data).create({ name: 'Kestrel Fasteners (invented)' });
    const plan = await new PlanRepository(data).save({ name: 'Incoming check', sourceId: source.id, spec: passFailSpec });
    sourceId = source.id;
    const service = createRunService({ dataDirectory: data });
    const ids: string[] = [];
    for (let index = 0; index < RUNS; index += 1) {
      const { run } = await service.startRun({ planId: plan.id, sourceId: source.id, lot: `KF-${index + 1}` });
      // seq 1 pass, seq 2 pass, seq 3 fail.
      for (const result of ['pass', 'pass', 'fail'] as const) await service.recordResult(run.id, { result, actor: 'Ana' });
      ids.push(run.id);
    }
    await service.close();
    damagedId = ids[6];
    journal = layout.runJournal(data, damagedId);
    original = await readFile(journal, 'utf8');
    dispatch = createDispatcher(createHandlers({ dataDirectory: data }));
  }, 60_000);
  afterAll(() => rm(data, { recursive: true, force: true }));

  /** The lists through the catalogue and through the Inspect, Records and Sources channels. */
  async function everyList(): Promise<Array<{ name: string; rows: readonly RunRow[] }>> {
    const history = value<RunHistory>(await dispatch('record.history', {}));
    const summary = value<SourceSummaryView>(await dispatch('source.summary', { id: sourceId }));
    return [
      { name: 'catalogue', rows: await createRunCatalogue(data).listRuns() },
      { name: 'inspection.list', rows: value<RunRow[]>(await dispatch('inspection.list', null)) },
      { name: 'record.history', rows: history.rows },
      { name: 'source.summary', rows: summary.runs },
    ];
  }

  /**
   * Every list shows the 19 good runs and the damaged one. A journal without its header no longer
   * names its source, so the source's summary cannot count it (`headerReadable` false).
   */
  async function expectOneDamaged(firstBadSeq: number, headerReadable: boolean): Promise<void> {
    for (const list of await everyList()) {
      const damaged = list.rows.filter((row) => row.outcome === 'damaged');
      const expected = list.name === 'source.summary' && !headerReadable ? [] : [[damagedId, firstBadSeq]];
      expect({ list: list.name, good: list.rows.length - damaged.length }).toEqual({ list: list.name, good: RUNS - 1 });
      expect({ list: list.name, damaged: damaged.map((row) => [row.runId, row.damage?.firstBadSeq]) }).toEqual({ list: list.name, damaged: expected });
      expect(list.rows.filter((row) => row.runId !== damagedId).every((row) => row.outcome === 'open' && row.itemsInspected === 3)).toBe(true);
    }
    const summary = value<SourceSummaryView>(await dispatch('source.summary', { id: sourceId }));
    expect(summary.summary).toMatchObject(headerReadable ? { runs: RUNS, open: RUNS - 1, damaged: 1 } : { runs: RUNS - 1, open: RUNS - 1, damaged: 0 });
  }

  describe('with a result changed to "maybe"', () => {
    beforeAll(() => writeFile(journal, original.replace(/("seq":2,.*?"result":)"pass"/, '$1"maybe"')));
    afterAll(() => writeFile(journal, original));

    it('lists 19 good runs and the damaged one with its first bad sequence, through the catalogue and every channel', async () => {
      expect(await readFile(journal, 'utf8')).toContain('"result":"maybe"');
      await expectOneDamaged(2, true);
    });

    it('keeps the good prefix readable and read-only', async () => {
      const read = await createRunCatalogue(data).readRun(damagedId);
      expect(read.entries.map((entry) => entry.seq)).toEqual([0, 1]);
      expect(read.row).toMatchObject({ lot: 'KF-7', itemsInspected: 1, outcome: 'damaged' });
      const opened = value<{ writable: boolean; outcome: string; entries: unknown[] }>(await dispatch('inspection.open', { runId: damagedId }));
      expect(opened).toMatchObject({ writable: false, outcome: 'damaged' });
      expect(opened.entries).toHaveLength(1);
      expect(await dispatch('inspection.record', { runId: damagedId, result: 'pass' })).toMatchObject({ ok: false, code: 'conflict', field: 'runId' });
      expect(await dispatch('record.pdf', { runId: damagedId })).toMatchObject({ ok: false, code: 'conflict' });
    });

    it('run show prints the good entries with the damage; record, feed and verify refuse in one line', async () => {
      const shown = await cli('run show', showCommand, ['--run', damagedId, '--data-dir', data, '--json']);
      expect(shown.code).toBe(0);
      expect(JSON.parse(shown.stdout)).toMatchObject({ outcome: 'damaged', writable: false, problems: [expect.objectContaining({ seq: 2 })] });
      const text = await cli('run show', showCommand, ['--run', damagedId, '--data-dir', data]);
      expect(text.stdout).toContain('Outcome: damaged from seq 2');

      const recorded = await cli('record', recordCommand, ['--run', damagedId, '--out', path.join(data, 'r.pdf'), '--data-dir', data]);
      expect(recorded.code).toBe(1);
      expect(recorded.stderr).toMatch(/^tallyline record: run \S+: the journal does not verify .*first at entry 2.*\n$/);
      const verified = await cli('verify', verifyCommand, ['--run', damagedId, '--data-dir', data]);
      expect(verified.code).toBe(1);
      expect(verified.stdout).toContain('chain does NOT verify');

      let stderr = '';
      const io: CliIo = { stdout: () => undefined, stderr: (line) => void (stderr += line), readText: () => Promise.reject(new Error('no input')), inputLines: () => ({ lines: (async function* () {})(), close: () => undefined }) };
      const service = createRunService({ dataDirectory: data });
      try {
        const code = await feedLines(service, (async function* () { yield 'pass'; })(), { runId: damagedId, json: true }, io);
        expect(code).toBe(1);
        expect(stderr).toMatch(/^tallyline feed: run \S+ is damaged from seq 2 .*never written\n$/);
      } finally {
        await service.close();
      }
    });
  });

  describe('with its first line deleted', () => {
    beforeAll(() => writeFile(journal, original.slice(original.indexOf('\n') + 1)));
    afterAll(() => writeFile(journal, original));

    it('lists 19 good runs and the damaged one from seq 0, through the catalogue and every channel', async () => {
      await expectOneDamaged(0, false);
      const row = (await createRunCatalogue(data).listRuns({ outcome: 'damaged' }))[0];
      expect(row).toMatchObject({ runId: damagedId, lot: null, sourceId: null, startedAt: null });
    });

    it('answers one line from run show, record and feed, and a conflict from the channels', async () => {
      const shown = await cli('run show', showCommand, ['--run', damagedId, '--data-dir', data]);
      expect(shown.code).toBe(1);
      expect(shown.stderr).toMatch(/^tallyline run show: run \S+ is damaged from seq 0 .*nothing of it can be read\n$/);
      const recorded = await cli('record', recordCommand, ['--run', damagedId, '--out', path.join(data, 'r.pdf'), '--data-dir', data]);
      expect(recorded.code).toBe(1);
      expect(recorded.stderr.split('\n')).toHaveLength(2);

      let stderr = '';
      const io: CliIo = { stdout: () => undefined, stderr: (line) => void (stderr += line), readText: () => Promise.reject(new Error('no input')), inputLines: () => ({ lines: (async function* () {})(), close: () => undefined }) };
      const service = createRunService({ dataDirectory: data });
      try {
        expect(await feedLines(service, (async function* () { yield 'pass'; })(), { runId: damagedId, json: true }, io)).toBe(1);
        expect(stderr).toMatch(/^tallyline feed: run \S+ is damaged from seq 0 .*\n$/);
      } finally {
        await service.close();
      }
      const opened = await dispatch('inspection.open', { runId: damagedId });
      expect(opened).toMatchObject({ ok: false, code: 'conflict', field: 'runId' });
      expect(opened.ok === false && opened.message).toMatch(/^Run \S+ is damaged from seq 0/);
    });
  });
});
