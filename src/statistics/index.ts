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
export { monteCarloStatistics, type MonteCarloStatistics, type YieldEstimate, type WorstSample, type RunFacts } from './summary.js';
export { selectConfirm, VALIDATION_SHARE, type ConfirmPick } from './confirm.js';
export { agreement, AGREEMENT_METRICS, type MetricAgreement } from './agreement.js';
export { usageOf, operatingPoint, bySample, sampleMeets, type CheckLike, type CheckSideLike, type SampleCornerLike } from './corners.js';
