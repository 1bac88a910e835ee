/**
 * The stagewise ordering of the stopping points of a sequential plan, from the most extreme low
 * outcome (accept as early as possible) to the most extreme high one (reject as early as possible).
 */

/** Where a stopping point lies in the stagewise ordering: the accept side, the truncation stage, the reject side. */
export const StagewiseSide = {
  /** Accepted before truncation: lower than every later outcome. */
  accept: 0,
  /** Stopped at the truncation item count (by either line or by the truncation rule): ordered by count. */
  truncation: 1,
  /** Rejected before truncation: higher than every later outcome. */
  reject: 2,
} as const;

export type StagewiseSide = (typeof StagewiseSide)[keyof typeof StagewiseSide];

/**
 * Compares two stopping points (side, item count n, cumulative count d) in the stagewise ordering:
 * negative when the first is lower, 0 when equal, positive when higher. Plain numbers, so it can run
 * inside a recursion.
 *
 * Method: at the same n the larger count is higher (this also puts a reject above an accept at the
 * same n). Across item counts, a reject at n' is above every outcome at n > n', and an accept at
 * n' is below every outcome at n > n'; points stopped at the truncation count sit between the
 * two sides, ordered by count. As a key: (side, n ascending on the accept side, n descending on the
 * reject side, d).
 * References: Armitage, P. (1958), "Numerical studies in the sequential estimation of a binomial
 * parameter", Biometrika 45(1/2):1-15; Jennison, C. and Turnbull, B. W. (2000), Group Sequential
 * Methods with Applications to Clinical Trials, Chapman & Hall/CRC, §8.4 (stagewise ordering).
 */
export function compareStagewise(
  sideA: StagewiseSide,
  itemCountA: number,
  totalA: number,
  sideB: StagewiseSide,
  itemCountB: number,
  totalB: number,
): number {
  if (sideA !== sideB) return sideA - sideB;
  if (itemCountA !== itemCountB) {
    // Earlier accepts are lower, earlier rejects are higher.
    if (sideA === StagewiseSide.accept) return itemCountA - itemCountB;
    if (sideA === StagewiseSide.reject) return itemCountB - itemCountA;
  }
  return totalA - totalB;
}
