/**
 * The figures of the measurement, time-to-failure and graded plans: OC over the model's quality,
 * the average amount of evidence (items, or test time), and the lines in the model's own units.
 * Options depend only on the model and its unit, so a new design only pushes data into the charts.
 */
import type uPlot from 'uplot';
import type { GradedDesign, LifetimeDesign, MeasurementDesign } from '../../../../src-main/engine/index';
import { readout } from '../../charts/axes';
import type { ExtendedDesign } from './designKinds';
import { curvesWithMarks, type PlanChart } from './planChartData';
import { base, designPointSeries, exact, steps, wald, type ChartOptions } from './planChartOptions';

const corrected = { stroke: 'var(--chart-exact)', width: 1.5, dash: [2, 3], points: { show: false } };
const simulated = { stroke: 'var(--chart-exact)', width: 2, points: { show: true, size: 4 } };
const reference = { stroke: 'var(--chart-reference)', width: 1.5, dash: [2, 4], points: { show: false } };
const acceptLine = { stroke: 'var(--chart-at-acceptable)', width: 2, points: { show: false } };
const rejectLine = { stroke: 'var(--chart-at-rejectable)', width: 2, dash: [7, 4], points: { show: false } };
const percentRange = { scales: { y: { range: [0, 100] as uPlot.Range.MinMax } } };
const fromZero = { scales: { y: { range: (_u: uPlot, _min: number, max: number): uPlot.Range.MinMax => [0, Math.max(1, max * 1.08)] } } };

/** What the charts of one model are labelled with: the x axes and the evidence unit. */
export interface ExtendedChartKey {
  model: ExtendedDesign['model'];
  /** Measurement unit; for graded plans "Exact" or "Simulated", the figures beyond Wald's. */
  unit: string;
}

const percentOf = (value: number | null) => (value === null ? null : 100 * value);

function measurementOptions(unit: string): ChartOptions[] {
  const x = { label: 'Mean', value: readout(3) };
  const xTitle = `True mean of the measurements (${unit})`;
  return [
    base(x, xTitle, 'Accepted (%)', [
      { label: 'Wald', ...wald, spanGaps: true, value: readout(2, 1, ' %') },
      { label: 'Corrected', ...corrected, spanGaps: true, value: readout(2, 1, ' %') },
      { label: 'Exact', ...exact, spanGaps: true, value: readout(2, 1, ' %') },
      designPointSeries,
    ], percentRange),
    base(x, xTitle, 'Measurements (average)', [
      { label: 'Wald', ...wald, value: readout(1) },
      { label: 'Corrected', ...corrected, value: readout(1) },
      { label: 'Exact', ...exact, value: readout(1) },
      { label: 'Fixed sample n', ...reference, value: readout(0) },
    ], fromZero),
    base({ label: 'n', value: readout(0) }, 'Measurements taken', `Sum − n × midpoint (${unit})`, [
      { label: 'Accept at or beyond', ...acceptLine, value: readout(4) },
      { label: 'Reject at or beyond', ...rejectLine, value: readout(4) },
    ]),
  ];
}

function measurementColumns(design: MeasurementDesign): uPlot.AlignedData[] {
  const curve = design.curve;
  const thetas = curve.map((point) => point.theta);
  const { theta0, theta1 } = design.hypotheses;
  const marks: [number, number][] = [[theta0, 100 * (1 - design.risks.alpha)], [theta1, 100 * design.risks.beta]];
  const rows = design.limits;
  return [
    curvesWithMarks(thetas, [curve.map((p) => 100 * p.ocWald), curve.map((p) => 100 * p.ocCorrected), curve.map((p) => 100 * p.ocExact)], marks),
    [Float64Array.from(thetas), curve.map((p) => p.asnWald), curve.map((p) => p.asnCorrected), curve.map((p) => p.asnExact), curve.map(() => design.single.n)],
    // Both lines rise with n × (μ0 + μ1)/2; drawn from that midline they stay apart at any scale.
    [Float64Array.from(rows, (row) => row.n), rows.map((row) => row.accept - row.n * design.boundaries.slope), rows.map((row) => row.reject - row.n * design.boundaries.slope)],
  ];
}

function lifetimeOptions(): ChartOptions[] {
  const x = { label: 'MTBF', value: readout(0, 1, ' h') };
  const xTitle = 'True MTBF (hours)';
  return [
    base(x, xTitle, 'Accepted (%)', [
      { label: 'Wald', ...wald, spanGaps: true, value: readout(2, 1, ' %') },
      { label: 'Exact', ...exact, spanGaps: true, value: readout(2, 1, ' %') },
      designPointSeries,
    ], percentRange),
    base(x, xTitle, 'Test time (hours, average)', [
      { label: 'Wald', ...wald, value: readout(0) },
      { label: 'Exact', ...exact, value: readout(0) },
      { label: 'Fixed-duration test', ...reference, value: readout(0) },
    ], fromZero),
    base({ label: 'Failures', value: readout(0) }, 'Failures so far', 'Test time (hours)', [
      { label: 'Accept once the time reaches', ...acceptLine, paths: steps, value: readout(1) },
      { label: 'Reject if a failure comes by', ...rejectLine, paths: steps, value: readout(1) },
    ], fromZero),
  ];
}

