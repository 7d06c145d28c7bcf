/**
 * Statistics for the Monte Carlo tolerance analysis (pure: the seed goes in, nothing is read
 * from the machine): a seeded generator, tolerance sampling, binomial confidence intervals, a
 * goodness-of-fit statistic and a rank-correlation sensitivity measure.
 */
export { sampleRng, xoshiro128ss, xoshiro128ssFromState, splitMix64, MAX_SEED, type Rng } from './prng.js';
export {
  drawSample, drawSamples, drawDeviation, truncatedNormal, SAMPLED_PARAMETERS, SIGMAS_PER_TOLERANCE,
  type Distribution, type Sample, type SampledParameter, type Tolerances,
} from './sample.js';
export { clopperPearson, wilsonInterval, binomialCdf, Z95, type Proportion } from './interval.js';
export { ksStatistic, ksCritical05 } from './ks.js';
export { ranks, pearson, spearman } from './rank.js';
export { rankSensitivity, type SensitivityEntry } from './sensitivity.js';
