/**
 * A journal time as the inspector's clock showed it: the UTC time shifted by the recorded offset,
 * written with that offset ("2025-03-14T08:02:11+01:00"; with `milliseconds`, "…08:02:11.042+01:00",
 * which keeps runs started within one second in order).
 */
export function localTimestamp(utcTime: string, offset: string, options: { milliseconds?: boolean } = {}): string {
  const sign = offset.startsWith('-') ? -1 : 1;
  const [hours, minutes] = offset.slice(1).split(':').map(Number);
  const shifted = new Date(Date.parse(utcTime) + sign * (hours * 60 + minutes) * 60_000);
  return `${shifted.toISOString().slice(0, options.milliseconds === true ? 23 : 19)}${offset}`;
}
