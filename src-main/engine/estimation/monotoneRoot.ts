/**
 * Solves f(x) = target for an increasing function f on [low, high], given f(low) < target <= f(high).
 *
 * Method: the Illinois variant of regula falsi: the secant through the bracket ends, halving the
 * function value kept at an end that has stayed twice in a row, so the bracket shrinks from both
 * sides (superlinear, about 10 evaluations where bisection needs 45); a bisection step whenever the
 * secant point falls outside the bracket. Stops when the bracket is shorter than
 * relativeTolerance * high + absoluteTolerance. Each evaluation is a full stopping recursion, hence
 * the care to need few.
 * References: Dowell, M. and Jarratt, P. (1971), "A modified regula falsi method for computing the
 * root of an equation", BIT 11:168-174; Press, W. H. et al. (2007), Numerical Recipes, 3rd ed., §9.2.
 */
export function solveIncreasing(
  f: (x: number) => number,
  target: number,
  low: number,
  high: number,
  relativeTolerance = 1e-10,
  absoluteTolerance = 1e-14,
): number {
  let a = low;
  let b = high;
  let fa = f(a) - target;
  let fb = f(b) - target;
  if (fa >= 0) return a;
  if (fb < 0) return b;
  let kept = 0; // -1 when a moved last, +1 when b moved last
  for (let i = 0; i < 200 && b - a > relativeTolerance * Math.abs(b) + absoluteTolerance; i++) {
    let x = (a * fb - b * fa) / (fb - fa);
    if (!(x > a && x < b)) x = 0.5 * (a + b);
    const fx = f(x) - target;
    if (fx === 0) return x;
    if (fx < 0) {
      a = x;
      fa = fx;
      if (kept === -1) fb *= 0.5;
      kept = -1;
    } else {
      b = x;
      fb = fx;
      if (kept === 1) fa *= 0.5;
      kept = 1;
    }
  }
  return 0.5 * (a + b);
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
