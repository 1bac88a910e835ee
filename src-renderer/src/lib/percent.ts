/**
 * Proportions written for people: always in percent with the sign, to as many digits as the size
 * needs, so a tiny share is never shown as "0 %" and a share just below one never as "100 %".
 * Machines get fractions (JSON, CSV, the CLI's --json); only the screen and the record use this.
 */
export function percentText(fraction: number | null | undefined): string {
  if (fraction === null || fraction === undefined || !Number.isFinite(fraction)) return '–';
  const value = fraction * 100;
  if (value === 0) return '0 %';
  const size = Math.abs(value);
  if (size < 1) return `${Number(value.toPrecision(2))} %`;
  // Just short of 100 % (or just above 0 % from below) must not round onto the bound.
  if (size > 99 && size < 100) return `${(Math.floor(value * 100) / 100).toFixed(2)} %`;
  return `${Number(value.toPrecision(3))} %`;
}

/** A rate with up to four significant digits and no exponent for everyday sizes. */
function rateText(value: number): string {
  if (value === 0) return '0';
  return Math.abs(value) < 1e-4 ? value.toExponential(2) : String(Number(value.toPrecision(4)));
}

const isFraction = (unit: string) => unit === 'fraction nonconforming';

/** A quality figure in its unit: a fraction nonconforming in percent, a rate per unit as it is. */
export function estimateText(value: number, unit: string): string {
  return isFraction(unit) ? `${percentText(value)} nonconforming` : `${rateText(value)} ${unit}`;
}

/** An interval of quality in its unit: "0 % to 9.5 %" or "0 to 0.25 nonconformities per item". */
export function intervalText(lower: number, upper: number, unit: string): string {
  return isFraction(unit) ? `${percentText(lower)} to ${percentText(upper)}` : `${rateText(lower)} to ${rateText(upper)} ${unit}`;
}
