import { describe, expect, it } from 'vitest';
import { acceptTime, lifetimePlan } from '../../src-main/engine/index.js';
import { ResultRefusedError, RunReplay, type RunState } from '../../src-main/inspection/index.js';
import { analyseJournal, layout } from '../../src-main/store/index.js';
import { readFile } from 'node:fs/promises';
import { workspace } from './helpers.js';
import { gradedLlr, gradedSpec, lifetimeLlr, lifetimeSpec, measurementLlr, measurementSpec } from './modelSpecs.js';

async function started(spec: Parameters<typeof workspace>[0]) {
  const space = await workspace(spec);
  const { run } = await space.service.startRun({ planId: space.plan.id, sourceId: space.source.id, lot: 'L-77', inspector: 'Ana' });
  return { ...space, runId: run.id };
}

/** The state a reopened run rebuilds from its journal alone. */
async function replayed(data: string, runId: string): Promise<RunState> {
  const analysis = analyseJournal(await readFile(layout.runJournal(data, runId)));
  return RunReplay.fromEntries(analysis.entries).evidence.state();
}

describe('measurement runs', () => {
  it('add each value to n and the sum, with the LLR of the normal model', async () => {
    const { service, runId } = await started(measurementSpec);
    await service.recordResult(runId, { result: { value: 10.2 }, actor: 'Ana' });
    const outcome = await service.recordResult(runId, { result: { value: 10.1 }, actor: 'Ana' });
    expect(outcome.state).toMatchObject({ model: 'measurement', decision: 'continue', n: 2, rule: null });
    if (outcome.state.model !== 'measurement') throw new Error('not a measurement state');
    expect(outcome.state.sum).toBeCloseTo(20.3, 12);
    expect(outcome.state.mean).toBeCloseTo(10.15, 12);
    expect(outcome.state.llr).toBeCloseTo(measurementLlr(measurementSpec, 2, 20.3), 10);
  });

  it('close at the rejection line with its rule once high values cross it', async () => {
    const { service, runId } = await started(measurementSpec);
    let outcome;
    do outcome = await service.recordResult(runId, { result: { value: 10.9 }, actor: 'Ana' });
    while (outcome.closedWith === null && outcome.state.n < 50);
    // ln A = ln(0.9/0.05) = 2.890; each 10.9 adds 0.5/0.16 x (10.9 - 10.25) = 2.031 (hand computation): the second value rejects.
    expect(outcome.state.n).toBe(2);
    expect(outcome.closedWith).toMatchObject({ decision: 'reject', rule: 'rejection line crossed' });
    expect((await service.openRun(runId)).run).toMatchObject({ status: 'closed', decision: 'reject', rule: 'rejection line crossed' });
  });

  it('leave a voided value out of the sum', async () => {
    const { service, runId, data } = await started(measurementSpec);
    await service.recordResult(runId, { result: { value: 10.0 }, actor: 'Ana' });
    await service.recordResult(runId, { result: { value: 10.4 }, actor: 'Ana' });
    const voided = await service.voidLastEntry(runId, 'gauge not zeroed', 'Ana');
    expect(voided.state).toMatchObject({ n: 1, sum: 10, mean: 10 });
    expect(await replayed(data, runId)).toEqual(voided.state);
  });

  it('refuse a result of another model, naming what is allowed', async () => {
    const { service, runId } = await started(measurementSpec);
    const refused = service.recordResult(runId, { result: 'pass', actor: 'Ana' });
    await expect(refused).rejects.toBeInstanceOf(ResultRefusedError);
    await expect(service.recordResult(runId, { result: 'pass', actor: 'Ana' })).rejects.toThrow(/measured value \{ "value": number \} in mm/);
  });
});

