/**
 * Seeded pseudo-random numbers for the simulator and the bootstrap, so every run with the
 * same seed gives the same numbers on the server, in the browser and in tests.
 *
 * Uniform numbers come from the `seedrandom` package (ARC4-based generator); Gaussian ones
 * from the Marsaglia polar method (Marsaglia & Bray, 1964), which needs no trigonometry and
 * yields two independent normals per accepted pair.
 */
import seedrandom from "seedrandom";

export interface RandomSource {
  /** Uniform in [0, 1). */
  uniform(): number;
  /** Uniform in [low, high). */
  between(low: number, high: number): number;
  /** Uniform integer in [0, n). */
  integer(n: number): number;
  /** Normal with the given mean and standard deviation (default 0, 1). */
  gaussian(mean?: number, sd?: number): number;
}

/** A reproducible random source; the same seed always gives the same sequence. */
export function createRandom(seed: number | string): RandomSource {
  const next = seedrandom(String(seed));
  let spare: number | null = null;
  const gaussian = (mean = 0, sd = 1): number => {
    if (spare !== null) {
      const value = spare;
      spare = null;
      return mean + sd * value;
    }
    let u = 0;
    let v = 0;
    let s = 0;
    do {
      u = 2 * next() - 1;
      v = 2 * next() - 1;
      s = u * u + v * v;
    } while (s >= 1 || s === 0);
    const factor = Math.sqrt((-2 * Math.log(s)) / s);
    spare = v * factor;
    return mean + sd * u * factor;
  };
  return {
    uniform: () => next(),
    between: (low, high) => low + (high - low) * next(),
    integer: (n) => Math.min(n - 1, Math.floor(next() * n)),
    gaussian,
  };
}
