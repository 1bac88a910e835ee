import { fillPoissonCdf } from '../../distributions/poisson.js';
import type { CountSpec } from '../../spec.js';
import { checkOrdered, checkPositive, checkRisksAndTruncation } from '../../validate.js';
import type { LinearCountDefinition } from '../linearCountDefinition.js';

/**
 * Nonconformities counted per unit, Poisson with rate lambda per unit. One observation x is the
 * count on one unit.
 *
 * Method: z = x ln(lambda1/lambda0) - (lambda1 - lambda0), so countWeight = ln(lambda1/lambda0)
 * and itemOffset = lambda1 - lambda0.
 * References: Wald, A. (1947), Sequential Analysis, Wiley, ch. 5 (Poisson case);
 * Poisson SPRT lines and exact recursion (computed independently; no published example).
 */
export const countDefinition: LinearCountDefinition<CountSpec> = {
  name: 'count',
  qualityName: 'lambda',
  qualityUpperLimit: Number.POSITIVE_INFINITY,
  countStep: 'poisson',

  validate(spec) {
    checkPositive('lambda0', spec.lambda0);
    checkPositive('lambda1', spec.lambda1);
    checkOrdered('lambda0', spec.lambda0, 'lambda1', spec.lambda1);
    checkRisksAndTruncation(spec);
  },

  hypotheses: (spec) => ({ theta0: spec.lambda0, theta1: spec.lambda1 }),

  linearStatistic: (spec) => ({
    countWeight: Math.log(spec.lambda1 / spec.lambda0),
    itemOffset: spec.lambda1 - spec.lambda0,
  }),

  logLikelihoodRatio: (spec, x) => x * Math.log(spec.lambda1 / spec.lambda0) - (spec.lambda1 - spec.lambda0),

  klDivergences({ lambda0, lambda1 }) {
    // D(Poisson(a) || Poisson(b)) = a ln(a/b) + b - a.
    return {
      h0h1: lambda0 * Math.log(lambda0 / lambda1) + lambda1 - lambda0,
      h1h0: lambda1 * Math.log(lambda1 / lambda0) + lambda0 - lambda1,
    };
  },

  logMomentGenerating(spec, theta, h) {
    // E[e^{h(a x - b)}] = exp(theta (e^{h a} - 1) - h b) for x ~ Poisson(theta).
    const { countWeight, itemOffset } = this.linearStatistic(spec);
    return theta * Math.expm1(h * countWeight) - h * itemOffset;
  },

  meanIncrement(spec, theta) {
    const { countWeight, itemOffset } = this.linearStatistic(spec);
    return theta * countWeight - itemOffset;
  },

  secondMomentIncrement(spec, theta) {
    const { countWeight, itemOffset } = this.linearStatistic(spec);
    const mean = theta * countWeight - itemOffset;
    return theta * countWeight * countWeight + mean * mean;
  },

  curveRange: (spec) => ({ from: 0, to: 2 * spec.lambda1 }),

  fillCountCdf: (theta, n, out) => fillPoissonCdf(n * theta, out),

  parseObservation: (x) => (Number.isInteger(x) && x >= 0 ? x : null),
};