function lifetimeColumns(design: LifetimeDesign): uPlot.AlignedData[] {
  const curve = design.curve;
  const thetas = curve.map((point) => point.theta);
  const { theta0, theta1 } = design.hypotheses;
  const marks: [number, number][] = [[theta0, 100 * (1 - design.risks.alpha)], [theta1, 100 * design.risks.beta]];
  const rows = design.limits;
  return [
    curvesWithMarks(thetas, [curve.map((p) => 100 * p.ocWald), curve.map((p) => 100 * p.ocExact)], marks),
    [Float64Array.from(thetas), curve.map((p) => p.expectedTimeWald), curve.map((p) => p.expectedTimeExact), curve.map(() => design.single.time)],
    [Float64Array.from(rows, (row) => row.failures), rows.map((row) => row.acceptTime), rows.map((row) => row.rejectTime)],
  ];
}

function gradedOptions(beyondWald: string): ChartOptions[] {
  const x = { label: 't', value: readout(2) };
  const xTitle = 'Shares: acceptable (0) to rejectable (1)';
  return [
    base(x, xTitle, 'Accepted (%)', [
      { label: 'Wald', ...wald, spanGaps: true, value: readout(2, 1, ' %') },
      { label: beyondWald, ...(beyondWald === 'Exact' ? exact : simulated), spanGaps: true, value: readout(2, 1, ' %') },
      designPointSeries,
    ], percentRange),
    base(x, xTitle, 'Items (average)', [
      { label: 'Wald', ...wald, value: readout(1) },
      { label: beyondWald, ...(beyondWald === 'Exact' ? exact : simulated), value: readout(1) },
    ], fromZero),
    base({ label: 'n', value: readout(0) }, 'Items graded', 'Demerits so far', [
      { label: 'Accept at most', ...acceptLine, value: readout(2) },
      { label: 'Reject at least', ...rejectLine, value: readout(2) },
    ], fromZero),
  ];
}

function gradedColumns(design: GradedDesign): uPlot.AlignedData[] {
  const curve = design.curve;
  const thetas = curve.map((point) => point.theta);
  const marks: [number, number][] = [[0, 100 * (1 - design.risks.alpha)], [1, 100 * design.risks.beta]];
  const beyondWald = (p: GradedDesign['curve'][number]) => p.ocExact ?? p.simulated?.accept ?? null;
  const asnBeyondWald = (p: GradedDesign['curve'][number]) => p.asnExact ?? p.simulated?.asn ?? null;
  const rows = design.limits;
  return [
    curvesWithMarks(thetas, [curve.map((p) => 100 * p.ocWald), curve.map((p) => percentOf(beyondWald(p)))], marks),
    [Float64Array.from(thetas), curve.map((p) => p.asnWald), curve.map(asnBeyondWald)],
    [Float64Array.from(rows, (row) => row.n), rows.map((row) => row.accept), rows.map((row) => row.reject)],
  ];
}

/** The options of a model's three charts; a new object only when the model or unit changes. */
export function extendedOptions(key: ExtendedChartKey): ChartOptions[] {
  return key.model === 'measurement' ? measurementOptions(key.unit) : key.model === 'lifetime' ? lifetimeOptions() : gradedOptions(key.unit);
}

const titles: Record<ExtendedDesign['model'], [string, string, string]> = {
  measurement: ['OC curve: chance of acceptance', 'ASN curve: measurements on average', 'Limits for the sum, from the midline n × (μ0 + μ1)/2'],
  lifetime: ['OC curve: chance of acceptance', 'Expected test time', 'Accept and reject times per failure count'],
  graded: ['OC curve: chance of acceptance', 'ASN curve: items on average', 'Demerit limits'],
};

const summaries: Record<ExtendedDesign['model'], [string, string, string]> = {
  measurement: [
    'Probability of accepting against the true mean: Wald, with the overshoot correction, and exact, with the two design points.',
    'Average number of measurements against the true mean, with the fixed sample size.',
    'The sum of the measurements at which the run accepts or rejects, less n times the midpoint of μ0 and μ1, against the number of measurements.',
  ],
  lifetime: [
    'Probability of accepting against the true MTBF, Wald and exact, with the two design points.',
    'Average accumulated test time to a decision against the true MTBF, with the fixed-duration test.',
    'For each failure count: the test time that accepts, and the time up to which that failure rejects.',
  ],
  graded: [
    'Probability of accepting along the shares from acceptable to rejectable, Wald and exact (or simulated).',
    'Average number of items along the shares from acceptable to rejectable.',
    'Total demerits at which the run accepts or rejects, against the items graded.',
  ],
};

/** The three charts of a design, with the options built for its key. */
export function extendedCharts(design: ExtendedDesign, options: ChartOptions[]): PlanChart[] {
  const columns =
    design.model === 'measurement' ? measurementColumns(design) : design.model === 'lifetime' ? lifetimeColumns(design) : gradedColumns(design);
  const ids = ['oc', 'asn', 'limits'];
  return ids.map((id, i) => ({
    id,
    title: titles[design.model][i],
    options: options[i],
    data: columns[i],
    summary: summaries[design.model][i],
    wide: id === 'limits',
  }));
}
