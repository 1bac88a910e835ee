/** The plan and inspection channels for measurement, lifetime and graded plans, through the dispatcher. */
import { mkdtemp, rm } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import type { InspectionRunView, InspectionStep } from '../../src-main/api/channels/inspectionChannels.js';
import type { DesignAnswer, SavedPlan } from '../../src-main/api/channels/planChannels.js';
import { createDispatcher, type Dispatch } from '../../src-main/api/dispatcher.js';
import { createHandlers } from '../../src-main/api/handlers/index.js';
import type { ChannelResult } from '../../src-main/api/result.js';
import {
  designGradedPlan,
  designLifetimePlan,
  designMeasurementPlan,
  gradedLiveState,
  lifetimeLiveState,
  measurementLiveState,
  type PlanSpec,
} from '../../src-main/engine/index.js';
import { SourceRepository } from '../../src-main/store/index.js';
import { gradedSpec, lifetimeSpec, measurementSpec } from '../inspection/modelSpecs.js';

const folders: string[] = [];
afterEach(async () => {
  for (const folder of folders.splice(0)) await rm(folder, { recursive: true, force: true });
});

async function setUp(): Promise<{ dispatch: Dispatch; sourceId: string }> {
  const data = await mkdtemp(path.join(os.tmpdir(), 'tallyline-model-channels-'));
  folders.push(data);
  const source = await new SourceRepository(data).create({ name: 'Larkspur Components (invented)' });
  return { dispatch: createDispatcher(createHandlers({ dataDirectory: data })), sourceId: source.id };
}

function value<T>(result: ChannelResult<unknown>): T {
  if (!result.ok) throw new Error(`expected success, got ${result.code}: ${result.message}`);
  return result.value as T;
}

async function startedRun(dispatch: Dispatch, sourceId: string, spec: PlanSpec): Promise<InspectionRunView> {
  const plan = value<SavedPlan>(await dispatch('plan.save', { name: `${spec.model} plan`, source: { id: sourceId }, spec }));
  return value<InspectionRunView>(await dispatch('inspection.start', { planId: plan.id, sourceId, lot: 'LK-1', inspector: 'Ana' }));
}

describe('plan channels for every model', () => {
  it('plan.design answers each model with its engine design, discriminated by model', async () => {
    const { dispatch } = await setUp();
    const cases = [
      [measurementSpec, designMeasurementPlan(measurementSpec, { curvePoints: 11 })],
      [lifetimeSpec, designLifetimePlan(lifetimeSpec, { curvePoints: 11 })],
      [gradedSpec, designGradedPlan(gradedSpec, { curvePoints: 11 })],
    ] as const;
    for (const [spec, engine] of cases) {
      const answer = value<DesignAnswer>(await dispatch('plan.design', { spec, curvePoints: 11 }));
      if (answer.superseded) throw new Error('superseded');
      expect(answer.design.model).toBe(spec.model);
      expect(answer.design).toEqual(engine); // engine, tested elsewhere
    }
  });

  it('plan.save, plan.export and plan.import carry every model and its units', async () => {
    const { dispatch, sourceId } = await setUp();
    for (const spec of [measurementSpec, lifetimeSpec, gradedSpec]) {
      const saved = value<SavedPlan>(await dispatch('plan.save', { name: 'Invented plan', source: { id: sourceId }, spec }));
      expect(saved.spec).toEqual(spec);
      const next = value<SavedPlan>(await dispatch('plan.save', { id: saved.id, name: 'Invented plan', source: { id: sourceId }, spec: { ...spec, alpha: 0.04 } }));
      expect(next.version).toBe(2);
      const file = value<{ text: string }>(await dispatch('plan.export', { id: saved.id, version: 1 }));
      const imported = value<{ spec: PlanSpec }>(await dispatch('plan.import', { text: file.text }));
      expect(imported.spec).toEqual(spec);
    }
  });

  it('plan.save refuses a graded plan whose p1 does not sum to 1, with the engine message', async () => {
    const { dispatch, sourceId } = await setUp();
    const result = await dispatch('plan.save', { name: 'Bad', source: { id: sourceId }, spec: { ...gradedSpec, p1: [0.7, 0.17, 0.08] } });
    expect(result).toMatchObject({ ok: false, code: 'invalid-parameter' });
    if (!result.ok) expect(result.message).toMatch(/p1 must sum to 1/);
  });
});

