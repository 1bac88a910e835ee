import { describe, expect, it } from 'vitest';
import { runCli } from './runCli.js';

const measurement = ['--model', 'measurement', '--mu0', '0', '--mu1', '1', '--sigma', '1', '--alpha', '0.05', '--beta', '0.1'];
const lifetime = ['--model', 'lifetime', '--theta0', '2000', '--theta1', '1000', '--alpha', '0.1', '--beta', '0.1'];
const graded = ['--model', 'graded', '--classes', 'conforming,minor,major', '--p0', '0.90,0.08,0.02', '--p1', '0.75,0.17,0.08', '--alpha', '0.05', '--beta', '0.1'];

describe('tallyline plan and replay for measurement, lifetime and graded models', () => {
  it('plans a measurement model as JSON: normal SPRT by the Fredholm integral equation (computed independently) exact OC 0.97066 at mu0, lines in sum units', async () => {
    const { code, stdout, stderr } = await runCli(['plan', ...measurement, '--points', '3', '--json']);
    expect(stderr).toBe('');
    expect(code).toBe(0);
    const design = JSON.parse(stdout);
    expect(1 - design.exact.alpha).toBeCloseTo(0.97066, 4); // normal SPRT by the Fredholm integral equation (computed independently)
    expect(design.boundaries.slope).toBe(0.5);
    expect(design.limits[0]).toEqual({ n: 1, accept: expect.any(Number), reject: expect.any(Number) });
    expect(Object.keys(design)).toEqual(expect.arrayContaining(['boundaries', 'kl', 'wald', 'exact', 'curve', 'limits', 'corrected']));
  });

  it('plans a lifetime model in the spec time unit: Epstein and Sobel 1955 lines (computed independently) accept time 4.3944 theta1 at zero failures', async () => {
    const { code, stdout } = await runCli(['plan', ...lifetime, '--max-failures', '12', '--points', '2', '--json']);
    expect(code).toBe(0);
    const design = JSON.parse(stdout);
    expect(design.boundaries.acceptTimeAtZero).toBeCloseTo(4394.4, 1); // Epstein and Sobel 1955 lines (computed independently), theta1 = 1000
    expect(design.maxFailures).toBe(12);
    expect(design.limits.at(-1).failures).toBe(12);
  });

  it('plans a graded model with its demerit lines and exact values', async () => {
    const { code, stdout } = await runCli(['plan', ...graded, '--truncate', '100', '--points', '2', '--json']);
    expect(code).toBe(0);
    const design = JSON.parse(stdout);
    expect(design.boundaries.demerits.map((row: { demerits: number }) => row.demerits)[1]).toBe(1);
    expect(design.exact.alpha).toBeLessThan(0.05);
    expect(design.simulated).toBeNull();
  });

  it('replays each model to its decision', async () => {
    const values = await runCli(['replay', ...measurement, '--results', '-', '--json'], { input: '1.9\n1.4\n2.2\n0.1\n' });
    // LLR after 3 values: 1 x (5.5 - 3 x 0.5) = 4 >= ln 18 = 2.89 (after 2: 2.3, continue).
    expect(JSON.parse(values.stdout)).toMatchObject({ decision: 'reject', n: 3 });
    const times = await runCli(['replay', ...lifetime, '--results', '-', '--json'], { input: 'time 3000\nfail\nfail 3500\ntime 20000\nfail\n' });
    // Accept line after 2 failures: 4394.4 + 2 x 1386.3 = 7167 (Epstein and Sobel 1955 lines (computed independently) form); the test decides there.
    const lifetimeResult = JSON.parse(times.stdout);
    expect(lifetimeResult).toMatchObject({ decision: 'accept', failures: 2 });
    expect(lifetimeResult.time).toBeCloseTo(7167.0, 0);
    const classes = await runCli(['replay', ...graded, '--results', '-', '--json'], { input: 'major\n2\nMAJOR\nminor\n' });
    expect(JSON.parse(classes.stdout)).toMatchObject({ decision: 'reject', n: 3, counts: [0, 0, 3] });
  });

  it('replays the same measured values in two orders to the same decision when their sum lies on the truncation line', async () => {
    const flags = ['--model', 'measurement', '--mu0', '10', '--mu1', '11', '--sigma', '1', '--alpha', '0.1', '--beta', '0.1', '--truncate', '3'];
    for (const input of ['10.3\n10.4\n10.8\n', '10.3\n10.8\n10.4\n']) {
      const replayed = await runCli(['replay', ...flags, '--results', '-', '--json'], { input });
      // 10.3 + 10.4 + 10.8 = 31.5 = 3 x 10.5 exactly: LLR 0, accepted at the truncation (hand computation).
      expect(JSON.parse(replayed.stdout)).toMatchObject({ decision: 'accept', n: 3, rule: 'accept at truncation' });
    }
  });

  const badCases: Array<[string, string[], RegExp]> = [
    ['a graded vector that does not sum to 1', [...graded.slice(0, 4), '--p0', '0.9,0.08,0.03', ...graded.slice(6)], /--p0: p0 must sum to 1/],
    ['a graded vector of the wrong length', [...graded.slice(0, 4), '--p0', '0.9,0.1', ...graded.slice(6)], /--p0 must be 3 probabilities/],
    ['theta1 above theta0', [...lifetime.slice(0, 4), '--theta1', '3000', ...lifetime.slice(6)], /--theta1: theta1 must be less than theta0/],
    ['a flag of another model', [...measurement, '--max-time', '10'], /--max-time does not apply to --model measurement/],
    ['a zero sigma', [...measurement.slice(0, 6), '--sigma', '0', ...measurement.slice(8)], /--sigma must be a number greater than 0/],
    ['a missing mu1', [...measurement.slice(0, 4), ...measurement.slice(6)], /--mu1 is required: a finite number/],
  ];
  it.concurrent.each(badCases)('exits 2 with one line naming the flag for %s', async (_, args, message) => {
    const { code, stdout, stderr } = await runCli(['plan', ...args]);
    expect(code).toBe(2);
    expect(stdout).toBe('');
    expect(stderr.trimEnd().split('\n')).toHaveLength(1);
    expect(stderr).toMatch(message);
  });

  it('exits 2 naming the line of a results file that does not fit the model', async () => {
    const { code, stderr } = await runCli(['replay', ...lifetime, '--results', '-'], { input: 'time 50\nfail 20\n' });
    expect(code).toBe(2);
    expect(stderr).toMatch(/--results line 2: accumulated test time never goes down: it is 50 now, so 20 is not allowed/);
  });
});
