import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import type { ChannelResult } from '../../src-main/api/result.js';
import { createDispatcher, type Dispatch } from '../../src-main/api/dispatcher.js';
import { createHandlers } from '../../src-main/api/handlers/index.js';
import { designLinearCountPlan } from '../../src-main/engine/index.js';

// NIST/SEMATECH e-Handbook §6.2.6 example inputs (NIST/SEMATECH e-Handbook §6.2.6 (first-hand)).
const nistExample = { model: 'passfail', p0: 0.01, p1: 0.1, alpha: 0.05, beta: 0.1 } as const;

let dataDirectory: string;
let dispatch: Dispatch;

beforeEach(async () => {
  dataDirectory = await mkdtemp(join(tmpdir(), 'tallyline-plan-handlers-'));
  dispatch = createDispatcher(createHandlers({ dataDirectory }));
});
afterEach(async () => {
  await rm(dataDirectory, { recursive: true, force: true });
});

function valueOf<T>(result: ChannelResult<unknown>): T {
  if (!result.ok) throw new Error(`expected success, got ${result.code}: ${result.message}`);
  return result.value as T;
}

type Designed = { superseded: false; spec: { truncation?: number | null }; design: ReturnType<typeof designLinearCountPlan> };

describe('plan.design', () => {
  it('answers with exactly what the engine designs for the spec', async () => {
    const answer = valueOf<Designed>(await dispatch('plan.design', { spec: nistExample, curvePoints: 21 }));
    expect(answer.superseded).toBe(false);
    expect(answer.design).toEqual(designLinearCountPlan(nistExample, { curvePoints: 21 }));
    expect(answer.design.single).toMatchObject({ n: 52, c: 2 }); // Montgomery §15.2.3 (first-hand), minimal plans computed independently
  });

  it('truncates at the engine suggestion when asked to, and says which truncation it used', async () => {
    const untruncated = designLinearCountPlan(nistExample);
    const answer = valueOf<Designed>(await dispatch('plan.design', { spec: { ...nistExample, truncation: 500 }, suggestTruncation: true }));
    expect(answer.spec.truncation).toBe(untruncated.suggestedTruncation);
    expect(answer.design.truncation).toBe(untruncated.suggestedTruncation);
  });

  it('drops a request of a stream once a newer ticket of that stream has arrived', async () => {
    const older = dispatch('plan.design', { spec: nistExample, stream: 's', ticket: 1 });
    const newer = dispatch('plan.design', { spec: { ...nistExample, p1: 0.12 }, stream: 's', ticket: 2 });
    expect(valueOf<{ superseded: boolean }>(await older)).toEqual({ superseded: true });
    expect(valueOf<Designed>(await newer).design.boundaries.h1).toBeCloseTo(designLinearCountPlan({ ...nistExample, p1: 0.12 }).boundaries.h1, 12);
  });

  it('refuses an impossible plan with the engine message and the parameter as field', async () => {
    const result = await dispatch('plan.design', { spec: { ...nistExample, alpha: 0.6, beta: 0.5 } });
    expect(result).toMatchObject({ ok: false, code: 'invalid-parameter' });
    expect(!result.ok && result.message).toMatch(/alpha \+ beta/);
  });
});

