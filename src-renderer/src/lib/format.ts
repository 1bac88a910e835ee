/** Fixed digits for figures; a dash for what does not exist. */
export function figure(value: number | null | undefined, digits = 3): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '–';
  return value.toFixed(digits);
}
