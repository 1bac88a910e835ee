/** Plain-text numbers and tables for terminals (the CLI and each model's readable text). Pure. */

/** Left-aligns the first column (labels) and right-aligns the others (numbers), two spaces apart. */
export function formatTable(headers: readonly string[], rows: ReadonlyArray<readonly string[]>): string {
  const widths = headers.map((header, column) =>
    Math.max(header.length, ...rows.map((row) => (row[column] ?? '').length)),
  );
  const line = (cells: readonly string[]): string =>
    cells.map((cell, column) => (column === 0 ? cell.padEnd(widths[column]) : cell.padStart(widths[column]))).join('  ').trimEnd();
  return [line(headers), ...rows.map(line)].join('\n');
}

export { formatNumber } from './numberText.js';

export { formatPercent } from './numberText.js';

/** A decimal number as a user types it (sign, digits, point, exponent): what every number flag and input line accepts. */
export const NUMBER_TEXT = /^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/;
