/** Axis and value helpers shared by every chart: titles with units, quiet grid, figures with fixed digits. */
import type uPlot from 'uplot';

/** An axis with its title (units in the title) in the theme's colours. */
export function titledAxis(title: string, extra: Partial<uPlot.Axis> = {}): uPlot.Axis {
  return {
    label: title,
    labelSize: 20,
    labelFont: '12px system-ui, sans-serif',
    font: '11px system-ui, sans-serif',
    stroke: 'var(--chart-axis)',
    grid: { stroke: 'var(--chart-grid)', width: 1 },
    ticks: { stroke: 'var(--chart-grid)', width: 1, size: 4 },
    ...extra,
  };
}

/** A hover read-out of a number with fixed digits, or a dash where the series has no value. */
export function readout(digits: number, scale = 1, unit = ''): (self: uPlot, value: number | null) => string {
  return (_self, value) => (value === null || value === undefined || !Number.isFinite(value) ? '–' : `${(value * scale).toFixed(digits)}${unit}`);
}
