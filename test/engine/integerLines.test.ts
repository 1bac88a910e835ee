import { describe, expect, it } from 'vitest';
import {
  acceptanceNumber,
  decisionAt,
  rejectionNumber,
  truncationAcceptanceNumber,
} from '../../src-main/engine/index.js';
import type { IntegerLines } from '../../src-main/engine/index.js';
import { linesOf } from './planFixtures.js';

/** Expands "first-last: accept reject" rows (null for x) into per-n checks. */
function expectTable(lines: IntegerLines, rows: Array<[number, number, number | null, number | null]>): void {
  for (const [first, last, accept, reject] of rows) {
    for (let n = first; n <= last; n++) {
      expect(acceptanceNumber(lines, n), `acceptance number at n = ${n}`).toBe(accept);
      const rejection = rejectionNumber(lines, n);
      expect(rejection > n ? null : rejection, `rejection number at n = ${n}`).toBe(reject);
    }
  }
}

describe('acceptance and rejection numbers', () => {
  it('reproduce the NIST table, with acceptance 0 and rejection 3 at n = 24', () => {
    const nist = linesOf({ model: 'passfail', p0: 0.01, p1: 0.1, alpha: 0.05, beta: 0.1 });
    // NIST/SEMATECH e-Handbook §6.2.6 (first-hand): "for n = 24 the acceptance number is 0 and the rejection number is 3".
    expect(acceptanceNumber(nist, 24)).toBe(0);
    expect(rejectionNumber(nist, 24)).toBe(3);
    // NIST/SEMATECH e-Handbook §6.2.6 (first-hand) table for n = 1..120 (x = not possible: null).
    expectTable(nist, [
      [1, 1, null, null],
      [2, 19, null, 2],
      [20, 23, null, 3],
      [24, 45, 0, 3],
      [46, 48, 0, 4],
      [49, 70, 1, 4],
      [71, 73, 1, 5],
      [74, 95, 2, 5],
      [96, 99, 2, 6],
      [100, 120, 3, 6],
    ]);
  });

  it('reproduce the Montgomery table, with acceptance first possible at n = 44', () => {
    const montgomery = linesOf({ model: 'passfail', p0: 0.01, p1: 0.06, alpha: 0.05, beta: 0.1 });
    // Montgomery, Introduction to Statistical Quality Control, §15.5 (from memory) table.
    expectTable(montgomery, [
      [1, 1, null, null],
      [2, 15, null, 2],
      [16, 43, null, 3],
      [44, 50, 0, 3],
      [51, 79, 0, 4],
      [80, 86, 1, 4],
      [87, 114, 1, 5],
    ]);
  });

  it('count a point exactly on a line as on it, despite floating-point error', () => {
    // common practice, no source: floor/ceil with a 1e-12 guard. In doubles 0.1 * 29 + 0.1 is
    // 3.0000000000000004 and 0.3 * 24 - 0.2 is 6.999999999999999; both points lie on their lines.
    const rejectLine: IntegerLines = { h1: 1, h2: 0.1, slope: 0.1, truncation: null };
    expect(0.1 * 29 + 0.1).toBeGreaterThan(3); // the unguarded ceil would give 4
    expect(rejectionNumber(rejectLine, 29)).toBe(3);
    const acceptLine: IntegerLines = { h1: 0.2, h2: 1, slope: 0.3, truncation: null };
    expect(0.3 * 24 - 0.2).toBeLessThan(7); // the unguarded floor would give 6
    expect(acceptanceNumber(acceptLine, 24)).toBe(7);
  });

  it('acceptanceNumber(plan, n) is null before the first possible acceptance', () => {
    const lines: IntegerLines = { h1: 2.5, h2: 1, slope: 0.25, truncation: null };
    expect(acceptanceNumber(lines, 9)).toBeNull();
    expect(acceptanceNumber(lines, 10)).toBe(0);
  });
});

describe('decisionAt', () => {
  const nist = linesOf({ model: 'passfail', p0: 0.01, p1: 0.1, alpha: 0.05, beta: 0.1 }, 156);

  it('continues between the lines, accepts on or below the acceptance number, rejects on or above the rejection number', () => {
    expect(decisionAt(nist, 24, 1).decision).toBe('continue');
    expect(decisionAt(nist, 24, 0).decision).toBe('accept');
    expect(decisionAt(nist, 24, 3).decision).toBe('reject');
  });

  it('names truncation decisions "accept at truncation" and "reject at truncation"', () => {
    // exact recursion over the integer lines (computed independently, checked by simulation): at n_t = 156 accept iff d <= floor(s n_t) = 6.
    expect(truncationAcceptanceNumber(nist)).toBe(6);
    const accepted = decisionAt(nist, 156, 6);
    expect(accepted.decision).toBe('accept');
    expect(accepted.rule).toMatch(/^accept at truncation/);
    const rejected = decisionAt(nist, 156, 7);
    expect(rejected.decision).toBe('reject');
    expect(rejected.rule).toMatch(/^reject at truncation/);
  });
});
