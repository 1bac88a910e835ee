import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { runCli } from './runCli.js';

const nistFlags = ['--model', 'passfail', '--p0', '0.01', '--p1', '0.10', '--alpha', '0.05', '--beta', '0.10'];
const folder = mkdtempSync(join(tmpdir(), 'tallyline-replay-'));

function resultsFile(name: string, lines: string[]): string {
  const path = join(folder, name);
  writeFileSync(path, `${lines.join('\n')}\n`);
  return path;
}

describe('tallyline replay', () => {
  it('accepts after 24 passing items in the NIST plan and ignores what follows the decision', async () => {
    // NIST §6.2.6 (first-hand): acceptance first possible at n = 24 with 0 nonconforming.
    const path = resultsFile('accept.txt', [...Array(24).fill('pass'), 'fail', 'fail', 'fail']);
    const { code, stdout } = await runCli(['replay', ...nistFlags, '--results', path, '--json']);
    expect(code).toBe(0);
    const summary = JSON.parse(stdout);
    expect(summary).toMatchObject({ decision: 'accept', n: 24, total: 0 });
    expect(summary.llr).toBeCloseTo(24 * Math.log(0.9 / 0.99), 12);
  });

  it('rejects at the second nonconforming item among the first 19, reading 0/1 and skipping blanks and comments', async () => {
    // NIST/SEMATECH e-Handbook §6.2.6 (first-hand): rejection number 2 for n = 2..19.
    const path = resultsFile('reject.txt', ['# lot 7', '0', '', '1', '0', '1', '0']);
    const { code, stdout } = await runCli(['replay', ...nistFlags, '--results', path, '--json']);
    expect(code).toBe(0);
    expect(JSON.parse(stdout)).toMatchObject({ decision: 'reject', n: 4, total: 2 });
  });

  it('says continue when the results run out first, and reads standard input for -', async () => {
    const { code, stdout } = await runCli(['replay', ...nistFlags, '--results', '-', '--json'], { input: 'pass\nFAIL\npass\n' });
    expect(code).toBe(0);
    expect(JSON.parse(stdout)).toMatchObject({ decision: 'continue', n: 3, total: 1 });
  });

  it('decides at the truncation with the rule named', async () => {
    const path = resultsFile('truncate.txt', ['1', '0', '0', '0', '0']);
    const { stdout } = await runCli(['replay', ...nistFlags, '--truncate', '5', '--results', path, '--json']);
    // At n_t = 5, floor(0.0397 x 5) = 0 < 1 nonconforming: reject at truncation.
    const summary = JSON.parse(stdout);
    expect(summary).toMatchObject({ decision: 'reject', n: 5, total: 1 });
    expect(summary.rule).toMatch(/^reject at truncation/);
  });

  it('replays counts per unit for the count model and prints a readable table without --json', async () => {
    // Poisson SPRT lines and exact recursion (computed independently; no published example) lines for lambda 1 -> 2: Re(1) = ceil(1.4427 + 3.1699) = 5.
    const path = resultsFile('counts.txt', ['2', '5']);
    const { code, stdout } = await runCli([
      'replay', '--model', 'count', '--lambda0', '1', '--lambda1', '2', '--alpha', '0.1', '--beta', '0.1', '--results', path,
    ]);
    expect(code).toBe(0);
    expect(stdout).toMatch(/^n\s+result\s+total\s+LLR$/m);
    expect(stdout).toMatch(/^2\s+5\s+7\s/m);
    expect(stdout).toContain('Decision: reject after 2 items, total 7');
  });

  it('exits 2 naming --results and the line for a result that is not pass/fail', async () => {
    const path = resultsFile('bad.txt', ['pass', 'maybe']);
    const { code, stderr } = await runCli(['replay', ...nistFlags, '--results', path, '--json']);
    expect(code).toBe(2);
    expect(stderr.trim()).toBe('tallyline replay: --results line 2: "maybe" is not pass, fail, 0 or 1');
  });

  it('exits 2 naming --results for a file that cannot be read', async () => {
    const { code, stderr } = await runCli(['replay', ...nistFlags, '--results', join(folder, 'missing.txt')]);
    expect(code).toBe(2);
    expect(stderr).toMatch(/^tallyline replay: --results: cannot read ".*missing.txt" \(ENOENT\)\n$/);
  });
});
