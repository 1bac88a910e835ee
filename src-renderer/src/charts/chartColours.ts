/**
 * uPlot draws on a canvas, which cannot read CSS variables. Chart options name colours as
 * `var(--chart-…)`; these are resolved against the page's current theme when a chart is built.
 */
import type uPlot from 'uplot';

const variableReference = /^var\((--[\w-]+)\)$/;

/** The colour a `var(--name)` reference stands for now; any other value passes through. */
export function resolveColour<T>(value: T, style: CSSStyleDeclaration): T {
  if (typeof value !== 'string') return value;
  const match = variableReference.exec(value);
  if (!match) return value;
  return (style.getPropertyValue(match[1]).trim() || 'currentColor') as T;
}

/** A copy of the options with every `var(--…)` colour resolved; functions and data untouched. */
export function resolveOptionColours(options: uPlot.Options, style: CSSStyleDeclaration): uPlot.Options {
  const colour = <T>(value: T) => resolveColour(value, style);
  return {
    ...options,
    series: options.series.map((series) => ({
      ...series,
      stroke: colour(series.stroke),
      fill: colour(series.fill),
      points: series.points && { ...series.points, stroke: colour(series.points.stroke), fill: colour(series.points.fill) },
    })),
    axes: options.axes?.map((axis) => ({
      ...axis,
      stroke: colour(axis.stroke),
      grid: axis.grid && { ...axis.grid, stroke: colour(axis.grid.stroke) },
      ticks: axis.ticks && { ...axis.ticks, stroke: colour(axis.ticks.stroke) },
    })),
  };
}
