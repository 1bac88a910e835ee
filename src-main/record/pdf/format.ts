import type { RecordModel } from '../input/decisionRecordInput.js';

/** "conforming" / "nonconforming" for passfail; "3 nonconformities" for the count model. */
export function resultLabel(model: RecordModel, nonconformities: number): string {
  if (model === 'passfail') return nonconformities === 0 ? 'conforming' : 'nonconforming';
  return nonconformities === 1 ? '1 nonconformity' : `${nonconformities} nonconformities`;
}

const TIMESTAMP_PARTS = /^(\d{4}-\d{2}-\d{2})T(\d{2}:\d{2}(?::\d{2})?)(?:\.\d+)?(Z|[+-]\d{2}:\d{2})$/;

/**
 * An ISO 8601 timestamp as printed: "2025-03-14 08:02:11 +01:00". The wall-clock time and offset are
 * kept as recorded (no conversion), fractions of a second dropped; "Z" prints as "UTC".
 */
export function formatTimestamp(iso: string): string {
  const match = TIMESTAMP_PARTS.exec(iso);
  if (!match) throw new RangeError(`formatTimestamp: ${JSON.stringify(iso)} is not an ISO 8601 date-time with offset`);
  const [, date, time, offset] = match;
  return `${date} ${time} ${offset === 'Z' ? 'UTC' : offset}`;
}

/** A number with `significant` significant digits, without exponent unless it is tiny or huge. */
export function formatNumber(value: number, significant = 4): string {
  if (value === 0) return '0';
  const magnitude = Math.abs(value);
  if (magnitude < 1e-4 || magnitude >= 1e9) return value.toExponential(significant - 1);
  return String(Number(value.toPrecision(significant)));
}

/** A number with a fixed count of decimals, e.g. an LLR or a boundary intercept. */
export function formatFixed(value: number, decimals = 3): string {
  return value.toFixed(decimals);
}

/** A whole count with thin grouping for readability: 12 345. */
export function formatCount(value: number): string {
  return value.toLocaleString('en-GB').replaceAll(',', ' ');
}