describe('inspection channels for every model', () => {
  it('a measurement run answers its state, the live look-ahead of the engine and a frame of sum limits', async () => {
    const { dispatch, sourceId } = await setUp();
    const view = await startedRun(dispatch, sourceId, measurementSpec);
    expect(view.state).toMatchObject({ model: 'measurement', n: 0, sum: 0, mean: null });
    expect(view.frame).toMatchObject({ model: 'measurement', rejectWhen: 'above', unit: 'mm' });
    const step = value<InspectionStep>(await dispatch('inspection.record', { runId: view.run.id, result: { value: 10.3 } }));
    expect(step.state).toMatchObject({ model: 'measurement', n: 1, sum: 10.3 });
    expect(step.live).toEqual({ model: 'measurement', ...measurementLiveState(measurementSpec, 1, 10.3) }); // engine, tested elsewhere
    expect(step.entry?.after).toMatchObject({ n: 1, total: 10.3 });
    // The frame's limits are the sum lines: accept at n (mu0 + mu1)/2 - h1 with h1 = -ln B sigma^2/(mu1 - mu0) (hand formula).
    const h1 = (-Math.log(0.1 / 0.95) * 0.16) / 0.5;
    expect(step.frame.limits[0]).toMatchObject({ n: 1 });
    expect((step.frame.limits[0] as { accept: number }).accept).toBeCloseTo(10.25 - h1, 10);
  });

  it('a lifetime run takes time readings and failures, and its frame holds accept and reject times per failure count', async () => {
    const { dispatch, sourceId } = await setUp();
    const view = await startedRun(dispatch, sourceId, lifetimeSpec);
    const runId = view.run.id;
    await dispatch('inspection.record', { runId, result: { time: 250 } });
    const step = value<InspectionStep>(await dispatch('inspection.record', { runId, result: { failure: true, time: 400 } }));
    expect(step.state).toMatchObject({ model: 'lifetime', time: 400, failures: 1, n: 2 });
    expect(step.live).toEqual({ model: 'lifetime', ...lifetimeLiveState(lifetimeSpec, 400, 1) }); // engine, tested elsewhere
    expect(step.entry?.after).toMatchObject({ time: 400, total: 1 });
    expect(step.frame).toMatchObject({ model: 'lifetime', truncation: null, unit: 'unit-hours' });
    // Accept time with no failure: -ln(0.1/0.9)/(1/500 - 1/1000) = 2197.2 unit-hours (hand computation).
    expect((step.frame.limits[0] as { acceptTime: number }).acceptTime).toBeCloseTo(2197.2246, 3);
    const down = await dispatch('inspection.record', { runId, result: { time: 300 } });
    expect(down).toMatchObject({ ok: false, code: 'invalid-parameter', field: 'result' });
    if (!down.ok) expect(down.message).toMatch(/This run's plan is lifetime: accumulated test time never goes down/);
    const voided = value<InspectionStep>(await dispatch('inspection.void', { runId, reason: 'wrong meter', actor: 'Ana' }));
    expect(voided.state).toMatchObject({ time: 250, failures: 0 });
  });

  it('a graded run counts grades by class name and closes with its rule', async () => {
    const { dispatch, sourceId } = await setUp();
    const view = await startedRun(dispatch, sourceId, gradedSpec);
    const runId = view.run.id;
    let step: InspectionStep | undefined;
    for (const grade of ['minor', 'major', 'major']) step = value<InspectionStep>(await dispatch('inspection.record', { runId, result: { grade } }));
    // ln(0.17/0.08) + 2 ln 4 = 3.526 >= ln(0.9/0.05) = 2.890 (hand computation).
    expect(step?.state).toMatchObject({ model: 'graded', counts: [0, 1, 2], decision: 'reject' });
    expect(step?.run).toMatchObject({ status: 'closed', decision: 'reject', rule: 'rejection line crossed' });
    expect(step?.live).toEqual({ model: 'graded', ...gradedLiveState(gradedSpec, [0, 1, 2]) }); // engine, tested elsewhere
    expect(step?.frame).toMatchObject({ model: 'graded', demerits: [{ className: 'conforming', demerits: 0 }, { className: 'minor', demerits: 1 }, { className: 'major' }] });
    const reopened = value<InspectionRunView>(await dispatch('inspection.open', { runId }));
    expect(reopened.entries.map((entry) => entry.result)).toEqual([{ grade: 'minor' }, { grade: 'major' }, { grade: 'major' }]);
  });

  it('inspection.record refuses a result of another model, naming what the plan takes', async () => {
    const { dispatch, sourceId } = await setUp();
    const cases: Array<[PlanSpec, unknown, RegExp]> = [
      [measurementSpec, 'pass', /This run's plan is measurement: a measurement plan takes a measured value/],
      [lifetimeSpec, { value: 3 }, /This run's plan is lifetime: a lifetime plan takes \{ "time": T \}/],
      [gradedSpec, { grade: 'scrap' }, /"scrap" names no class of this plan; its classes are "conforming", "minor", "major"/],
      [{ model: 'passfail', p0: 0.01, p1: 0.1, alpha: 0.05, beta: 0.1 }, { grade: 'minor' }, /a passfail plan takes "pass" or "fail"/],
    ];
    for (const [spec, result, message] of cases) {
      const view = await startedRun(dispatch, sourceId, spec);
      const answer = await dispatch('inspection.record', { runId: view.run.id, result });
      expect(answer).toMatchObject({ ok: false, code: 'invalid-parameter', field: 'result' });
      if (!answer.ok) expect(answer.message).toMatch(message);
    }
  });

  it('inspection.record refuses a result of no model at the schema, saying what results look like', async () => {
    const { dispatch, sourceId } = await setUp();
    const view = await startedRun(dispatch, sourceId, measurementSpec);
    const answer = await dispatch('inspection.record', { runId: view.run.id, result: true });
    expect(answer).toMatchObject({ ok: false, code: 'invalid-payload' });
    if (!answer.ok) expect(answer.message).toMatch(/A result is "pass" or "fail", a whole number of 0 or more, \{value\}/);
    const extra = await dispatch('inspection.record', { runId: view.run.id, result: { value: 1, extra: true } });
    if (!extra.ok) expect(extra.message).toMatch(/Unrecognized key: "extra"/);
    expect(extra.ok).toBe(false);
  });
});
