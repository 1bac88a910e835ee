import { mkdtemp, rm } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import type { SourceListItem, SourceSummaryView } from '../../src-main/api/channels/sourceChannels.js';
import { createDispatcher, type Dispatch } from '../../src-main/api/dispatcher.js';
import { createHandlers } from '../../src-main/api/handlers/index.js';
import type { ChannelResult } from '../../src-main/api/result.js';
import type { RestoreReport } from '../../src-main/backup/index.js';
import type { LinearCountSpec } from '../../src-main/engine/index.js';
import { createRunService } from '../../src-main/inspection/index.js';
import type { Settings, Source } from '../../src-main/store/index.js';

/** Wald plan p0 1 %, p1 10 %, alpha 5 %, beta 10 % (the NIST/SEMATECH §6.2.6 example, NIST/SEMATECH e-Handbook §6.2.6 (first-hand)). */
const spec: LinearCountSpec = { model: 'passfail', p0: 0.01, p1: 0.1, alpha: 0.05, beta: 0.1 };

const folders: string[] = [];
afterEach(async () => {
  for (const folder of folders.splice(0)) await rm(folder, { recursive: true, force: true });
});

async function setUp(): Promise<{ dispatch: Dispatch; data: string }> {
  const data = await mkdtemp(path.join(os.tmpdir(), 'tallyline-source-channels-'));
  folders.push(data);
  return { dispatch: createDispatcher(createHandlers({ dataDirectory: data })), data };
}

function value<T>(result: ChannelResult<unknown>): T {
  if (!result.ok) throw new Error(`expected success, got ${result.code}: ${result.message}`);
  return result.value as T;
}

