/** `run start` with each new model's plan flags and `feed` to a decision, through the real CLI. */
import { mkdtemp, rm } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { runCli } from './runCli.js';

describe('tallyline run start and feed for measurement, lifetime and graded plans', () => {
  let data: string;
  beforeAll(async () => {
    data = await mkdtemp(path.join(os.tmpdir(), 'tallyline-feed-models-'));
  });
  afterAll(() => rm(data, { recursive: true, force: true }));

  async function start(planFlags: string[]): Promise<string> {
    const started = await runCli(['run', 'start', ...planFlags, '--source', 'Larkspur Components (invented)', '--lot', 'LK-9', '--data-dir', data, '--json']);
    expect(started.stderr).toBe('');
    expect(started.code).toBe(0);
    return JSON.parse(started.stdout).run as string;
  }

  async function show(runId: string): Promise<{ state: Record<string, unknown>; plan: { spec: Record<string, unknown> }; entries: Array<{ result: unknown }> }> {
    const shown = await runCli(['run', 'show', '--run', runId, '--data-dir', data, '--json']);
    expect(shown.code).toBe(0);
    return JSON.parse(shown.stdout);
  }

  it('feeds measured values to a decision and stops at the deciding line', async () => {
    const runId = await start(['--model', 'measurement', '--mu0', '10', '--mu1', '10.5', '--sigma', '0.4', '--alpha', '0.05', '--beta', '0.1', '--unit', 'mm']);
    // 10.9 twice: LLR 2 x 3.125 x 0.65 = 4.06 >= ln(0.9/0.05) = 2.89 rejects (hand computation); the third line is not read.
    const fed = await runCli(['feed', '--run', runId, '--data-dir', data, '--json'], { input: '# diameters\n10.9\n10.9\n10.0\n' });
    expect(fed.stderr).toBe('');
    expect(fed.code).toBe(0);
    expect(fed.stdout).toBe('{"seq":1,"state":"continue"}\n{"seq":2,"state":"reject"}\n');
    const shown = await show(runId);
    expect(shown.plan.spec).toMatchObject({ model: 'measurement', unit: 'mm' });
    expect(shown.state).toMatchObject({ decision: 'reject', n: 2, sum: 21.8, mean: 10.9 });
    expect(shown.entries.map((entry) => entry.result)).toEqual([{ value: 10.9 }, { value: 10.9 }]);
  });

  it('feeds the same measured values in two orders to the same decision when their sum lies on the truncation line', async () => {
    const flags = ['--model', 'measurement', '--mu0', '10', '--mu1', '11', '--sigma', '1', '--alpha', '0.1', '--beta', '0.1', '--truncate', '3'];
    for (const input of ['10.3\n10.4\n10.8\n', '10.3\n10.8\n10.4\n']) {
      const runId = await start(flags);
      const fed = await runCli(['feed', '--run', runId, '--data-dir', data, '--json'], { input });
      expect(fed.code).toBe(0);
      // 10.3 + 10.4 + 10.8 = 31.5 = 3 x 10.5 exactly: LLR 0, accepted at the truncation (hand computation).
      expect(fed.stdout.trim().split('\n').map((line) => JSON.parse(line).state)).toEqual(['continue', 'continue', 'accept']);
    }
  });

  it('feeds time readings and failures to an acceptance, and refuses a bad line with its number', async () => {
    const runId = await start(['--model', 'lifetime', '--theta0', '1000', '--theta1', '500', '--alpha', '0.1', '--beta', '0.1', '--unit', 'unit-hours']);
    const bad = await runCli(['feed', '--run', runId, '--data-dir', data], { input: 'time 120.5\nfail\nbroke\n' });
    expect(bad.code).toBe(2);
    expect(bad.stderr).toContain('line 3: "broke" is not "time T", "fail" or "fail T"');
    const down = await runCli(['feed', '--run', runId, '--data-dir', data], { input: 'time 100\n' });
    expect(down.code).toBe(2);
    expect(down.stderr).toContain('line 1: accumulated test time never goes down: it is 120.5 now');
    // After 2 failures the acceptance time is 2197.2 + 2 x 693.1 = 3583.5 unit-hours (hand computation).
    const fed = await runCli(['feed', '--run', runId, '--data-dir', data, '--json'], { input: 'fail 900\ntime 3000\ntime 4000\n' });
    expect(fed.code).toBe(0);
    expect(fed.stdout.trim().split('\n').map((line) => JSON.parse(line).state)).toEqual(['continue', 'continue', 'accept']);
    const shown = await show(runId);
    expect(shown.state).toMatchObject({ decision: 'accept', failures: 2 });
    expect(shown.state.time as number).toBeCloseTo(3583.52, 1);
    const text = await runCli(['run', 'show', '--run', runId, '--data-dir', data]);
    expect(text.stdout).toContain('fail 900');
    expect(text.stdout).toContain('State: accept (acceptance line crossed), test time = 3584, failures = 2');
  });

  it('feeds grades by class name or index to a rejection', async () => {
    const runId = await start([
      '--model', 'graded', '--classes', 'conforming,minor,major', '--p0', '0.9,0.08,0.02', '--p1', '0.75,0.17,0.08', '--alpha', '0.05', '--beta', '0.1',
    ]);
    const bad = await runCli(['feed', '--run', runId, '--data-dir', data], { input: 'critical\n' });
    expect(bad.code).toBe(2);
    expect(bad.stderr).toContain('line 1: "critical" is not a class of this plan (conforming, minor, major) or its index 0 to 2');
    // minor + 2 major: LLR ln(0.17/0.08) + 2 ln 4 = 3.53 >= 2.89 rejects (hand computation).
    const fed = await runCli(['feed', '--run', runId, '--data-dir', data, '--json'], { input: 'Minor\n2\nmajor\nconforming\n' });
    expect(fed.code).toBe(0);
    expect(fed.stdout.trim().split('\n').map((line) => JSON.parse(line).state)).toEqual(['continue', 'continue', 'reject']);
    const shown = await show(runId);
    expect(shown.state).toMatchObject({ decision: 'reject', n: 3, counts: [0, 1, 2] });
    expect(shown.entries.map((entry) => entry.result)).toEqual([{ grade: 'minor' }, { grade: 'major' }, { grade: 'major' }]);
    const verified = await runCli(['verify', '--run', runId, '--data-dir', data]);
    expect(verified.code).toBe(0);
  });

  it('refuses a flag of another model at run start', async () => {
    const refused = await runCli(['run', 'start', '--model', 'lifetime', '--theta0', '1000', '--theta1', '500', '--sigma', '2', '--alpha', '0.1', '--beta', '0.1', '--source', 'X', '--lot', 'L', '--data-dir', data]);
    expect(refused.code).toBe(2);
    expect(refused.stderr).toContain('--sigma');
  });
});
