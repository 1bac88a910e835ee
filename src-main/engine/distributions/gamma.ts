/**
 * out[k] = J_k = int_0^L x^k e^{-x} dx for k = 0..out.length-1: the lower incomplete gamma function
 * gamma(k + 1, L) = k! P(Gamma(k + 1, 1) <= L), unnormalised, as the lifetime recursion integrates it.
 *
 * Method: J_k = e^{-L} L^{k+1}/(k + 1) sum_{m >= 0} L^m/((k + 2)...(k + m + 1)), an all-positive
 * series (no cancellation), summed until a term is below 1e-17 of the sum (at most 200 terms); fast
 * for the short pieces (L <= 2) the recursion uses.
 * References: Abramowitz, M. and Stegun, I. A. (1964), Handbook of Mathematical Functions, 6.5.29
 * (from memory).
 */
export function fillIncompleteGammaIntegrals(length: number, out: Float64Array): void {
  const decay = Math.exp(-length);
  let power = length;
  for (let k = 0; k < out.length; k++) {
    let term = 1;
    let sum = 1;
    for (let m = 1; m < 200 && term > 1e-17 * sum; m++) {
      term *= length / (k + m + 1);
      sum += term;
    }
    out[k] = (decay * power * sum) / (k + 1);
    power *= length;
  }
}
