/**
 * Proportions written for people: always in percent with the sign, to as many digits as the size
 * needs, so a tiny share is never shown as "0 %" and a share just below one never as "100 %".
 * Machines get fractions (JSON, CSV, the CLI's --json); only the screen and the record use this,
 * and both write it with the record's one formatter.
 */
import { formatNumber, formatPercent } from '../../../src-main/engine/numberText.js';

export function percentText(fraction: number | null | undefined): string {
  if (fraction === null || fraction === undefined || !Number.isFinite(fraction)) return '–';
  return formatPercent(fraction);
}

const isFraction = (unit: string) => unit === 'fraction nonconforming';

/** A quality figure in its unit: a fraction nonconforming in percent, a rate per unit as it is. */
export function estimateText(value: number, unit: string): string {
  return isFraction(unit) ? `${percentText(value)} nonconforming` : `${formatNumber(value)} ${unit}`;
}

/** An interval of quality in its unit: "0 % to 9.5 %" or "0 to 0.25 nonconformities per item". */
export function intervalText(lower: number, upper: number, unit: string): string {
  return isFraction(unit) ? `${percentText(lower)} to ${percentText(upper)}` : `${formatNumber(lower)} to ${formatNumber(upper)} ${unit}`;
}