describe('saving, versions, export and import', () => {
  it('saves a plan under a new source, then an edit as version 2, leaving version 1 unchanged', async () => {
    const first = valueOf<{ id: string; version: number; sourceName: string }>(
      await dispatch('plan.save', { name: 'Incoming bracket', source: { name: 'Northside Castings', kind: 'supplier' }, spec: nistExample }),
    );
    expect(first).toMatchObject({ version: 1, sourceName: 'Northside Castings', format: 'tallyline.plan/1' });
    const sources = valueOf<{ id: string; name: string }[]>(await dispatch('plan.sources', null));
    expect(sources.map((source) => source.name)).toEqual(['Northside Castings']);
    const second = valueOf<{ version: number }>(
      await dispatch('plan.save', { id: first.id, name: 'Incoming bracket', source: { id: sources[0].id }, spec: { ...nistExample, p1: 0.08 } }),
    );
    expect(second.version).toBe(2);
    const versions = valueOf<{ version: number; spec: { p1: number } }[]>(await dispatch('plan.versions', { id: first.id }));
    expect(versions.map((plan) => [plan.version, plan.spec.p1])).toEqual([[1, 0.1], [2, 0.08]]);
    const listed = valueOf<{ id: string; version: number }[]>(await dispatch('plan.list', null));
    expect(listed).toHaveLength(1);
    expect(listed[0]).toMatchObject({ id: first.id, version: 2 });
  });

  it('refuses to save an invalid spec and writes nothing', async () => {
    const result = await dispatch('plan.save', { name: 'Bad', source: null, spec: { ...nistExample, p1: 0.005 } });
    expect(result).toMatchObject({ ok: false, code: 'invalid-parameter', field: 'p1' });
    expect(valueOf<unknown[]>(await dispatch('plan.list', null))).toEqual([]);
  });

  it('exports a version as a tallyline.plan/1 file that imports back to the same plan', async () => {
    const saved = valueOf<{ id: string; name: string; spec: unknown }>(
      await dispatch('plan.save', { name: 'Weld seam', source: { name: 'Line 3', kind: 'line' }, spec: { ...nistExample, truncation: 61 } }),
    );
    const exported = valueOf<{ fileName: string; text: string }>(await dispatch('plan.export', { id: saved.id }));
    expect(exported.fileName).toBe('weld-seam-v1.tallyline-plan.json');
    expect(JSON.parse(exported.text)).toMatchObject({ format: 'tallyline.plan/1', version: 1 });
    const imported = valueOf<{ name: string; spec: unknown; origin: { sourceName: string } }>(await dispatch('plan.import', { text: exported.text }));
    expect(imported).toMatchObject({ name: saved.name, spec: saved.spec, origin: { id: saved.id, version: 1, sourceName: 'Line 3' } });
  });

  it.each([
    ['text that is not JSON', 'plan: p0 = 1 %', /not JSON/],
    ['a file of another format', JSON.stringify({ format: 'something.else/2' }), /"format": "something.else\/2".*tallyline\.plan\/1/],
    ['a file without a format', JSON.stringify({ name: 'x' }), /no "format" field/],
    ['a plan file with a missing field', JSON.stringify({ format: 'tallyline.plan/1', id: 'plan-1', version: 1, sourceId: null, createdAt: 'x', spec: nistExample }), /at "name"/],
  ])('refuses %s on import with a message saying what is wrong', async (_case, text, message) => {
    const result = await dispatch('plan.import', { text });
    expect(result).toMatchObject({ ok: false, code: 'invalid-payload', field: 'file' });
    expect(!result.ok && result.message).toMatch(message);
  });

  it('refuses an imported plan the engine refuses, naming the parameter and the engine\'s reason', async () => {
    const text = JSON.stringify({ format: 'tallyline.plan/1', id: 'plan-1', version: 1, name: 'x', sourceId: null, createdAt: 'x', spec: { ...nistExample, p1: 0.005 } });
    const answer = await dispatch('plan.import', { text });
    expect(answer).toMatchObject({ ok: false, code: 'invalid-payload', field: 'file' });
    expect((answer as { message: string }).message).toMatch(/"spec\.p1".*p1 must be greater than p0/);
  });

  it('answers not-found for a plan or version that does not exist', async () => {
    expect(await dispatch('plan.export', { id: 'plan-none' })).toMatchObject({ ok: false, code: 'not-found' });
    const saved = valueOf<{ id: string }>(await dispatch('plan.save', { name: 'A', source: null, spec: nistExample }));
    expect(await dispatch('plan.open', { id: saved.id, version: 4 })).toMatchObject({ ok: false, code: 'not-found', field: 'version' });
  });
});
