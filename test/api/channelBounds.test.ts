import { mkdtemp, readdir, readFile, rm, writeFile } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { createDispatcher, type Dispatch } from '../../src-main/api/dispatcher.js';
import { createHandlers } from '../../src-main/api/handlers/index.js';
import type { PlanSpec } from '../../src-main/engine/index.js';
import { PlanRepository, SourceRepository } from '../../src-main/store/index.js';
import { unboundedSpecs } from '../engine/unboundedSpecs.js';

/** Inputs of the NIST/SEMATECH e-Handbook §6.2.6 example (first-hand). */
const nistSpec: PlanSpec = { model: 'passfail', p0: 0.01, p1: 0.1, alpha: 0.05, beta: 0.1 };

const folders: string[] = [];
afterEach(async () => {
  for (const folder of folders.splice(0)) await rm(folder, { recursive: true, force: true });
});

async function setUp(): Promise<{ data: string; dispatch: Dispatch; planId: string; sourceId: string }> {
  const data = await mkdtemp(path.join(os.tmpdir(), 'tallyline-channel-bounds-'));
  folders.push(data);
  const source = await new SourceRepository(data).create({ name: 'Brindle Fasteners' });
  const plan = await new PlanRepository(data).save({ name: 'Incoming rivets', sourceId: source.id, spec: nistSpec });
  return { data, dispatch: createDispatcher(createHandlers({ dataDirectory: data })), planId: plan.id, sourceId: source.id };
}

const badIds = ['../plans', 'a..b', 'has space', '', '-leading-dash', 'x'.repeat(81), 'nul\u0000byte'];

describe('ids that fail the id pattern are refused as invalid payloads, naming the field', () => {
  for (const id of badIds) {
    it(`inspection.start refuses the plan id ${JSON.stringify(id.slice(0, 20))} and the source id alike`, async () => {
      const { dispatch, planId, sourceId } = await setUp();
      expect(await dispatch('inspection.start', { planId: id, sourceId, lot: 'L-1' })).toMatchObject({ ok: false, code: 'invalid-payload', field: 'planId' });
      expect(await dispatch('inspection.start', { planId, sourceId: id, lot: 'L-1' })).toMatchObject({ ok: false, code: 'invalid-payload', field: 'sourceId' });
    });

    it(`the plan channels refuse the id ${JSON.stringify(id.slice(0, 20))}`, async () => {
      const { dispatch } = await setUp();
      for (const channel of ['plan.open', 'plan.versions', 'plan.export'] as const) {
        expect(await dispatch(channel, { id })).toMatchObject({ ok: false, code: 'invalid-payload', field: 'id' });
      }
      expect(await dispatch('plan.save', { id, name: 'Rivets', source: null, spec: nistSpec })).toMatchObject({ ok: false, code: 'invalid-payload', field: 'id' });
      expect(await dispatch('plan.save', { name: 'Rivets', source: { id }, spec: nistSpec })).toMatchObject({ ok: false, code: 'invalid-payload' });
    });
  }
});

describe('plan.design refuses a spec whose work has no bound, before computing', () => {
  for (const { name, spec, parameter, message } of unboundedSpecs) {
    // A hang is the failure this guards against; the timeout bounds it.
    it(`refuses ${name} as invalid-parameter on ${parameter}`, { timeout: 5000 }, async () => {
      const { dispatch } = await setUp();
      const answer = await dispatch('plan.design', { spec });
      expect(answer).toMatchObject({ ok: false, code: 'invalid-parameter', field: parameter });
      expect((answer as { message: string }).message).toMatch(message);
    });
  }

  it('plan.save refuses such a spec and writes no plan', { timeout: 5000 }, async () => {
    const { data, dispatch } = await setUp();
    const before = await readdir(path.join(data, 'plans'));
    const answer = await dispatch('plan.save', { name: 'Huge', source: null, spec: unboundedSpecs[0].spec });
    expect(answer).toMatchObject({ ok: false, code: 'invalid-parameter', field: 'truncation' });
    expect(await readdir(path.join(data, 'plans'))).toEqual(before);
  });
});

describe('a run started before the bounds existed', () => {
  it('record.open answers with a clear error naming the refused truncation, quickly', { timeout: 5000 }, async () => {
    const { data, dispatch, planId, sourceId } = await setUp();
    const started = await dispatch('inspection.start', { planId, sourceId, lot: 'L-7' });
    if (!started.ok) throw new Error(started.message);
    const runId = (started.value as { run: { id: string } }).run.id;
    // Its journal holds only the open entry (seq 0, previous = 64 zeros), so editing its plan keeps the chain intact.
    const journal = path.join(data, 'runs', `${runId}.journal`);
    const text = await readFile(journal, 'utf8');
    expect(text.split('\n').filter(Boolean)).toHaveLength(1);
    expect(text).toContain('"alpha":0.05');
    await writeFile(journal, text.replace('"alpha":0.05', '"truncation":1000000000,"alpha":0.05'));
    // A run written before anchors existed has no anchor file beside its journal.
    await rm(journal.replace(/\.journal$/, '.anchor'));
    const answer = await dispatch('record.open', { runId });
    expect(answer.ok).toBe(false);
    expect((answer as { message: string }).message).toMatch(/truncation must be an integer from 1 to 100000/);
  });
});
