import { describe, expect, it } from 'vitest';
import { runCli } from './runCli.js';

const nistFlags = ['--model', 'passfail', '--p0', '0.01', '--p1', '0.10', '--alpha', '0.05', '--beta', '0.10'];

describe('tallyline plan', () => {
  it('prints the NIST example as JSON with the contract keys: h1 0.939, h2 1.205, slope 0.0397, single (52, 2)', async () => {
    const { code, stdout, stderr } = await runCli(['plan', ...nistFlags, '--points', '5', '--json']);
    expect(stderr).toBe('');
    expect(code).toBe(0);
    const design = JSON.parse(stdout);
    // NIST/SEMATECH e-Handbook §6.2.6, printed values (from memory), recomputed in NIST/SEMATECH e-Handbook §6.2.6 (first-hand).
    expect(design.boundaries.h1).toBeCloseTo(0.939, 3);
    expect(design.boundaries.h2).toBeCloseTo(1.205, 3);
    expect(design.boundaries.slope).toBeCloseTo(0.0397, 4);
    expect(Object.keys(design.boundaries).sort()).toEqual(['h1', 'h2', 'lnA', 'lnB', 'slope']);
    expect(Object.keys(design.kl).sort()).toEqual(['h0h1', 'h1h0']);
    expect(Object.keys(design.wald).sort()).toEqual(['asnH0', 'asnH1', 'asnMax']);
    expect(Object.keys(design.exact.quantilesH1).sort()).toEqual(['p50', 'p90', 'p99']);
    // Montgomery §15.2.3 (first-hand), minimal plans computed independently.
    expect(design.single).toMatchObject({ n: 52, c: 2 });
    expect(design.limits[0]).toEqual({ n: 1, accept: null, reject: 2 });
    expect(design.curve).toHaveLength(5);
    expect(Object.keys(design.curve[0]).sort()).toEqual(['asnExact', 'asnWald', 'ocExact', 'ocWald', 'theta']);
  });

  it('prints readable tables without --json, with the NIST limits collapsed into ranges', async () => {
    const { code, stdout } = await runCli(['plan', ...nistFlags, '--points', '3']);
    expect(code).toBe(0);
    expect(stdout).toContain('Single plan: n = 52, c = 2');
    // NIST/SEMATECH e-Handbook §6.2.6 (first-hand) table: n 24-45 accept 0, reject 3; NIST §6.2.6 (first-hand) for n = 24.
    expect(stdout).toMatch(/^24-45\s+0\s+3$/m);
    expect(stdout).toMatch(/^2-19\s+x\s+2$/m);
    expect(stdout).toContain('OC and ASN curve');
    expect(() => JSON.parse(stdout)).toThrow();
  });

  it('designs count plans and applies --truncate and --fit exact', async () => {
    const { code, stdout } = await runCli([
      'plan', '--model', 'count', '--lambda0', '1', '--lambda1', '2', '--alpha', '0.1', '--beta', '0.1',
      '--truncate', '40', '--fit', 'exact', '--points', '2', '--json',
    ]);
    expect(code).toBe(0);
    const design = JSON.parse(stdout);
    expect(design.model).toBe('count');
    expect(design.truncation).toBe(40);
    expect(design.fit.mode).toBe('exact');
    expect(design.exact.alpha).toBeLessThanOrEqual(0.1);
    expect(design.exact.beta).toBeLessThanOrEqual(0.1);
    expect(design.limits).toHaveLength(40);
  });

  const badCases: Array<[string, string[], RegExp]> = [
    ['a probability out of range', ['--p0', '1.5'], /--p0 must be a fraction above 0 and below 1 \(or a percent such as 1%\) \(got "1.5"\)/],
    ['a percent out of range, answered in percent', ['--p1', '100%'], /--p1 must be a percent above 0% and below 100% \(got "100%"\)/],
    ['a negative percent, answered in percent', ['--p0', '-1%'], /--p0 must be a percent above 0% and below 100% \(got "-1%"\)/],
    ['a value that is not a number', ['--alpha', 'five'], /--alpha must be a fraction above 0 and below 1/],
    ['p1 below p0 typed in percent, answered in percent', ['--p0', '1%', '--p1', '0.5%'], /--p1: p1 must be greater than p0 \(got p0 = 1%, p1 = 0.5%\)/],
    ['p1 below p0', ['--p1', '0.005'], /--p1: p1 must be greater than p0/],
    ['risks that sum to 1 or more', ['--alpha', '0.5', '--beta', '0.5'], /--beta: alpha \+ beta must be less than 1/],
    ['a zero truncation', ['--truncate', '0'], /--truncate must be an integer >= 1 \(got "0"\)/],
    ['too few curve points', ['--points', '1'], /--points must be an integer from 2 to 10001/],
    ['an unknown flag', ['--colour', 'red'], /unknown flag --colour/],
    ['a flag of the other model', ['--lambda0', '1'], /--lambda0 belongs to --model count/],
  ];
  it.each(badCases)('exits 2 with one line naming the flag for %s', async (_, change, message) => {
    const flags = [...nistFlags];
    for (let i = 0; i < change.length; i += 2) {
      const at = flags.indexOf(change[i]);
      if (at >= 0) flags.splice(at, 2);
    }
    const { code, stdout, stderr } = await runCli(['plan', ...flags, ...change]);
    expect(code).toBe(2);
    expect(stdout).toBe('');
    expect(stderr.trimEnd().split('\n')).toHaveLength(1);
    expect(stderr).toMatch(message);
  });

  it('exits 2 naming a missing required flag and what it takes', async () => {
    const { code, stderr } = await runCli(['plan', '--model', 'passfail', '--p0', '0.01', '--alpha', '0.05', '--beta', '0.1']);
    expect(code).toBe(2);
    expect(stderr.trim()).toBe('tallyline plan: --p1 is required: a fraction in (0, 1) or a percent in (0%, 100%), e.g. 0.01 or 1%');
  });

  it('takes proportions in percent as well as fractions and prints fractions in JSON', async () => {
    const inPercent = await runCli(['plan', '--model', 'passfail', '--p0', '1%', '--p1', '10 %', '--alpha', '5%', '--beta', '10%', '--points', '2', '--json']);
    const inFractions = await runCli(['plan', ...nistFlags, '--points', '2', '--json']);
    expect(inPercent.stderr).toBe('');
    expect(inPercent.code).toBe(0);
    expect(JSON.parse(inPercent.stdout)).toEqual(JSON.parse(inFractions.stdout));
    // Montgomery §15.2.3 (first-hand): the single plan with these risks is n = 52, c = 2.
    expect(JSON.parse(inPercent.stdout).single).toMatchObject({ n: 52, c: 2 });
  });
});

describe('the tallyline command', () => {
  it('exits 2 naming an unknown command and listing the known ones', async () => {
    const { code, stderr } = await runCli(['plot']);
    expect(code).toBe(2);
    expect(stderr).toMatch(/unknown command "plot" \(commands: plan, replay/);
  });

  it('runs from the bin entry in any working directory', async () => {
    const { code, stdout } = await runCli(['plan', ...nistFlags, '--points', '2', '--json'], {
      entry: ['src-main/bin/tallyline.js'],
    });
    expect(code).toBe(0);
    expect(JSON.parse(stdout).single).toMatchObject({ n: 52, c: 2 });
  });
});
