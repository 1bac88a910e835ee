/**
 * Numbers as engineers type them: a decimal comma is accepted, blanks are not numbers.
 * Gives the number, or null when the text is not one.
 */
export function parseDecimal(text: string): number | null {
  const trimmed = text.trim().replace(',', '.');
  if (trimmed === '' || !/^[-+]?(\d+\.?\d*|\.\d+)(e[-+]?\d+)?$/i.test(trimmed)) return null;
  const value = Number(trimmed);
  return Number.isFinite(value) ? value : null;
}

/** A number written back into an input: no trailing zeros, no binary noise (0.1 * 3). */
export function decimalText(value: number): string {
  return String(Number(value.toPrecision(12)));
}
