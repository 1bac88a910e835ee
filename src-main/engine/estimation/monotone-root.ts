/**
 * Solves f(x) = target for an increasing function f on [low, high] by bisection, assuming
 * f(low) <= target <= f(high); returns the midpoint of the last bracket.
 *
 * Method: bisection until the bracket is shorter than relativeTolerance * high + absoluteTolerance.
 * Bisection rather than a secant method because the stagewise tail probabilities are only piecewise
 * smooth near the ends of the quality range and bisection cannot step outside the bracket.
 * References: Press, W. H. et al. (2007), Numerical Recipes, 3rd ed., §9.1 (bracketing and bisection).
 */
export function solveIncreasing(
  f: (x: number) => number,
  target: number,
  low: number,
  high: number,
  relativeTolerance = 1e-10,
  absoluteTolerance = 1e-14,
): number {
  let lo = low;
  let hi = high;
  for (let i = 0; i < 200 && hi - lo > relativeTolerance * hi + absoluteTolerance; i++) {
    const mid = 0.5 * (lo + hi);
    if (f(mid) < target) lo = mid;
    else hi = mid;
  }
  return 0.5 * (lo + hi);
}

/**
 * The upper end of a bracket for an increasing f on [0, infinity): doubles `start` until f >= target.
 * Returns Infinity when f never reaches the target below `limit`.
 *
 * Method: geometric expansion of the bracket.
 * References: Press, W. H. et al. (2007), Numerical Recipes, 3rd ed., §9.1.
 */
export function bracketAbove(f: (x: number) => number, target: number, start: number, limit = 1e6): number {
  let x = start;
  while (x <= limit) {
    if (f(x) >= target) return x;
    x *= 2;
  }
  return Number.POSITIVE_INFINITY;
}
