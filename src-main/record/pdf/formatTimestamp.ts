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
