import { sampleRng, type Rng } from './prng.js';

/** How a toleranced value spreads over its band. */
export type Distribution = 'uniform' | 'normal';

/** The toleranced tank parameters, in the order of their random streams (never reorder: ids and samples depend on it). */
export const SAMPLED_PARAMETERS = ['lr', 'cr', 'lm', 'turnsRatio'] as const;
export type SampledParameter = (typeof SAMPLED_PARAMETERS)[number];

/** Relative tolerances (5 % = 0.05) of the sampled parameters; 0 keeps a parameter at nominal. */
export type Tolerances = Record<SampledParameter, number>;

/** One Monte Carlo sample: each parameter's relative deviation from nominal (value = nominal x (1 + d)). */
export interface Sample {
  /** Sample number, 0-based. */
  index: number;
  deviation: Record<SampledParameter, number>;
}

/** Sigmas per tolerance for the normal distribution: the tolerance is 3 sigma (common practice). */
export const SIGMAS_PER_TOLERANCE = 3;

/**
 * A standard normal deviate truncated to |z| <= limit, by the polar form of the Box-Muller
 * transform (G. E. P. Box and M. E. Muller, "A note on the generation of random normal deviates",
 * Annals of Mathematical Statistics 29, 1958; polar form by G. Marsaglia and T. A. Bray, SIAM
 * Review 6, 1964) and plain rejection of deviates outside the limit, which leaves the
 * distribution inside it exactly normal (C. P. Robert, "Simulation of truncated normal
 * variables", Statistics and Computing 5, 1995, section 1). At limit 3 only 0.27 % are rejected.
 * Only the first deviate of each pair is used, so each draw costs a fixed pattern of words.
 */
export function truncatedNormal(rng: Rng, limit: number): number {
  for (;;) {
    const u = 2 * rng.next() - 1;
    const v = 2 * rng.next() - 1;
    const s = u * u + v * v;
    if (s === 0 || s >= 1) continue;
    const z = u * Math.sqrt((-2 * Math.log(s)) / s);
    if (Math.abs(z) <= limit) return z;
  }
}

/**
 * One relative deviation within +-tol: uniform on [-tol, tol), or normal with sigma = tol / 3
 * truncated at +-tol.
 */
export function drawDeviation(rng: Rng, tol: number, distribution: Distribution): number {
  if (tol === 0) return 0;
  if (distribution === 'uniform') return tol * (2 * rng.next() - 1);
  return (tol / SIGMAS_PER_TOLERANCE) * truncatedNormal(rng, SIGMAS_PER_TOLERANCE);
}

/**
 * Sample `index` of a Monte Carlo run: a function of (seed, index) only (see prng.ts), so any
 * subset of samples can be drawn in any order and gives the same values.
 */
export function drawSample(seed: number, index: number, tol: Tolerances, distribution: Distribution): Sample {
  const deviation = {} as Record<SampledParameter, number>;
  SAMPLED_PARAMETERS.forEach((name, stream) => {
    deviation[name] = tol[name] > 0 ? drawDeviation(sampleRng(seed, index, stream), tol[name], distribution) : 0;
  });
  return { index, deviation };
}

/** Samples 0 .. count-1. */
export function drawSamples(seed: number, count: number, tol: Tolerances, distribution: Distribution): Sample[] {
  return Array.from({ length: count }, (_, k) => drawSample(seed, k, tol, distribution));
}
