import { fillBinomialCdf } from '../../distributions/binomial.js';
import type { PassFailSpec } from '../../spec.js';
import { checkOrdered, checkProbability, checkRisksAndTruncation } from '../../validate.js';
import type { LinearCountDefinition } from '../linearCountDefinition.js';

/**
 * Pass/fail items. One observation x is 1 for a nonconforming item, 0 for a conforming one.
 *
 * Method: z = x ln(p1/p0) + (1-x) ln((1-p1)/(1-p0)) = countWeight x - itemOffset with
 * countWeight = ln(p1(1-p0)/(p0(1-p1))) and itemOffset = ln((1-p0)/(1-p1)).
 * References: Wald, A. (1947), Sequential Analysis, Wiley, ch. 5 (binomial case);
 * NIST/SEMATECH e-Handbook of Statistical Methods (2012), §6.2.6.
 */
export const passFailDefinition: LinearCountDefinition<PassFailSpec> = {
  name: 'passfail',
  qualityName: 'p',
  qualityUpperLimit: 1,
  countStep: 'bernoulli',

  validate(spec) {
    checkProbability('p0', spec.p0);
    checkProbability('p1', spec.p1);
    checkOrdered('p0', spec.p0, 'p1', spec.p1);
    checkRisksAndTruncation(spec);
  },

  hypotheses: (spec) => ({ theta0: spec.p0, theta1: spec.p1 }),

  linearStatistic(spec) {
    const itemOffset = Math.log1p(-spec.p0) - Math.log1p(-spec.p1);
    return { countWeight: Math.log(spec.p1 / spec.p0) + itemOffset, itemOffset };
  },

  logLikelihoodRatio(spec, x) {
    return x === 1 ? Math.log(spec.p1 / spec.p0) : Math.log1p(-spec.p1) - Math.log1p(-spec.p0);
  },

  klDivergences({ p0, p1 }) {
    // D(P||Q) = p ln(p/q) + (1-p) ln((1-p)/(1-q)) for Bernoulli laws.
    return {
      h0h1: p0 * Math.log(p0 / p1) + (1 - p0) * (Math.log1p(-p0) - Math.log1p(-p1)),
      h1h0: p1 * Math.log(p1 / p0) + (1 - p1) * (Math.log1p(-p1) - Math.log1p(-p0)),
    };
  },

  logMomentGenerating(spec, theta, h) {
    const { countWeight, itemOffset } = this.linearStatistic(spec);
    // ln((1-theta) e^{-h b} + theta e^{h(a-b)}) = -h b + ln(1 + theta (e^{h a} - 1)), kept stable for large h a.
    const ha = h * countWeight;
    if (ha > 0) return -h * itemOffset + ha + Math.log(theta + (1 - theta) * Math.exp(-ha));
    return -h * itemOffset + Math.log1p(theta * Math.expm1(ha));
  },

  meanIncrement(spec, theta) {
    const { countWeight, itemOffset } = this.linearStatistic(spec);
    return theta * countWeight - itemOffset;
  },

  secondMomentIncrement(spec, theta) {
    const { countWeight, itemOffset } = this.linearStatistic(spec);
    const onFail = countWeight - itemOffset;
    return theta * onFail * onFail + (1 - theta) * itemOffset * itemOffset;
  },

  curveRange: (spec) => ({ from: 0, to: Math.min(0.999, 2 * spec.p1) }),

  fillCountCdf: (theta, n, out) => fillBinomialCdf(n, theta, out),

  parseObservation: (x) => (x === 0 || x === 1 ? x : null),
};
