/**
 * Decision records of count, measurement, lifetime and graded runs made through the real run service:
 * the text says each model's hypotheses with units, its boundaries in natural units, the entries'
 * values or counts, and the estimate with its method. Page images go to test/artifacts/record/.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { decisionRecordForRun } from '../../src-main/record/input/decisionRecordFromRun.js';
import type { DecisionRecordInput } from '../../src-main/record/input/decisionRecordInput.js';
import { renderDecisionRecord } from '../../src-main/record/pdf/renderDecisionRecord.js';
import type { ItemResult } from '../../src-main/inspection/index.js';
import { gradedSpec, lifetimeSpec, measurementSpec } from '../inspection/modelSpecs.js';
import { recordWorkspace, sourceWithPlan, type RecordWorkspace } from './fromRunFixtures.js';
import { flatten, pdfText, renderPageToPng } from './pdfInspection.js';

interface Made {
  input: DecisionRecordInput;
  text: string;
  pdf: Buffer;
}

async function recordOf(space: RecordWorkspace, spec: Parameters<typeof sourceWithPlan>[3], planName: string, results: ItemResult[]): Promise<Made> {
  const { source, plan } = await sourceWithPlan(space, 'Larkspur Components (invented)', planName, spec, { part: 'Pump shaft', characteristic: planName });
  const { run } = await space.service.startRun({ planId: plan.id, sourceId: source.id, lot: `LK-${spec.model}`, inspector: 'M. Ferrand' });
  for (const result of results) {
    if ((await space.service.recordResult(run.id, { result, actor: 'M. Ferrand', itemId: null })).closedWith !== null) break;
  }
  const input = await decisionRecordForRun(space.data, run.id, new Date('2025-03-14T10:00:00.000Z'));
  const pdf = await renderDecisionRecord(input);
  return { input, pdf, text: flatten((await pdfText(pdf)).join(' ')) };
}

describe('decision records of every model but pass/fail, in their own words and units', () => {
  let space: RecordWorkspace;
  let count: Made;
  let measurement: Made;
  let lifetime: Made;
  let graded: Made;

  beforeAll(async () => {
    space = await recordWorkspace();
    // Invented counts per unit: 3 nonconformities at the seventh unit reach the rejection number ceil(h2 + 7 s) = 3.
    count = await recordOf(space, { model: 'count', lambda0: 0.05, lambda1: 0.3, alpha: 0.05, beta: 0.1 }, 'Casting porosity', [0, 0, 2, 0, 0, 0, 1, 0]);
    // Invented diameters near 10.0 mm: the fourth accepts (LLR 3.125 x (39.96 - 4 x 10.25) = -3.25 <= ln(0.1/0.95) = -2.25).
    measurement = await recordOf(space, measurementSpec, 'Shaft diameter', [10.02, 9.95, 10.11, 9.88, 10.04].map((value) => ({ value })));
    // Invented life test: two failures, then test time past the acceptance line (accepts at the acceptance time).
    lifetime = await recordOf(space, lifetimeSpec, 'Seal life', [{ time: 450 }, { failure: true, time: 700 }, { failure: true, time: 1600 }, { time: 5000 }]);
    // Invented grades: the fifth (the second major) rejects, LLR 3.161 >= ln(0.9/0.05) = 2.890 (hand computation).
    graded = await recordOf(space, gradedSpec, 'Casting finish', ['conforming', 'minor', 'major', 'conforming', 'major', 'major'].map((grade) => ({ grade })));
  }, 120_000);
  afterAll(() => space.cleanup());

  it('a count record names nonconformities, prints each unit\'s count and the Poisson lines', () => {
    const { text, input } = count;
    expect(input.decision.state).toBe('reject');
    expect(text).toContain('Model count (nonconformities per item; Poisson SPRT)');
    expect(text).toContain('H0 (acceptable quality): lambda0 = 0.05 nonconformities per item');
    // Wald (1947), Poisson case: h2 = ln((1 - beta)/alpha)/ln(lambda1/lambda0) = ln 18/ln 6 = 1.6131 and
    // s = (lambda1 - lambda0)/ln(lambda1/lambda0) = 0.25/ln 6 = 0.139528 (hand computation).
    expect(text).toContain('h2 = 1.6131, slope s = 0.139528');
    expect(text).toContain('Nonconformities found 3');
    expect(text).toContain('7 items inspected, 3 nonconformities found');
    expect(text).toContain('Cumulative nonconformities, d (count)');
    expect(input.entries.map((entry) => entry.resultText)).toEqual([
      '0 nonconformities',
      '0 nonconformities',
      '2 nonconformities',
      '0 nonconformities',
      '0 nonconformities',
      '0 nonconformities',
      '1 nonconformity',
    ]);
    expect(renderPageToPng(count.pdf, 'models-count', 1, 80)).toMatch(/\.png$/);
  });

  it('a measurement record states the hypotheses in mm, the lines on the sum, the values and the naive mean', () => {
    const { text, input } = measurement;
    expect(input.decision.state).toBe('accept');
    expect(text).toContain('H0 (acceptable quality): mu0 = 10 mm (mean; known sigma = 0.4 mm)');
    expect(text).toContain('H1 (rejectable quality): mu1 = 10.5 mm');
    expect(text).toMatch(/accept when S <= 10\.2500 n - \d+\.\d{4}; reject when S >= 10\.2500 n \+ \d+\.\d{4}/);
    expect(text).toContain('10.11 mm');
    expect(text).toContain('Naive mean with the 90 % z interval from the known sigma');
    expect(text).toContain('The sequential-exact interval and bias-adjusted estimate are made for pass/fail and count plans only');
    expect(text).not.toContain('10.04 mm');
    // Mean 39.96/4 = 9.99 mm; half width z(0.95) sigma/sqrt(n) = 1.6449 x 0.4/2 = 0.3290 mm
    // (z from a standard normal table, from memory [M]).
    const estimate = input.qualityEstimate;
    expect(estimate?.pointEstimate).toBeCloseTo(9.99, 10);
    expect(estimate?.lower).toBeCloseTo(9.99 - 0.329, 3);
    expect(estimate?.upper).toBeCloseTo(9.99 + 0.329, 3);
    expect(renderPageToPng(measurement.pdf, 'models-measurement', 1, 80)).toMatch(/\.png$/);
  });

  it('a lifetime record states MTBFs in unit-hours, the lines in (T, r), the readings and a chi-square MTBF interval', () => {
    const { text, input } = lifetime;
    expect(input.decision.state).toBe('accept');
    expect(text).toContain('H0 (acceptable quality): theta0 = 1000 unit-hours (MTBF)');
    expect(text).toContain('H1 (rejectable quality): theta1 = 500 unit-hours (MTBF)');
    // ln 2/(1/500 - 1/1000) = 693.15 unit-hours per failure; -ln(0.1/0.9)/0.001 = 2197.22 (hand computation).
    expect(text).toContain('accept when T >= 2197.22 + 693.15 r');
    expect(text).toContain('failure at T = 700 unit-hours');
    expect(text).toContain('T = 5000 unit-hours');
    expect(text).toContain('Naive MTBF T/r with the 90 % chi-square interval');
    // The decision came at the acceptance time after 2 failures: 2197.22 + 2 x 693.15 = 3583.5 unit-hours.
    const estimate = input.qualityEstimate;
    const time = 2197.2245 + 2 * 693.1472;
    expect(text).toContain('3584 unit-hours');
    expect(estimate?.pointEstimate).toBeCloseTo(time / 2, 1);
    // 2T/chi2(0.95; 6) and 2T/chi2(0.05; 4): chi-square table values 12.592 and 0.7107 (from memory [M]).
    expect(estimate?.lower).toBeCloseTo((2 * time) / 12.592, 0);
    expect((estimate?.upper ?? 0) / ((2 * time) / 0.7107)).toBeCloseTo(1, 3);
    // Both lines are drawn: the rejection line from where it meets T = 0, r = 2197.22/693.15 = 3.17 (hand computation).
    expect(input.chart.reject[0]?.[1]).toBeCloseTo(2197.2245 / 693.1472, 4);
    expect(input.chart.reject.length).toBeGreaterThanOrEqual(2);
    expect(renderPageToPng(lifetime.pdf, 'models-lifetime', 1, 80)).toMatch(/\.png$/);
    expect(renderPageToPng(lifetime.pdf, 'models-lifetime', 2, 80)).toMatch(/\.png$/);
  });

  it('a graded record states both class vectors, demerits per class, the grades and the class shares', () => {
    const { text, input } = graded;
    expect(input.decision.state).toBe('reject');
    expect(text).toContain('P0(not conforming) = 0.1 not conforming (by class: conforming 0.9, minor 0.08, major 0.02)');
    expect(text).toContain('P1(not conforming) = 0.25 not conforming (by class: conforming 0.75, minor 0.17, major 0.08)');
    // Demerits: (ln(p1/p0)_k - ln(p1/p0)_0)/(ln(p1/p0)_1 - ln(p1/p0)_0): major = ln(0.08/0.02 / (0.75/0.9)) / ln(0.17/0.08 / (0.75/0.9)) = 1.676 (hand computation).
    expect(text).toContain('conforming 0, minor 1, major 1.676');
    expect(text).toMatch(/accept when D <= \d\.\d{4} n - \d\.\d{4}; reject when D >= \d\.\d{4} n \+ \d\.\d{4}/);
    expect(text).toContain('class shares: conforming 0.4, minor 0.2, major 0.4');
    expect(text).toContain('Naive share of items not conforming with the exact Clopper-Pearson 90 % interval');
    expect(input.entries.map((entry) => entry.resultText)).toEqual(['conforming', 'minor', 'major', 'conforming', 'major']);
    // The chart reaches where acceptance first becomes possible: D <= 0.1948 n - 2.4050 from n = 13.
    expect(input.chart.accept.find((point) => point !== null)?.[0]).toBe(13);
    expect(renderPageToPng(graded.pdf, 'models-graded', 1, 80)).toMatch(/\.png$/);
  });
});
