/** Gauss-Legendre quadrature rules, for the integral equations of the continuous models. */

export interface QuadratureRule {
  nodes: Float64Array;
  weights: Float64Array;
}

/**
 * The n-point Gauss-Legendre rule on [-1, 1].
 *
 * Method: Newton's iteration on P_n from the Chebyshev-like start cos(pi (i - 1/4)/(n + 1/2)), with
 * P_n and P_n' from the three-term recurrence; weight 2/((1 - x^2) P_n'(x)^2).
 * References: Golub, G. H. and Welsch, J. H. (1969), "Calculation of Gauss quadrature rules",
 * Math. Comp. 23, §1; Press, W. H. et al. (2007), Numerical Recipes, 3rd ed., §4.6.1.
 */
export function gaussLegendre(n: number): QuadratureRule {
  const nodes = new Float64Array(n);
  const weights = new Float64Array(n);
  for (let i = 0; i < Math.ceil(n / 2); i++) {
    let x = Math.cos((Math.PI * (i + 0.75)) / (n + 0.5));
    let derivative = 0;
    for (let iteration = 0; iteration < 100; iteration++) {
      let current = 1;
      let previous = 0;
      for (let j = 1; j <= n; j++) {
        const older = previous;
        previous = current;
        current = ((2 * j - 1) * x * previous - (j - 1) * older) / j;
      }
      derivative = (n * (x * current - previous)) / (x * x - 1);
      const step = current / derivative;
      x -= step;
      if (Math.abs(step) < 1e-16) break;
    }
    nodes[i] = -x;
    nodes[n - 1 - i] = x;
    weights[i] = weights[n - 1 - i] = 2 / ((1 - x * x) * derivative * derivative);
  }
  return { nodes, weights };
}

/**
 * A composite Gauss-Legendre rule on [from, to]: `panels` equal panels of `perPanel` points each.
 *
 * Method: the rule of `gaussLegendre(perPanel)` mapped affinely onto each panel.
 * References: Davis, P. J. and Rabinowitz, P. (1984), Methods of Numerical Integration, §2.7.
 */
export function compositeGaussLegendre(from: number, to: number, panels: number, perPanel: number): QuadratureRule {
  const base = gaussLegendre(perPanel);
  const nodes = new Float64Array(panels * perPanel);
  const weights = new Float64Array(panels * perPanel);
  const width = (to - from) / panels;
  for (let panel = 0; panel < panels; panel++) {
    const middle = from + (panel + 0.5) * width;
    for (let j = 0; j < perPanel; j++) {
      nodes[panel * perPanel + j] = middle + 0.5 * width * base.nodes[j];
      weights[panel * perPanel + j] = 0.5 * width * base.weights[j];
    }
  }
  return { nodes, weights };
}
