import { spawn } from 'node:child_process';
import { once } from 'node:events';
import { mkdtemp, rm, writeFile } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import type { InspectionRunView, InspectionStep } from '../../src-main/api/channels/inspectionChannels.js';
import type { RunRow } from '../../src-main/inspection/index.js';
import { createDispatcher, type Dispatch } from '../../src-main/api/dispatcher.js';
import { createHandlers } from '../../src-main/api/handlers/index.js';
import type { ChannelResult } from '../../src-main/api/result.js';
import { linearCountLiveState, type LinearCountLiveState, type LinearCountSpec } from '../../src-main/engine/index.js';
import { PlanRepository, SourceRepository } from '../../src-main/store/index.js';

/** Wald plan p0 1 %, p1 10 %, alpha 5 %, beta 10 % (the NIST/SEMATECH §6.2.6 example, NIST/SEMATECH e-Handbook §6.2.6 (first-hand)). */
const nistSpec: LinearCountSpec = { model: 'passfail', p0: 0.01, p1: 0.1, alpha: 0.05, beta: 0.1 };

const folders: string[] = [];
afterEach(async () => {
  for (const folder of folders.splice(0)) await rm(folder, { recursive: true, force: true });
});

async function setUp(spec: LinearCountSpec = nistSpec): Promise<{ dispatch: Dispatch; planId: string; sourceId: string; data: string }> {
  const data = await mkdtemp(path.join(os.tmpdir(), 'tallyline-inspection-channels-'));
  folders.push(data);
  const source = await new SourceRepository(data).create({ name: 'Acme Castings' });
  const plan = await new PlanRepository(data).save({ name: 'Incoming housings', sourceId: source.id, spec });
  return { dispatch: createDispatcher(createHandlers({ dataDirectory: data })), planId: plan.id, sourceId: source.id, data };
}

function value<T>(result: ChannelResult<unknown>): T {
  if (!result.ok) throw new Error(`expected success, got ${result.code}: ${result.message}`);
  return result.value as T;
}

async function started(dispatch: Dispatch, planId: string, sourceId: string): Promise<InspectionRunView> {
  return value<InspectionRunView>(await dispatch('inspection.start', { planId, sourceId, lot: 'L-2041', lotSize: 400, inspector: 'Ana' }));
}