describe('the source channels', () => {
  it('create, rename, set parts and retire a source; a retired source leaves the list and the plan pickers', async () => {
    const { dispatch } = await setUp();
    const created = value<Source>(await dispatch('source.create', { name: '  Osprey Castings ', kind: 'supplier', parts: [{ name: 'pump housing', characteristics: ['porosity'] }] }));
    expect(created).toMatchObject({ name: 'Osprey Castings', kind: 'supplier', retired: false, parts: [{ name: 'pump housing', characteristics: ['porosity'] }] });
    expect(value<Source>(await dispatch('source.rename', { id: created.id, name: 'Osprey Foundry' })).name).toBe('Osprey Foundry');
    const parts = [{ name: 'pump housing', characteristics: ['porosity', 'bore diameter'] }, { name: 'cover', characteristics: [] }];
    expect(value<Source>(await dispatch('source.setParts', { id: created.id, parts })).parts).toEqual(parts);
    expect(value<{ parts: unknown }[]>(await dispatch('plan.sources', null))[0].parts).toEqual(parts);

    expect(value<Source>(await dispatch('source.retire', { id: created.id })).retired).toBe(true);
    expect(value<SourceListItem[]>(await dispatch('source.list', null))).toEqual([]);
    expect(value<SourceListItem[]>(await dispatch('source.list', { includeRetired: true }))[0]).toMatchObject({ name: 'Osprey Foundry', retired: true, runs: 0 });
    expect(value<unknown[]>(await dispatch('plan.sources', null))).toEqual([]);
  });

  it('refuses a name another source has, an unknown source, a repeated part and retiring twice', async () => {
    const { dispatch } = await setUp();
    const first = value<Source>(await dispatch('source.create', { name: 'Osprey Castings', kind: 'supplier' }));
    const second = value<Source>(await dispatch('source.create', { name: 'Heron Mouldings', kind: 'supplier' }));
    expect(await dispatch('source.create', { name: 'osprey castings', kind: 'line' })).toMatchObject({ ok: false, code: 'conflict', field: 'name', message: expect.stringMatching(/^A source named "Osprey Castings" already exists/) });
    expect(await dispatch('source.rename', { id: second.id, name: 'Osprey Castings' })).toMatchObject({ ok: false, code: 'conflict' });
    expect(await dispatch('source.rename', { id: 'src-nope', name: 'x' })).toMatchObject({ ok: false, code: 'not-found', field: 'id' });
    expect(await dispatch('source.summary', { id: '../settings' })).toMatchObject({ ok: false, code: 'invalid-payload', field: 'id' });
    expect(await dispatch('source.setParts', { id: first.id, parts: [{ name: 'Nut', characteristics: [] }, { name: 'nut', characteristics: [] }] })).toMatchObject({ ok: false, code: 'invalid-payload', message: expect.stringMatching(/Each part is listed once/) });
    value(await dispatch('source.retire', { id: first.id }));
    expect(await dispatch('source.retire', { id: first.id })).toMatchObject({ ok: false, code: 'conflict', message: 'Osprey Castings is already retired.' });
  });

  it('plan.save files the part and characteristic in the plan version, and a run carries them in its journal header', async () => {
    const { dispatch, data } = await setUp();
    const source = value<Source>(await dispatch('source.create', { name: 'Osprey Castings', kind: 'supplier', parts: [{ name: 'pump housing', characteristics: ['porosity'] }] }));
    const plan = value<{ id: string; part?: string; characteristic?: string }>(
      await dispatch('plan.save', { name: 'Housing porosity', source: { id: source.id }, part: 'pump housing', characteristic: 'porosity', spec }),
    );
    expect(plan).toMatchObject({ part: 'pump housing', characteristic: 'porosity' });
    const plain = value<object>(await dispatch('plan.save', { name: 'No part', source: { id: source.id }, part: null, spec }));
    expect(plain).not.toHaveProperty('part');
    expect(await dispatch('plan.save', { name: 'Loose', source: null, part: 'pump housing', spec })).toMatchObject({ ok: false, field: 'part' });

    const service = createRunService({ dataDirectory: data });
    const run = await service.startRun({ planId: plan.id, sourceId: source.id, lot: 'L-1' });
    await service.close();
    expect(run.plan).toMatchObject({ part: 'pump housing', characteristic: 'porosity' });
  });

  it('source.summary sums the source runs (hand-counted) and source.list shows the counts', async () => {
    const { dispatch, data } = await setUp();
    const source = value<Source>(await dispatch('source.create', { name: 'Osprey Castings', kind: 'supplier' }));
    const other = value<Source>(await dispatch('source.create', { name: 'Heron Mouldings', kind: 'supplier' }));
    const plan = value<{ id: string }>(await dispatch('plan.save', { name: 'p', source: { id: source.id }, spec }));
    const service = createRunService({ dataDirectory: data });
    // NIST plan: 24 passes accept (earliest acceptance at n = 24, NIST/SEMATECH e-Handbook §6.2.6 (first-hand)); 2 fails in 2 items reject
    // (reject when d >= h2 + s n = 1.205 + 0.0397 n: 1.28 at n = 2, worked by hand), 1 fail in 1 item does not (1.245).
    const accepted = await service.startRun({ planId: plan.id, sourceId: source.id, lot: 'A' });
    for (let item = 0; item < 24; item += 1) await service.recordResult(accepted.run.id, { result: 'pass', actor: 'x' });
    const rejected = await service.startRun({ planId: plan.id, sourceId: source.id, lot: 'B' });
    for (let item = 0; item < 2; item += 1) await service.recordResult(rejected.run.id, { result: 'fail', actor: 'x' });
    const open = await service.startRun({ planId: plan.id, sourceId: source.id, lot: 'C' });
    await service.recordResult(open.run.id, { result: 'fail', actor: 'x' });
    await service.startRun({ planId: plan.id, sourceId: other.id, lot: 'D' });
    await service.close();

    const view = value<SourceSummaryView>(await dispatch('source.summary', { id: source.id }));
    // 3 runs: accepted A, rejected B, open C; items 24 + 2 + 1 = 27; nonconforming 0 + 2 + 1 = 3.
    expect(view.summary).toMatchObject({ runs: 3, accepted: 1, rejected: 1, open: 1, itemsInspected: 27, nonconformingFound: 3 });
    // Pooled over decided runs A and B: 2 / 26.
    expect(view.summary.pooled).toEqual([{ model: 'passfail', runs: 2, itemsInspected: 26, nonconformingFound: 2, pooled: 2 / 26, unit: 'fraction nonconforming' }]);
    expect(view.summary.trend.acceptedSoFar.length).toBe(2);
    expect(view.caveat).toMatch(/biased/);
    expect(view.runs.map((run) => run.lot).sort()).toEqual(['A', 'B', 'C']);
    const list = value<SourceListItem[]>(await dispatch('source.list', null));
    expect(list.find((item) => item.id === source.id)).toMatchObject({ runs: 3, accepted: 1, rejected: 1 });
    expect(list.find((item) => item.id === other.id)).toMatchObject({ runs: 1, accepted: 0, rejected: 0 });
  });

  it('source.demo fills an empty folder once, then refuses', async () => {
    const { dispatch } = await setUp();
    expect(value(await dispatch('source.demo', null))).toEqual({ sources: 3, plans: 3, runs: 13 });
    expect(await dispatch('source.demo', null)).toMatchObject({ ok: false, code: 'conflict', message: expect.stringMatching(/already holds Tallyline data/) });
  });
});

