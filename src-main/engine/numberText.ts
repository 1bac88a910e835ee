/**
 * Numbers as a document prints them: significant digits without float noise, fixed decimals, and
 * whole counts with thin grouping; percent for people; plain-text tables; the decimal number a user
 * types. Used by the record lines and terminal text of every model, the record and the CLI.
 */

/**
 * A number with `significant` significant digits, without exponent noise for ordinary sizes (an
 * exponent below 1e-4 and from 1e7 on); '-' for a missing value. The one number format of the
 * terminal text and the record.
 */
export function formatNumber(value: number | null | undefined, significant = 4): string {
  if (value === null || value === undefined) return '-';
  if (!Number.isFinite(value)) return String(value);
  if (value === 0) return '0';
  const magnitude = Math.abs(value);
  if (magnitude >= 1e-4 && magnitude < 1e7) return String(Number(value.toPrecision(significant)));
  return value.toExponential(significant - 1);
}

/** A number with a fixed count of decimals, e.g. an LLR or a boundary intercept. */
export function formatFixed(value: number, decimals = 3): string {
  return value.toFixed(decimals);
}

/** A whole count with thin grouping for readability: 12 345. */
export function formatCount(value: number): string {
  return value.toLocaleString('en-GB').replaceAll(',', ' ');
}

/** A value with its unit, when it has one: "10.02 mm", "3". */
export function withUnit(value: number, unit: string): string {
  return `${formatNumber(value)}${unit ? ` ${unit}` : ''}`;
}

/** A confidence level as printed: 0.9 → "90 %". */
export function percentText(level: number): string {
  return `${Number((level * 100).toPrecision(3))} %`;
}

/**
 * A proportion for people: percent with the sign, as many digits as its size needs (a tiny share is
 * never "0 %", a share just below one never "100 %"). The renderer writes them the same way.
 */
export function formatPercent(fraction: number): string {
  const value = fraction * 100;
  if (value === 0) return '0 %';
  const size = Math.abs(value);
  if (size < 1) return `${Number(value.toPrecision(2))} %`;
  if (size > 99 && size < 100) return `${(Math.floor(value * 100) / 100).toFixed(2)} %`;
  return `${Number(value.toPrecision(3))} %`;
}

/** A quality level in its unit: a fraction nonconforming in percent ("1 % nonconforming"), other units as they are. */
export function formatQuality(value: number, unit: string): string {
  return unit === 'fraction nonconforming' ? `${formatPercent(value)} nonconforming` : `${formatNumber(value)} ${unit}`;
}

/** The bare figure of a quality level, without its unit word: "1 %" for a fraction, else the number. */
function qualityFigure(value: number, unit: string): string {
  return unit === 'fraction nonconforming' ? formatPercent(value) : formatNumber(value);
}

/** An interval of quality: "0.18 % to 5.25 %", or "0.1 to 0.9" for other units. */
export function formatQualityInterval(lower: number, upper: number, unit: string): string {
  return `${qualityFigure(lower, unit)} to ${Number.isFinite(upper) ? qualityFigure(upper, unit) : 'no upper limit'}`;
}

/** Left-aligns the first column (labels) and right-aligns the others (numbers), two spaces apart. */
export function formatTable(headers: readonly string[], rows: ReadonlyArray<readonly string[]>): string {
  const widths = headers.map((header, column) =>
    Math.max(header.length, ...rows.map((row) => (row[column] ?? '').length)),
  );
  const line = (cells: readonly string[]): string =>
    cells.map((cell, column) => (column === 0 ? cell.padEnd(widths[column]) : cell.padStart(widths[column]))).join('  ').trimEnd();
  return [line(headers), ...rows.map(line)].join('\n');
}

/** A decimal number as a user types it (sign, digits, point, exponent): what every number flag and input line accepts. */
export const NUMBER_TEXT = /^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/;
