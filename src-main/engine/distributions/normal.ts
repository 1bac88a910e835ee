/** The standard normal density and distribution function, to double precision. */

const INVERSE_SQRT_TWO_PI = 0.3989422804014327;

/**
 * Standard normal density phi(x).
 *
 * Method: exp(-x^2/2)/sqrt(2 pi).
 * References: Abramowitz, M. and Stegun, I. A. (1964), Handbook of Mathematical Functions, 26.2.1.
 */
export function normalDensity(x: number): number {
  return INVERSE_SQRT_TWO_PI * Math.exp(-0.5 * x * x);
}

/**
 * Standard normal distribution function Phi(x), absolute error about 1e-15.
 *
 * Method: Hart's rational approximation (algorithm 5666) for |x| < 7.07 and a continued fraction
 * beyond, applied to the lower tail and reflected.
 * References: West, G. (2005), "Better approximations to cumulative normal functions", Wilmott
 * Magazine, fig. 2 (after Hart, J. F. et al. (1968), Computer Approximations).
 */
export function normalCdf(x: number): number {
  const z = Math.abs(x);
  let tail = 0;
  if (z < 37) {
    const e = Math.exp(-0.5 * z * z);
    if (z < 7.07106781186547) {
      let n = 3.52624965998911e-2 * z + 0.700383064443688;
      n = n * z + 6.37396220353165;
      n = n * z + 33.912866078383;
      n = n * z + 112.079291497871;
      n = n * z + 221.213596169931;
      n = n * z + 220.206867912376;
      let d = 8.83883476483184e-2 * z + 1.75566716318264;
      d = d * z + 16.064177579207;
      d = d * z + 86.7807322029461;
      d = d * z + 296.564248779674;
      d = d * z + 637.333633378831;
      d = d * z + 793.826512519948;
      d = d * z + 440.413735824752;
      tail = (e * n) / d;
    } else {
      let b = z + 0.65;
      b = z + 4 / b;
      b = z + 3 / b;
      b = z + 2 / b;
      b = z + 1 / b;
      tail = e / b / 2.506628274631;
    }
  }
  return x > 0 ? 1 - tail : tail;
}

/**
 * Standard normal quantile Phi^{-1}(p) for p in (0, 1).
 *
 * Method: the rational start of Abramowitz and Stegun 26.2.23 (error < 4.5e-4), then Newton steps
 * on Phi until the step is below 1e-15.
 * References: Abramowitz, M. and Stegun, I. A. (1964), Handbook of Mathematical Functions, 26.2.23.
 */
export function normalQuantile(p: number): number {
  const tail = Math.min(p, 1 - p);
  const t = Math.sqrt(-2 * Math.log(tail));
  let x = t - (2.515517 + 0.802853 * t + 0.010328 * t * t) / (1 + 1.432788 * t + 0.189269 * t * t + 0.001308 * t * t * t);
  if (p < 0.5) x = -x;
  for (let i = 0; i < 50; i++) {
    const step = (normalCdf(x) - p) / normalDensity(x);
    x -= step;
    if (Math.abs(step) < 1e-15 * Math.max(1, Math.abs(x))) break;
  }
  return x;
}
