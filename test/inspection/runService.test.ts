import { describe, expect, it } from 'vitest';
import { linearCountLiveState } from '../../src-main/engine/index.js';
import { createRunCatalogue, createRunService, RunClosedError, RunNotWritableError } from '../../src-main/inspection/index.js';
import { PlanRepository, layout, verifyJournal } from '../../src-main/store/index.js';
import { appendFile, readFile, writeFile } from 'node:fs/promises';
import { countSpec, passFailSpec, workspace } from './helpers.js';

describe('the run service', () => {
  it('starts a run on a plan version and source and writes its journal header', async () => {
    const { service, source, plan, data } = await workspace();
    const view = await service.startRun({ planId: plan.id, sourceId: source.id, lot: 'L-1042', lotSize: 500, inspector: 'Ana' });
    expect(view.run).toMatchObject({ planId: plan.id, planVersion: 1, sourceId: source.id, lot: 'L-1042', lotSize: 500, status: 'open' });
    expect(view.state).toMatchObject({ decision: 'continue', n: 0, total: 0 });
    expect(await verifyJournal(layout.runJournal(data, view.run.id))).toMatchObject({ ok: true, entries: 1 });
  });

  it('keeps the state equal to the engine on the counted results', async () => {
    const { service, source, plan } = await workspace();
    const { run } = await service.startRun({ planId: plan.id, sourceId: source.id, lot: 'L' });
    const results = ['pass', 'fail', 'pass', 'pass'] as const;
    let last;
    for (const result of results) last = await service.recordResult(run.id, { result, actor: 'Ana' });
    const engine = linearCountLiveState(passFailSpec, 4, 1);
    expect(last?.state).toMatchObject({ decision: engine.decision, n: 4, total: 1, llr: engine.llr });
  });

  it('closes the run with the decision and rule when the statistics reach one, and refuses more results', async () => {
    const { service, source, plan } = await workspace();
    const { run } = await service.startRun({ planId: plan.id, sourceId: source.id, lot: 'L' });
    let outcome;
    do outcome = await service.recordResult(run.id, { result: 'fail', actor: 'Ana' });
    while (outcome.closedWith === null && outcome.state.n < 100);
    expect(outcome.closedWith?.decision).toBe('reject');
    const reopened = (await service.openRun(run.id)).run;
    expect(reopened).toMatchObject({ status: 'closed', decision: 'reject' });
    expect(reopened.rule).toBeTruthy();
    await expect(service.recordResult(run.id, { result: 'pass', actor: 'Ana' })).rejects.toBeInstanceOf(RunClosedError);
    await expect(service.voidLastEntry(run.id, 'typo', 'Ana')).rejects.toBeInstanceOf(RunClosedError);
  });

  it('takes results after a decision only once an override with a reason is recorded', async () => {
    const { service, source, plan } = await workspace();
    const { run } = await service.startRun({ planId: plan.id, sourceId: source.id, lot: 'L' });
    let outcome;
    do outcome = await service.recordResult(run.id, { result: 'fail', actor: 'Ana' });
    while (outcome.closedWith === null);
    await expect(service.overrideAfterDecision(run.id, '  ', 'Ana')).rejects.toThrow(/reason/);
    await service.overrideAfterDecision(run.id, 'customer asked for the full lot', 'Ana');
    const after = await service.recordResult(run.id, { result: 'pass', actor: 'Ana' });
    expect(after.seq).toBeGreaterThan(outcome.seq);
  });

  it('voids the last counted entry with a reason, keeps it visible, and leaves it out of the statistics', async () => {
    const { service, source, plan } = await workspace();
    const { run } = await service.startRun({ planId: plan.id, sourceId: source.id, lot: 'L' });
    await service.recordResult(run.id, { result: 'pass', actor: 'Ana' });
    await service.recordResult(run.id, { result: 'fail', itemId: 'SN-7', category: 'burr', actor: 'Ana' });
    const voided = await service.voidLastEntry(run.id, 'scanned the wrong part', 'Ana');
    expect(voided.state).toMatchObject({ n: 1, total: 0 });
    const view = await service.openRun(run.id);
    expect(view.entries.map((entry) => [entry.seq, entry.result, entry.voided, entry.voidReason])).toEqual([
      [1, 'pass', false, null],
      [2, 'fail', true, 'scanned the wrong part'],
    ]);
    await service.voidLastEntry(run.id, 'also wrong', 'Ana');
    expect((await service.openRun(run.id)).entries.map((entry) => entry.voided)).toEqual([true, true]);
    await expect(service.voidLastEntry(run.id, 'nothing left', 'Ana')).rejects.toThrow(/no counted result/);
  });

  it('reopens an unfinished run in a new service exactly where it stopped', async () => {
    const { service, source, plan, data } = await workspace();
    const { run } = await service.startRun({ planId: plan.id, sourceId: source.id, lot: 'L' });
    await service.recordResult(run.id, { result: 'pass', actor: 'Ana' });
    await service.recordResult(run.id, { result: 'fail', actor: 'Ana', note: 'crack' });
    const before = await service.openRun(run.id);
    await service.close();
    const second = createRunService({ dataDirectory: data });
    try {
      const after = await second.openRun(run.id);
      expect(after).toEqual(before);
      expect((await second.recordResult(run.id, { result: 'pass', actor: 'Ben' })).seq).toBe(3);
    } finally {
      await second.close();
    }
  });

  it('refuses a result that does not fit the plan model', async () => {
    const passFail = await workspace();
    const started = await passFail.service.startRun({ planId: passFail.plan.id, sourceId: passFail.source.id, lot: 'L' });
    await expect(passFail.service.recordResult(started.run.id, { result: 2, actor: 'A' })).rejects.toThrow(/passfail/);
    const count = await workspace(countSpec);
    const countRun = await count.service.startRun({ planId: count.plan.id, sourceId: count.source.id, lot: 'L' });
    await expect(count.service.recordResult(countRun.run.id, { result: 'fail', actor: 'A' })).rejects.toThrow(/count plan/);
    expect((await count.service.recordResult(countRun.run.id, { result: 3, actor: 'A' })).state.total).toBe(3);
  });

  it('keeps running on the plan version it started with after the plan is edited', async () => {
    const { service, source, plan, data } = await workspace();
    const { run } = await service.startRun({ planId: plan.id, sourceId: source.id, lot: 'L' });
    await new PlanRepository(data).save({ id: plan.id, name: plan.name, spec: { ...passFailSpec, p1: 0.2 } });
    const view = await service.openRun(run.id);
    expect(view.plan).toMatchObject({ version: 1, spec: passFailSpec });
  });

  it('opens a tampered run read-only, naming the first bad seq, and refuses to write to it', async () => {
    const { service, source, plan, data } = await workspace();
    const { run } = await service.startRun({ planId: plan.id, sourceId: source.id, lot: 'L' });
    for (let index = 0; index < 4; index += 1) await service.recordResult(run.id, { result: 'pass', actor: 'Ana' });
    await service.close();
    const journal = layout.runJournal(data, run.id);
    const lines = (await readFile(journal, 'utf8')).split('\n');
    lines[2] = lines[2].replace('"pass"', '"fail"');
    await writeFile(journal, lines.join('\n'));
    const second = createRunService({ dataDirectory: data });
    try {
      const view = await second.openRun(run.id);
      expect(view.writable).toBe(false);
      expect(view.problems[0]).toMatchObject({ seq: 2, kind: 'tampered' });
      await expect(second.recordResult(run.id, { result: 'pass', actor: 'Ana' })).rejects.toBeInstanceOf(RunNotWritableError);
      expect((await createRunCatalogue(data).listRuns())[0]).toMatchObject({ runId: run.id, outcome: 'damaged', damage: { firstBadSeq: 2 } });
    } finally {
      await second.close();
    }
  });

  it('reports a torn final line it moved to quarantine when it reopens a run, and carries on from the intact entries', async () => {
    const { service, source, plan, data } = await workspace();
    const { run } = await service.startRun({ planId: plan.id, sourceId: source.id, lot: 'L' });
    await service.recordResult(run.id, { result: 'pass', actor: 'Ana' });
    await service.close();
    await appendFile(layout.runJournal(data, run.id), '{"seq":2,"time":"2026-');
    const second = createRunService({ dataDirectory: data });
    try {
      const view = await second.openRun(run.id);
      expect(view.recovered).toMatchObject({ text: '{"seq":2,"time":"2026-' });
      expect(view.entries).toHaveLength(1);
      expect((await second.recordResult(run.id, { result: 'pass', actor: 'Ana' })).seq).toBe(2);
      expect(await verifyJournal(layout.runJournal(data, run.id))).toMatchObject({ ok: true, entries: 3 });
    } finally {
      await second.close();
    }
  });

  it('lists runs newest first with their outcome and chain status', async () => {
    const { service, source, plan, data } = await workspace();
    const first = await service.startRun({ planId: plan.id, sourceId: source.id, lot: 'A' });
    await new Promise((resolve) => setTimeout(resolve, 5));
    const second = await service.startRun({ planId: plan.id, sourceId: source.id, lot: 'B' });
    await service.recordResult(second.run.id, { result: 'fail', actor: 'Ana' });
    const runs = await createRunCatalogue(data).listRuns();
    expect(runs.map((run) => [run.runId, run.lot, run.itemsInspected, run.outcome, run.damage])).toEqual([
      [second.run.id, 'B', 1, 'open', null],
      [first.run.id, 'A', 0, 'open', null],
    ]);
  });
});