describe('lifetime runs', () => {
  it('take time readings as the accumulated test time and failures one by one', async () => {
    const { service, runId } = await started(lifetimeSpec);
    await service.recordResult(runId, { result: { time: 300 }, actor: 'Ana' });
    await service.recordResult(runId, { result: { failure: true }, actor: 'Ana' });
    const outcome = await service.recordResult(runId, { result: { failure: true, time: 700.5 }, actor: 'Ana' });
    expect(outcome.state).toMatchObject({ model: 'lifetime', decision: 'continue', n: 3, time: 700.5, failures: 2, total: 2 });
    expect(outcome.state.llr).toBeCloseTo(lifetimeLlr(lifetimeSpec, 700.5, 2), 12);
  });

  it('refuse a time reading below the accumulated time', async () => {
    const { service, runId } = await started(lifetimeSpec);
    await service.recordResult(runId, { result: { time: 800 }, actor: 'Ana' });
    await expect(service.recordResult(runId, { result: { time: 600 }, actor: 'Ana' })).rejects.toThrow(/never goes down: it is 800 now/);
    await expect(service.recordResult(runId, { result: { failure: true, time: 799 }, actor: 'Ana' })).rejects.toBeInstanceOf(ResultRefusedError);
  });

  it('give back the previous test time when a time reading is voided', async () => {
    const { service, runId, data } = await started(lifetimeSpec);
    await service.recordResult(runId, { result: { time: 400 }, actor: 'Ana' });
    await service.recordResult(runId, { result: { failure: true }, actor: 'Ana' });
    await service.recordResult(runId, { result: { time: 1200 }, actor: 'Ana' });
    const voided = await service.voidLastEntry(runId, 'meter read twice', 'Ana');
    expect(voided.state).toMatchObject({ time: 400, failures: 1, n: 2 });
    expect(await replayed(data, runId)).toEqual(voided.state);
    // After the void a reading may again lie between 400 and 1200.
    const next = await service.recordResult(runId, { result: { time: 900 }, actor: 'Ana' });
    expect(next.state).toMatchObject({ time: 900, failures: 1 });
  });

  it('decide a time jump past the acceptance line at the acceptance time', async () => {
    const { service, runId } = await started(lifetimeSpec);
    await service.recordResult(runId, { result: { failure: true, time: 100 }, actor: 'Ana' });
    const outcome = await service.recordResult(runId, { result: { time: 10_000 }, actor: 'Ana' });
    // Accept time after 1 failure: (ln 2 - ln(0.1/0.9))/(1/500 - 1/1000) = 2890.4 unit-hours (hand computation).
    const expected = (Math.log(2) - Math.log(0.1 / 0.9)) / (1 / 500 - 1 / 1000);
    expect(outcome.closedWith).toMatchObject({ decision: 'accept', rule: 'acceptance line crossed' });
    if (outcome.state.model !== 'lifetime') throw new Error('not a lifetime state');
    expect(outcome.state.time).toBeCloseTo(expected, 6);
    expect(outcome.state.time).toBeCloseTo(acceptTime(lifetimePlan(lifetimeSpec), 1), 9); // engine, tested elsewhere
    expect(outcome.state.llr).toBeCloseTo(Math.log(0.1 / 0.9), 9);
  });

  it('do not count a failure reported after a time that already accepted', async () => {
    const { service, runId } = await started(lifetimeSpec);
    const outcome = await service.recordResult(runId, { result: { failure: true, time: 5000 }, actor: 'Ana' });
    expect(outcome.state).toMatchObject({ decision: 'accept', failures: 0 });
  });

  it('reject once failures come fast enough', async () => {
    const { service, runId } = await started(lifetimeSpec);
    let outcome;
    do outcome = await service.recordResult(runId, { result: { failure: true }, actor: 'Ana' });
    while (outcome.closedWith === null && outcome.state.n < 20);
    // At T = 0 each failure adds ln 2; ln A = ln 9 = 2.197, so the 4th failure rejects (hand computation).
    expect(outcome.state).toMatchObject({ decision: 'reject', failures: 4, rule: 'rejection line crossed' });
  });
});

describe('graded runs', () => {
  it('count items per class by name, any case, and store the plan spelling', async () => {
    const { service, runId } = await started(gradedSpec);
    await service.recordResult(runId, { result: { grade: 'Conforming' }, actor: 'Ana' });
    const outcome = await service.recordResult(runId, { result: { grade: ' MINOR ' }, actor: 'Ana' });
    expect(outcome.state).toMatchObject({ model: 'graded', n: 2, counts: [1, 1, 0] });
    expect(outcome.entry?.result).toEqual({ grade: 'minor' });
    expect(outcome.state.llr).toBeCloseTo(gradedLlr(gradedSpec, [1, 1, 0]), 12);
  });

  it('refuse a grade that names no class, listing the classes', async () => {
    const { service, runId } = await started(gradedSpec);
    await expect(service.recordResult(runId, { result: { grade: 'critical' }, actor: 'Ana' })).rejects.toThrow(
      /"critical" names no class of this plan; its classes are "conforming", "minor", "major"/,
    );
  });

  it('reject after enough major items, and leave a voided item out of the counts', async () => {
    const { service, runId, data } = await started(gradedSpec);
    await service.recordResult(runId, { result: { grade: 'major' }, actor: 'Ana' });
    const voided = await service.voidLastEntry(runId, 'wrong part', 'Ana');
    expect(voided.state).toMatchObject({ n: 0, counts: [0, 0, 0] });
    let outcome;
    do outcome = await service.recordResult(runId, { result: { grade: 'major' }, actor: 'Ana' });
    while (outcome.closedWith === null && outcome.state.n < 20);
    // Each major adds ln 4 = 1.386; ln A = ln(0.9/0.05) = 2.890, so the 3rd major rejects (hand computation).
    expect(outcome.state).toMatchObject({ decision: 'reject', n: 3, counts: [0, 0, 3], rule: 'rejection line crossed' });
    expect(await replayed(data, runId)).toEqual(outcome.state);
  });
});
