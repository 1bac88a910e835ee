import { compositeGaussLegendre } from '../../numerics/gaussLegendre.js';
import { normalCdf, normalDensity } from '../../distributions/normal.js';

/** Exact operating characteristics of an SPRT whose LLR moves by normal steps. */
export interface NormalSprtPoint {
  /** P(accept). */
  accept: number;
  /** Expected number of further observations. */
  asn: number;
  /** Probability still undecided when the recursion stopped (0 for the integral-equation solution). */
  undecided: number;
}

export interface NormalSprtEvaluator {
  /** Number of quadrature nodes on (lower, upper). */
  readonly nodes: number;
  /**
   * OC and ASN from LLR `start` with `stepsLeft` observations to the truncation (null: none), for a
   * step law N(drift, scale^2).
   */
  evaluate(drift: number, start: number, stepsLeft: number | null): NormalSprtPoint;
}

const PER_PANEL = 8;
const UNDECIDED_STOP = 1e-13;

/**
 * Builds an evaluator for an SPRT that accepts when the LLR <= lower, rejects when it >= upper,
 * each step adding a normal increment with standard deviation `scale`; at a truncation it accepts
 * iff the LLR <= 0.
 *
 * Method: untruncated, the OC L and ASN N solve the Fredholm equations of the second kind
 * L(x) = Phi((lower - x - m)/s) + int_lower^upper L(y) phi((y - x - m)/s)/s dy and
 * N(x) = 1 + int N(y) phi(...)/s dy, discretised on composite Gauss-Legendre nodes (8 per panel of
 * width 1.5 s) and solved by LU with partial pivoting, then carried to the start by the Nystrom
 * interpolant. Truncated, the density of the undecided LLR is pushed forward step by step on the
 * same nodes; the last step accepts every path that ends at or below 0.
 * References: Wald, A. (1947), Sequential Analysis, §A.3 (the integral equations); Kress, R.
 * (2014), Linear Integral Equations, 3rd ed., §12.4 (Nystrom method).
 */
export function createNormalSprtEvaluator(lower: number, upper: number, scale: number): NormalSprtEvaluator {
  const panels = Math.max(4, Math.min(60, Math.ceil((upper - lower) / (1.5 * scale))));
  const { nodes, weights } = compositeGaussLegendre(lower, upper, panels, PER_PANEL);
  const m = nodes.length;
  const matrix = new Float64Array(m * m);
  const ocVector = new Float64Array(m);
  const asnVector = new Float64Array(m);
  const density = new Float64Array(m);
  const nextDensity = new Float64Array(m);

  const kernel = (from: number, to: number, drift: number): number => normalDensity((to - from - drift) / scale) / scale;

  function solveUntruncated(drift: number, start: number): NormalSprtPoint {
    // (I - K) v = rhs with K_ij = w_j k(x_i, x_j), factorised once for both right-hand sides.
    for (let i = 0; i < m; i++) {
      for (let j = 0; j < m; j++) matrix[i * m + j] = (i === j ? 1 : 0) - weights[j] * kernel(nodes[i], nodes[j], drift);
      ocVector[i] = normalCdf((lower - nodes[i] - drift) / scale);
      asnVector[i] = 1;
    }
    for (let column = 0; column < m; column++) {
      let pivot = column;
      for (let row = column + 1; row < m; row++) {
        if (Math.abs(matrix[row * m + column]) > Math.abs(matrix[pivot * m + column])) pivot = row;
      }
      if (pivot !== column) {
        for (let j = 0; j < m; j++) {
          const swap = matrix[column * m + j];
          matrix[column * m + j] = matrix[pivot * m + j];
          matrix[pivot * m + j] = swap;
        }
        let swap = ocVector[column];
        ocVector[column] = ocVector[pivot];
        ocVector[pivot] = swap;
        swap = asnVector[column];
        asnVector[column] = asnVector[pivot];
        asnVector[pivot] = swap;
      }
      const diagonal = matrix[column * m + column];
      for (let row = column + 1; row < m; row++) {
        const factor = matrix[row * m + column] / diagonal;
        if (factor === 0) continue;
        for (let j = column + 1; j < m; j++) matrix[row * m + j] -= factor * matrix[column * m + j];
        ocVector[row] -= factor * ocVector[column];
        asnVector[row] -= factor * asnVector[column];
      }
    }
    for (let row = m - 1; row >= 0; row--) {
      let oc = ocVector[row];
      let asn = asnVector[row];
      for (let j = row + 1; j < m; j++) {
        oc -= matrix[row * m + j] * ocVector[j];
        asn -= matrix[row * m + j] * asnVector[j];
      }
      ocVector[row] = oc / matrix[row * m + row];
      asnVector[row] = asn / matrix[row * m + row];
    }
    let accept = normalCdf((lower - start - drift) / scale);
    let asn = 1;
    for (let j = 0; j < m; j++) {
      const weight = weights[j] * kernel(start, nodes[j], drift);
      accept += weight * ocVector[j];
      asn += weight * asnVector[j];
    }
    return { accept, asn, undecided: 0 };
  }

  function pushForward(drift: number, start: number, stepsLeft: number): NormalSprtPoint {
    if (stepsLeft === 1) return { accept: normalCdf((0 - start - drift) / scale), asn: 1, undecided: 0 };
    // Transition weights w_j k(x_j, x_i) and the per-node accept probabilities, once per drift.
    for (let j = 0; j < m; j++) {
      for (let i = 0; i < m; i++) matrix[j * m + i] = weights[j] * kernel(nodes[j], nodes[i], drift);
      ocVector[j] = weights[j] * normalCdf((lower - nodes[j] - drift) / scale);
      asnVector[j] = weights[j] * normalCdf((0 - nodes[j] - drift) / scale);
    }
    // After the first step the undecided LLR has density k(start, y) on (lower, upper).
    let accept = normalCdf((lower - start - drift) / scale);
    let mass = 0;
    for (let i = 0; i < m; i++) {
      density[i] = kernel(start, nodes[i], drift);
      mass += weights[i] * density[i];
    }
    let asn = 1;
    for (let step = 2; step <= stepsLeft; step++) {
      asn += mass;
      const acceptWeights = step === stepsLeft ? asnVector : ocVector;
      for (let j = 0; j < m; j++) accept += density[j] * acceptWeights[j];
      if (step === stepsLeft) break;
      nextDensity.fill(0);
      for (let j = 0; j < m; j++) {
        const from = density[j];
        if (from === 0) continue;
        const row = j * m;
        for (let i = 0; i < m; i++) nextDensity[i] += from * matrix[row + i];
      }
      mass = 0;
      for (let i = 0; i < m; i++) {
        density[i] = nextDensity[i];
        mass += weights[i] * density[i];
      }
      if (mass < UNDECIDED_STOP) return { accept, asn, undecided: mass };
    }
    return { accept, asn, undecided: 0 };
  }

  return {
    nodes: m,
    evaluate(drift, start, stepsLeft) {
      if (stepsLeft !== null && stepsLeft < 1) throw new RangeError('stepsLeft must be at least 1');
      return stepsLeft === null ? solveUntruncated(drift, start) : pushForward(drift, start, stepsLeft);
    },
  };
}
