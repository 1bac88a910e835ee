/** A small seeded random source, so simulated operating characteristics are reproducible. */

export interface SeededRandom {
  /** Uniform on (0, 1), never 0. */
  uniform(): number;
  /** Standard normal. */
  normal(): number;
  /** Exponential with mean 1. */
  exponential(): number;
}

/**
 * The engine's one seeded stream of 32-bit words (mulberry32), for the simulations, the demo data and
 * the tests that draw random numbers.
 *
 * Method: state step t += 0x6D2B79F5, then two multiply-xorshift rounds of the state.
 * References: Ettinger, T. (2017), mulberry32, public-domain C source (from memory); common practice,
 * no source.
 */
export function seededWords(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return (t ^ (t >>> 14)) >>> 0;
  };
}

/**
 * Uniform on [0, 1) with 32 random bits per draw: one word / 2^32. Enough for invented demo results
 * and for drawing test sequences; the simulations use seededRandom (53 bits per draw).
 *
 * Method: seededWords, scaled.
 * References: as seededWords.
 */
export function seededUniform32(seed: number): () => number {
  const word = seededWords(seed);
  return () => word() / 4294967296;
}

/**
 * A seeded generator: seededWords, two words per uniform (53 bits), normal deviates by the polar
 * method, exponential by inversion.
 *
 * Method: the polar method accepts (u, v) in the unit disc and returns u sqrt(-2 ln s / s).
 * References: Marsaglia, G. and Bray, T. A. (1964), "A convenient method for generating normal
 * variables", SIAM Review 6(3) (from memory); Devroye, L. (1986), Non-Uniform Random Variate
 * Generation, §II.2 (inversion; from memory).
 */
export function seededRandom(seed: number): SeededRandom {
  const word = seededWords(seed);
  let spareNormal = Number.NaN;
  const uniform = (): number => ((word() >>> 5) * 67108864 + (word() >>> 6) + 0.5) / 9007199254740992;
  return {
    uniform,
    normal() {
      if (!Number.isNaN(spareNormal)) {
        const value = spareNormal;
        spareNormal = Number.NaN;
        return value;
      }
      for (;;) {
        const u = 2 * uniform() - 1;
        const v = 2 * uniform() - 1;
        const s = u * u + v * v;
        if (s >= 1 || s === 0) continue;
        const factor = Math.sqrt((-2 * Math.log(s)) / s);
        spareNormal = v * factor;
        return u * factor;
      }
    },
    exponential: () => -Math.log(uniform()),
  };
}