describe('the inspection channels', () => {
  it('inspection.start opens a run at n = 0 with the live look-ahead the engine gives there', async () => {
    const { dispatch, planId, sourceId } = await setUp();
    const view = await started(dispatch, planId, sourceId);
    expect(view.run).toMatchObject({ lot: 'L-2041', lotSize: 400, inspector: 'Ana', status: 'open', sourceName: 'Acme Castings' });
    expect(view.live).toEqual(linearCountLiveState(nistSpec, 0, 0));
    expect(view.entries).toEqual([]);
    // Earliest accept of the NIST example is at n = 24 (h1 / s = 0.939 / 0.0397 = 23.7, NIST/SEMATECH e-Handbook §6.2.6 (first-hand)).
    expect((view.live as LinearCountLiveState).itemsToEarliestAccept).toBe(24);
    expect(view.frame.horizon).toBeGreaterThanOrEqual(24);
    expect(view.frame.limits[23]).toMatchObject({ n: 24, accept: 0 });
  });

  it('inspection.record answers with the entry, the engine state after it and the LLR point for the chart', async () => {
    const { dispatch, planId, sourceId } = await setUp();
    const { run } = await started(dispatch, planId, sourceId);
    value(await dispatch('inspection.record', { runId: run.id, result: 'pass' }));
    const step = value<InspectionStep>(await dispatch('inspection.record', { runId: run.id, result: 'fail', itemId: 'SN-7', category: 'burr' }));
    const engine = linearCountLiveState(nistSpec, 2, 1);
    expect(step).toMatchObject({ seq: 2, kind: 'result', run: { status: 'open', decision: null } });
    expect(step.entry).toMatchObject({ seq: 2, itemId: 'SN-7', result: 'fail', category: 'burr', actor: 'Ana', after: { n: 2, total: 1, llr: engine.llr } });
    expect(step.live).toEqual(engine);
  });

  it('inspection.void strikes the last entry with its reason and the statistics leave it out', async () => {
    const { dispatch, planId, sourceId } = await setUp();
    const { run } = await started(dispatch, planId, sourceId);
    value(await dispatch('inspection.record', { runId: run.id, result: 'pass' }));
    value(await dispatch('inspection.record', { runId: run.id, result: 'fail' }));
    const step = value<InspectionStep>(await dispatch('inspection.void', { runId: run.id, reason: 'scanned the wrong part' }));
    expect(step.entry).toMatchObject({ seq: 2, voided: true, voidReason: 'scanned the wrong part', after: null });
    expect(step.live).toEqual(linearCountLiveState(nistSpec, 1, 0));
    const reopened = value<InspectionRunView>(await dispatch('inspection.open', { runId: run.id }));
    expect(reopened.entries.map((entry) => [entry.seq, entry.voided, entry.after?.n ?? null])).toEqual([
      [1, false, 1],
      [2, true, null],
    ]);
  });

  it('closes the run at the decision with its rule, and takes more only after a recorded reason', async () => {
    const { dispatch, planId, sourceId } = await setUp();
    const { run } = await started(dispatch, planId, sourceId);
    let step: InspectionStep;
    do step = value<InspectionStep>(await dispatch('inspection.record', { runId: run.id, result: 'fail' }));
    while (step.run.status === 'open');
    // Two nonconforming in the first two items reject: Re(2) = ceil(0.0397 x 2 + 1.205) = 2 (NIST/SEMATECH e-Handbook §6.2.6 (first-hand)).
    expect(step.state.n).toBe(2);
    expect(step.run).toMatchObject({ status: 'closed', decision: 'reject', rule: linearCountLiveState(nistSpec, 2, 2).rule });
    expect(step.run.closedAt).not.toBeNull();
    const refused = await dispatch('inspection.record', { runId: run.id, result: 'pass' });
    expect(refused).toMatchObject({ ok: false, code: 'conflict' });
    expect(!refused.ok && refused.message).toMatch(/reason/);
    const override = value<InspectionStep>(await dispatch('inspection.override', { runId: run.id, reason: 'customer asked for the full lot' }));
    expect(override.run).toMatchObject({ status: 'open', decision: null });
    expect(value<InspectionStep>(await dispatch('inspection.record', { runId: run.id, result: 'pass' })).seq).toBeGreaterThan(override.seq);
  });

  it('refuses what cannot be taken, saying which field and why', async () => {
    const { dispatch, planId, sourceId } = await setUp();
    const { run } = await started(dispatch, planId, sourceId);
    expect(await dispatch('inspection.start', { planId, sourceId, lot: '   ' })).toMatchObject({ ok: false, code: 'invalid-payload', field: 'lot' });
    expect(await dispatch('inspection.start', { planId: 'plan-none', sourceId, lot: 'L' })).toMatchObject({ ok: false, code: 'not-found', field: 'planId' });
    expect(await dispatch('inspection.start', { planId, planVersion: 9, sourceId, lot: 'L' })).toMatchObject({ ok: false, code: 'not-found', field: 'planVersion' });
    expect(await dispatch('inspection.start', { planId, sourceId: 'src-none', lot: 'L' })).toMatchObject({ ok: false, code: 'not-found', field: 'sourceId' });
    expect(await dispatch('inspection.start', { planId, sourceId, lot: 'L', lotSize: 2.5 })).toMatchObject({ ok: false, field: 'lotSize' });
    expect(await dispatch('inspection.record', { runId: run.id, result: 3 })).toMatchObject({ ok: false, code: 'invalid-parameter', field: 'result' });
    expect(await dispatch('inspection.void', { runId: run.id, reason: ' ' })).toMatchObject({ ok: false, code: 'invalid-payload', field: 'reason' });
    expect(await dispatch('inspection.void', { runId: run.id, reason: 'typo' })).toMatchObject({ ok: false, code: 'conflict' });
    expect(await dispatch('inspection.override', { runId: run.id, reason: 'why not' })).toMatchObject({ ok: false, code: 'conflict' });
    expect(await dispatch('inspection.open', { runId: 'run-none' })).toMatchObject({ ok: false, code: 'not-found', field: 'runId' });
    expect(await dispatch('inspection.open', { runId: '../settings' })).toMatchObject({ ok: false, code: 'invalid-payload', field: 'runId' });
  });

  it('inspection.held says whether another live program holds the run, from its lock file alone', async () => {
    const { dispatch, planId, sourceId, data } = await setUp();
    const { run } = await started(dispatch, planId, sourceId);
    expect(value(await dispatch('inspection.held', { runId: run.id }))).toEqual({ held: false });
    // A second window on the same data folder, while another program (here a sleeping child) holds the run.
    const other = createDispatcher(createHandlers({ dataDirectory: data }));
    const holder = spawn('sleep', ['30']);
    try {
      await writeFile(path.join(data, 'runs', `${run.id}.lock`), String(holder.pid));
      expect(value(await other('inspection.held', { runId: run.id }))).toEqual({ held: true });
    } finally {
      holder.kill();
      await once(holder, 'exit');
    }
    expect(value(await other('inspection.held', { runId: run.id }))).toEqual({ held: false });
  });

  it('inspection.list shows each run with its counted items and outcome', async () => {
    const { dispatch, planId, sourceId } = await setUp();
    const { run } = await started(dispatch, planId, sourceId);
    value(await dispatch('inspection.record', { runId: run.id, result: 'pass' }));
    const runs = value<RunRow[]>(await dispatch('inspection.list', null));
    expect(runs).toEqual([expect.objectContaining({ runId: run.id, itemsInspected: 1, outcome: 'open', damage: null })]);
  });

  it('takes a count per unit on a count plan', async () => {
    const countSpec: LinearCountSpec = { model: 'count', lambda0: 0.1, lambda1: 0.5, alpha: 0.05, beta: 0.05 };
    const { dispatch, planId, sourceId } = await setUp(countSpec);
    const { run } = await started(dispatch, planId, sourceId);
    const step = value<InspectionStep>(await dispatch('inspection.record', { runId: run.id, result: 1 }));
    expect(step.live).toEqual(linearCountLiveState(countSpec, 1, 1));
    expect(await dispatch('inspection.record', { runId: run.id, result: 'pass' })).toMatchObject({ ok: false, code: 'invalid-parameter' });
    expect(await dispatch('inspection.record', { runId: run.id, result: -1 })).toMatchObject({ ok: false, code: 'invalid-payload', field: 'result' });
  });
});
