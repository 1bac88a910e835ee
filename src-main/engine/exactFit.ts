import { createExactEvaluator } from './exactEvaluator.js';
import type { ExactPoint } from './exactEvaluator.js';
import type { IntegerLines } from './integerLines.js';
import type { CountStep } from './models/linearCountDefinition.js';
import { bisectBoundary, expandUntil } from './numerics/rootFinding.js';

export interface ExactFit {
  h1: number;
  h2: number;
  /** Exact alpha and beta of the fitted integer plan. */
  alpha: number;
  beta: number;
  asnH0: number;
  asnH1: number;
  /** False when no intercepts meet both risks (possible only with a short truncation); Wald's lines are kept then. */
  feasible: boolean;
}

/**
 * Adjusts the intercepts h1 and h2 (slope kept) so the exact alpha and beta of the integer plan are
 * at or below nominal, making max(ASN(H0), ASN(H1)) small.
 *
 * Method: exact alpha falls as h2 rises and as h1 falls; exact beta the reverse; both ASNs fall as
 * either intercept falls. So alternate: h2 <- the smallest value with exact alpha <= alpha (bisection),
 * then h1 <- the smallest with exact beta <= beta, until neither moves. Each step lowers both
 * intercepts, so the ASNs never rise; the result is a local optimum of the coordinate search, not a
 * proven global one.
 * References: Wald, A. (1947), Sequential Analysis, §3 (monotonicity of the risks in the limits);
 * computed independently, Michlin & Grabarnik (risks of truncated discrete tests need a search).
 */
export function fitExactRisks(
  lines: IntegerLines,
  countStep: CountStep,
  hypotheses: { theta0: number; theta1: number },
  risks: { alpha: number; beta: number },
): ExactFit {
  const point: ExactPoint = { accept: 0, reject: 0, undecided: 0, asn: 0, steps: 0 };
  const exactAlpha = (h1: number, h2: number): number =>
    createExactEvaluator({ ...lines, h1, h2 }, countStep).evaluate(hypotheses.theta0, point).reject;
  const exactBeta = (h1: number, h2: number): number =>
    createExactEvaluator({ ...lines, h1, h2 }, countStep).evaluate(hypotheses.theta1, point).accept;

  // Past this an intercept changes nothing more (with truncation) or the risk is already ~0.
  const ceiling =
    lines.truncation === null
      ? 1e3 * Math.max(lines.h1, lines.h2)
      : lines.truncation * Math.max(1, lines.slope) + lines.h1 + lines.h2 + 2;

  /** Smallest x in (0, ceiling] with feasible(x), assuming feasibility is monotone in x; null if none. */
  function smallestFeasible(start: number, feasible: (x: number) => boolean): number | null {
    // Grows by 1.5 up to the ceiling, then tries the ceiling itself.
    let high = expandUntil(feasible, start, ceiling, 1.5);
    if (high === Number.POSITIVE_INFINITY) {
      if (!feasible(ceiling)) return null;
      high = ceiling;
    }
    // Plans change only where a line crosses a lattice point; 1e-7 relative resolves those.
    return bisectBoundary(feasible, 0, high, { relativeTolerance: 1e-7, maxSteps: 40 });
  }

  let h1 = lines.h1;
  let h2 = lines.h2;
  let feasible = true;
  for (let round = 0; round < 30; round++) {
    const nextH2 = smallestFeasible(h2, (x) => exactAlpha(h1, x) <= risks.alpha);
    const nextH1 = nextH2 === null ? null : smallestFeasible(h1, (x) => exactBeta(x, nextH2) <= risks.beta);
    if (nextH1 === null || nextH2 === null) {
      feasible = false;
      h1 = lines.h1;
      h2 = lines.h2;
      break;
    }
    const settled = Math.abs(nextH1 - h1) <= 1e-7 * h1 && Math.abs(nextH2 - h2) <= 1e-7 * h2;
    h1 = nextH1;
    h2 = nextH2;
    if (settled) break;
  }
  const fitted = createExactEvaluator({ ...lines, h1, h2 }, countStep);
  const atH0 = fitted.evaluate(hypotheses.theta0);
  const atH1 = fitted.evaluate(hypotheses.theta1);
  return { h1, h2, alpha: atH0.reject, beta: atH1.accept, asnH0: atH0.asn, asnH1: atH1.asn, feasible };
}
