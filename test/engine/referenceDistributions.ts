// Binomial and Poisson CDFs from jstat 1.9.6, an outside general-purpose stats library, used as
// the independent reference for single plans. jstat ships no types; the shapes used are declared here.
import jStat from 'jstat';

const library = jStat as unknown as {
  binomial: { cdf(k: number, n: number, p: number): number };
  poisson: { cdf(k: number, rate: number): number };
};

/** P(X <= k) for X ~ binomial(n, p), from jstat (rounded by jstat to 1e-10). */
export const binomialCdf = (k: number, n: number, p: number): number => library.binomial.cdf(k, n, p);

/** P(X <= k) for X ~ Poisson(rate), from jstat. */
export const poissonCdf = (k: number, rate: number): number => library.poisson.cdf(k, rate);
