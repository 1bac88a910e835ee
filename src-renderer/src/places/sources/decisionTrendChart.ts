/**
 * The decisions of a source over time as running counts: every decided run (solid) and the rejected
 * ones among them (dashed, shaded); the gap between the two lines is the accepted runs. Two lines
 * of accepted and rejected counts would lie on top of each other whenever the counts are equal.
 */
import uPlot from 'uplot';
import type { DecisionTrend } from '../../../../src-main/history/sourceSummary';
import { readout, titledAxis } from '../../charts/axes';

const DAY_SECONDS = 86_400;

export function decisionTrendOptions(): Omit<uPlot.Options, 'width' | 'height'> {
  return {
    scales: {
      // A day of margin each side, so the first and last decisions are not drawn on the frame.
      x: { time: true, range: (_self, min, max) => [min - DAY_SECONDS, max + DAY_SECONDS] },
      y: { range: (_self, _min, max) => [0, Math.max(2, Math.ceil(max * 1.1))] },
    },
    axes: [
      titledAxis('Run started (date)'),
      titledAxis('Runs so far (count)', { values: (_self, ticks) => ticks.map((tick) => (Number.isInteger(tick) ? String(tick) : '')) }),
    ],
    series: [
      { label: 'Started', value: '{YYYY}-{MM}-{DD}' },
      { label: 'Decided', stroke: 'var(--chart-point)', width: 2, paths: steps, points: { show: true, size: 6 }, value: readout(0) },
      {
        label: 'Rejected',
        stroke: 'var(--chart-at-rejectable)',
        fill: 'var(--chart-rejected-fill)',
        width: 2,
        dash: [6, 4],
        paths: steps,
        points: { show: true, size: 6 },
        value: readout(0),
      },
    ],
    legend: { show: true },
    cursor: { drag: { x: false, y: false } },
  };
}

const steps = uPlot.paths.stepped!({ align: 1 });

export function decisionTrendData(trend: DecisionTrend): uPlot.AlignedData {
  const decided = trend.acceptedSoFar.map((accepted, index) => accepted + trend.rejectedSoFar[index]);
  return [Float64Array.from(trend.time), Float64Array.from(decided), Float64Array.from(trend.rejectedSoFar)];
}