describe('the settings channels', () => {
  it('settings.get gives the 90 % default and settings.update keeps what the record prints', async () => {
    const { dispatch } = await setUp();
    expect(value<Settings>(await dispatch('settings.get', null))).toMatchObject({ organisationName: '', site: '', confidenceLevel: 0.9 });
    value(await dispatch('settings.update', { organisationName: ' Heron Works ', site: 'Plant 2', confidenceLevel: 0.95 }));
    expect(value<Settings>(await dispatch('settings.get', null))).toMatchObject({ organisationName: 'Heron Works', site: 'Plant 2', confidenceLevel: 0.95 });
    expect(await dispatch('settings.update', { confidenceLevel: 1 })).toMatchObject({ ok: false, code: 'invalid-payload', field: 'confidenceLevel' });
  });

  it('settings.dataFolder names the data folder and the folder a restore keeps the replaced data in', async () => {
    const { dispatch, data } = await setUp();
    expect(value(await dispatch('settings.dataFolder', null))).toEqual({ path: data, keptAs: `${data}.before-restore-<date and time>` });
  });

  it('settings.backup and settings.restore round-trip the data, and a damaged archive is refused with the data untouched', async () => {
    const { dispatch } = await setUp();
    value(await dispatch('source.demo', null));
    const backup = value<{ fileName: string; base64: string; files: number }>(await dispatch('settings.backup', null));
    expect(backup.fileName).toMatch(/^tallyline-backup-\d{8}-\d{4}\.tallyline-archive$/);
    value(await dispatch('source.create', { name: 'Made after the backup', kind: 'line' }));

    const damaged = Buffer.from(backup.base64, 'base64');
    damaged[damaged.length - 5] ^= 0xff;
    const refused = await dispatch('settings.restore', { base64: damaged.toString('base64') });
    expect(refused).toMatchObject({ ok: false, code: 'invalid-payload', message: expect.stringMatching(/^The archive was refused: .*current data is untouched\.$/) });
    expect(value<SourceListItem[]>(await dispatch('source.list', null))).toHaveLength(4);

    const report = value<RestoreReport>(await dispatch('settings.restore', { base64: backup.base64 }));
    expect(report).toMatchObject({ files: backup.files, sources: 3, runs: 13 });
    expect(value<SourceListItem[]>(await dispatch('source.list', null)).map((source) => source.name)).not.toContain('Made after the backup');
    folders.push(report.previousDataKeptAt!);
  });
});
