/** ln(e^a + e^b) without overflow. */
export function logSumExp(a: number, b: number): number {
  if (a === Number.NEGATIVE_INFINITY) return b;
  const high = Math.max(a, b);
  return high + Math.log(Math.exp(a - high) + Math.exp(b - high));
}
