/**
 * The engine's root finders, in one place: bisection on a monotone yes/no question, the Illinois
 * regula falsi on a sign change, and bracket expansion by doubling.
 */

/** Bisection steps are capped here; 200 halvings take any double bracket to adjacent numbers. */
const MOST_STEPS = 200;

/**
 * The boundary of a monotone yes/no question on [no, yes]: `holds` is false at `no`, true at `yes`
 * and changes once between them (no may lie above yes). Returns the last `yes` end of the bracket.
 * Stops when the bracket is no longer than relativeTolerance * |yes| + absoluteTolerance, after
 * `maxSteps` halvings, or when the midpoint equals an end (the bracket holds adjacent doubles).
 *
 * Method: bisection: keep the half whose ends still disagree.
 * References: Press, W. H. et al. (2007), Numerical Recipes, 3rd ed., §9.1 (first-hand).
 */
export function bisectBoundary(
  holds: (x: number) => boolean,
  no: number,
  yes: number,
  options: { relativeTolerance?: number; absoluteTolerance?: number; maxSteps?: number } = {},
): number {
  const relativeTolerance = options.relativeTolerance ?? 0;
  const absoluteTolerance = options.absoluteTolerance ?? 0;
  const maxSteps = options.maxSteps ?? MOST_STEPS;
  let outside = no;
  let inside = yes;
  for (let i = 0; i < maxSteps && Math.abs(inside - outside) > relativeTolerance * Math.abs(inside) + absoluteTolerance; i++) {
    const middle = 0.5 * (outside + inside);
    if (middle === outside || middle === inside) break;
    if (holds(middle)) inside = middle;
    else outside = middle;
  }
  return inside;
}

/**
 * A root of f between `inside` (f <= 0) and `outside` (f > 0), the two in either order, given their
 * values there. Stops when the bracket is no longer than relativeTolerance * (the larger magnitude
 * of its ends) + absoluteTolerance, when f is exactly 0 (returning that point) or after 200 steps;
 * returns the midpoint of the last bracket.
 *
 * Method: the Illinois variant of regula falsi: the secant through the bracket ends, halving the
 * function value kept at an end that has stayed twice in a row, so the bracket shrinks from both
 * sides (superlinear, about 10 evaluations where bisection needs 45); a bisection step whenever the
 * secant point falls outside the bracket.
 * References: Dowell, M. and Jarratt, P. (1971), "A modified regula falsi method for computing the
 * root of an equation", BIT 11:168-174 (from memory); Press, W. H. et al. (2007), Numerical Recipes,
 * 3rd ed., §9.2 (first-hand).
 */
export function illinoisRoot(
  f: (x: number) => number,
  inside: number,
  insideValue: number,
  outside: number,
  outsideValue: number,
  relativeTolerance: number,
  absoluteTolerance = 0,
): number {
  let a = inside;
  let fa = insideValue;
  let b = outside;
  let fb = outsideValue;
  let kept = 0; // -1 when the inside end moved last, +1 when the outside end did
  for (let i = 0; i < MOST_STEPS; i++) {
    if (Math.abs(b - a) <= relativeTolerance * Math.max(Math.abs(a), Math.abs(b)) + absoluteTolerance) break;
    let x = (a * fb - b * fa) / (fb - fa);
    if (!(x > Math.min(a, b) && x < Math.max(a, b))) x = 0.5 * (a + b);
    const fx = f(x);
    if (fx === 0) return x;
    if (fx > 0) {
      b = x;
      fb = fx;
      if (kept === 1) fa *= 0.5;
      kept = 1;
    } else {
      a = x;
      fa = fx;
      if (kept === -1) fb *= 0.5;
      kept = -1;
    }
  }
  return 0.5 * (a + b);
}

/**
 * Solves f(x) = target for an increasing function f on [low, high], given f(low) < target <= f(high);
 * returns low when f(low) >= target already and high when f(high) < target.
 *
 * Method: illinoisRoot on f - target. Each evaluation in the estimation code is a full stopping
 * recursion, hence a method that needs few.
 * References: as illinoisRoot.
 */
export function solveIncreasing(
  f: (x: number) => number,
  target: number,
  low: number,
  high: number,
  relativeTolerance = 1e-10,
  absoluteTolerance = 1e-14,
): number {
  const atLow = f(low) - target;
  if (atLow >= 0) return low;
  const atHigh = f(high) - target;
  if (atHigh < 0) return high;
  return illinoisRoot((x) => f(x) - target, low, atLow, high, atHigh, relativeTolerance, absoluteTolerance);
}

/**
 * The first x = start * factor^k (k = 0, 1, ...) below `limit` at which `reached(x)` holds; Infinity
 * when none does.
 *
 * Method: geometric expansion of the bracket.
 * References: Press, W. H. et al. (2007), Numerical Recipes, 3rd ed., §9.1 (first-hand).
 */
export function expandUntil(reached: (x: number) => boolean, start: number, limit = 1e6, factor = 2): number {
  let x = start;
  while (x < limit) {
    if (reached(x)) return x;
    x *= factor;
  }
  return Number.POSITIVE_INFINITY;
}

/**
 * The upper end of a bracket for an increasing f on [0, infinity): doubles `start` until f >= target.
 * Returns Infinity when f never reaches the target below `limit`.
 *
 * Method and References: as expandUntil.
 */
export function bracketAbove(f: (x: number) => number, target: number, start: number, limit = 1e6): number {
  return expandUntil((x) => f(x) >= target, start, limit);
}
