/**
 * The four figures of the Plan place as uPlot options. Wald's approximations are dashed, the exact
 * figures solid, design points are ringed markers, references dotted: colour is never the only cue.
 */
import uPlot from 'uplot';
import { readout, titledAxis } from '../../charts/axes';
import type { QualityScale } from './qualityScale';

export type ChartOptions = Omit<uPlot.Options, 'width' | 'height'>;

export const wald = { stroke: 'var(--chart-wald)', width: 2, dash: [7, 5], points: { show: false } };
export const exact = { stroke: 'var(--chart-exact)', width: 2, points: { show: false } };
export const steps = uPlot.paths.stepped!({ align: 1 });
const noLine = () => null;

/** The two design points, ringed markers without a line. */
export const designPointSeries: uPlot.Series = {
  label: 'Design points',
  stroke: 'var(--chart-point)',
  paths: noLine,
  points: { show: true, size: 10, width: 2, stroke: 'var(--chart-point)', fill: 'var(--panel)' },
  value: readout(1, 1, ' %'),
};

function qualityAxis(scale: QualityScale): uPlot.Series {
  const digits = scale.factor === 1 ? 3 : 2;
  return { label: scale.short === '%' ? 'Quality, %' : `Quality, ${scale.short}`, value: readout(digits) };
}

export const base = (x: uPlot.Series, xTitle: string, yTitle: string, series: uPlot.Series[], extra: Partial<ChartOptions> = {}): ChartOptions => ({
  series: [x, ...series],
  axes: [titledAxis(xTitle), titledAxis(yTitle, { size: 52 })],
  legend: { live: true },
  cursor: { drag: { x: false, y: false }, points: { size: 7 } },
  ...extra,
  scales: { x: { time: false }, ...extra.scales },
});

export function ocOptions(scale: QualityScale): ChartOptions {
  return base(
    qualityAxis(scale),
    scale.axisTitle,
    'Accepted (%)',
    [
      { label: 'Wald', ...wald, spanGaps: true, value: readout(2, 1, ' %') },
      { label: 'Exact', ...exact, spanGaps: true, value: readout(2, 1, ' %') },
      designPointSeries,
    ],
    { scales: { y: { range: [0, 100] } } },
  );
}

export function asnOptions(scale: QualityScale): ChartOptions {
  return base(qualityAxis(scale), scale.axisTitle, 'Items (average)', [
    { label: 'Wald', ...wald, value: readout(1) },
    { label: 'Exact', ...exact, value: readout(1) },
    { label: 'Single sampling n', stroke: 'var(--chart-reference)', width: 1.5, dash: [2, 4], points: { show: false }, value: readout(0) },
  ], { scales: { y: { range: (_u, _min, max) => [0, Math.max(1, max * 1.08)] } } });
}

export function boundaryOptions(counted: string): ChartOptions {
  return base(
    { label: 'Items', value: readout(0) },
    'Items inspected',
    `${counted.charAt(0).toUpperCase()}${counted.slice(1)} so far`,
    [
      { label: 'Acceptance number', stroke: 'var(--chart-at-acceptable)', width: 2, paths: steps, points: { show: false }, value: readout(0) },
      { label: 'Rejection number', stroke: 'var(--chart-at-rejectable)', width: 2, paths: steps, points: { show: false }, value: readout(0) },
      { label: 'Acceptance line', stroke: 'var(--chart-at-acceptable)', width: 1, dash: [7, 5], points: { show: false }, value: readout(2) },
      { label: 'Rejection line', stroke: 'var(--chart-at-rejectable)', width: 1, dash: [7, 5], points: { show: false }, value: readout(2) },
    ],
    { scales: { y: { range: (_u, _min, max) => [0, Math.max(2, Math.ceil(max))] } } },
  );
}

export function stopOptions(): ChartOptions {
  return base({ label: 'Item', value: readout(0) }, 'Items inspected', 'Runs decided (%)', [
    {
      label: 'At acceptable quality',
      stroke: 'var(--chart-at-acceptable)',
      width: 2,
      paths: steps,
      points: { show: false },
      value: readout(2, 1, ' %'),
    },
    {
      label: 'At rejectable quality',
      stroke: 'var(--chart-at-rejectable)',
      width: 2,
      dash: [5, 3],
      paths: steps,
      points: { show: false },
      value: readout(2, 1, ' %'),
    },
  ], { scales: { y: { range: [0, 100] } } });
}
