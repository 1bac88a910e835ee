/**
 * The design's curves and tables, laid out as uPlot columns in the units the engineer reads
 * (percent, items). Only rearranging and scaling: every value comes from the engine.
 */
import type uPlot from 'uplot';
import type { LinearDesign as LinearCountDesign } from './designKinds';
import type { QualityScale } from './qualityScale';

/** One figure of the Plan place: its options and columns for the chart wrapper. */
export interface PlanChart {
  id: string;
  title: string;
  options: Omit<uPlot.Options, 'width' | 'height'>;
  data: uPlot.AlignedData;
  summary: string;
  /** Takes a whole row of the grid. */
  wide?: boolean;
}

export const none: uPlot.AlignedData = [[]];

/** OC curves in percent accepted, with the two design points (p0, 1 - alpha) and (p1, beta) as markers. */
export function ocColumns(design: LinearCountDesign | null, scale: QualityScale): uPlot.AlignedData {
  if (!design) return none;
  const designPoints = new Map([
    [design.hypotheses.theta0, 100 * (1 - design.risks.alpha)],
    [design.hypotheses.theta1, 100 * design.risks.beta],
  ]);
  const byTheta = new Map(design.curve.map((point) => [point.theta, point]));
  const thetas = [...new Set([...byTheta.keys(), ...designPoints.keys()])].sort((a, b) => a - b);
  const x = new Float64Array(thetas.length);
  const wald: (number | null)[] = [];
  const exact: (number | null)[] = [];
  const marked: (number | null)[] = [];
  thetas.forEach((theta, i) => {
    const point = byTheta.get(theta);
    x[i] = theta * scale.factor;
    wald.push(point ? 100 * point.ocWald : null);
    exact.push(point ? 100 * point.ocExact : null);
    marked.push(designPoints.get(theta) ?? null);
  });
  return [x, wald, exact, marked];
}

/** ASN curves in items, with the single sampling plan's n as a flat reference. */
export function asnColumns(design: LinearCountDesign | null, scale: QualityScale): uPlot.AlignedData {
  if (!design) return none;
  const x = Float64Array.from(design.curve, (point) => point.theta * scale.factor);
  const wald = Float64Array.from(design.curve, (point) => point.asnWald);
  const exact = Float64Array.from(design.curve, (point) => point.asnExact);
  const single = design.single;
  const reference = design.curve.map(() => (single ? single.n : null));
  return [x, wald, exact, reference];
}

/**
 * Curves over a quality axis with design points merged in: x ascending, each curve null where only
 * a design point sits, the marks null elsewhere.
 */
export function curvesWithMarks(thetas: readonly number[], curves: readonly (readonly (number | null)[])[], marks: readonly [number, number][]): uPlot.AlignedData {
  const marked = new Map(marks);
  const index = new Map(thetas.map((theta, i) => [theta, i]));
  const xs = [...new Set([...thetas, ...marked.keys()])].sort((a, b) => a - b);
  const columns = curves.map((curve) => xs.map((theta) => (index.has(theta) ? curve[index.get(theta)!] : null)));
  return [Float64Array.from(xs), ...columns, xs.map((theta) => marked.get(theta) ?? null)];
}

/** Acceptance and rejection numbers per item count, and Wald's straight lines they round. */
export function boundaryColumns(design: LinearCountDesign | null): uPlot.AlignedData {
  if (!design || design.limits.length === 0) return none;
  const { slope, h1, h2 } = design.boundaries;
  const rows = design.limits;
  const x = Float64Array.from(rows, (row) => row.n);
  const acceptance = rows.map((row) => row.accept);
  const rejection = rows.map((row) => row.reject);
  const acceptanceLine = rows.map((row) => (slope * row.n - h1 >= 0 ? slope * row.n - h1 : null));
  const rejectionLine = Float64Array.from(rows, (row) => slope * row.n + h2);
  return [x, acceptance, rejection, acceptanceLine, rejectionLine];
}

/**
 * Share of runs (percent) decided by each item count, at H0 and at H1: the engine's distribution
 * of the stopping item, summed up as it goes, shown up to where almost every run has stopped.
 * (The distribution itself is spiky for pass/fail plans, since acceptance is possible only at
 * some item counts; its running sum reads as "half the runs stop by item 24".)
 */
export function stopColumns(design: LinearCountDesign | null): uPlot.AlignedData {
  if (!design) return none;
  const { h0, h1 } = design.sampleSizeDistribution;
  const reach = Math.max(design.exact.quantilesH0.p99 ?? h0.length, design.exact.quantilesH1.p99 ?? h1.length);
  const length = Math.min(Math.max(h0.length, h1.length), Math.ceil(reach * 1.15) + 2);
  const x = new Float64Array(length);
  const atH0 = new Float64Array(length);
  const atH1 = new Float64Array(length);
  let decidedH0 = 0;
  let decidedH1 = 0;
  for (let n = 0; n < length; n++) {
    decidedH0 += h0[n] ?? 0;
    decidedH1 += h1[n] ?? 0;
    x[n] = n;
    atH0[n] = Math.min(100, 100 * decidedH0);
    atH1[n] = Math.min(100, 100 * decidedH1);
  }
  return [x, atH0, atH1];
}

/** A short fingerprint of a chart's data, so a test can see that a chart was redrawn with new values. */
export function columnsDigest(data: uPlot.AlignedData): string {
  let sum = 0;
  let count = 0;
  for (const column of data) {
    const values = column as ArrayLike<number | null | undefined>;
    for (let i = 0; i < values.length; i++) {
      const value = values[i];
      if (typeof value === 'number' && Number.isFinite(value)) {
        sum += value * (1 + (count % 7));
        count += 1;
      }
    }
  }
  return `${count}:${sum.toPrecision(10)}`;
}
