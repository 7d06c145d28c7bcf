import { clopperPearson, type Proportion } from './interval.js';
import { bySample, operatingPoint, sampleMeets, usageOf, type CheckLike, type SampleCornerLike, type Side } from './corners.js';
import { rankSensitivity, type SensitivityEntry } from './sensitivity.js';
import { agreement, type MetricAgreement } from './agreement.js';
import { SAMPLED_PARAMETERS } from './sample.js';

/** A yield: the share of samples meeting every limit at every operating point, with its 95 % interval. */
export interface YieldEstimate extends Proportion {
  /** Samples that met every limit. */
  meets: number;
  /** Samples counted as not meeting because a value was missing (no solution, or the model does not apply). */
  unknown: number;
}

/** The worst sample of one limit: the corner using most of the bound. */
export interface WorstSample {
  limit: string;
  sample: number;
  id: string;
  /** value / bound (upper limit) or bound / value (lower limit); above 1 is outside. null for a state (ZVS, region) that is not met. */
  usage: number | null;
  /** The model the usage comes from: the ideal model, or FHA where the ideal model gives no value. */
  source: 'ideal' | 'fha';
}

/** results.json `statistics` of a Monte Carlo run. */
export interface MonteCarloStatistics {
  samples: number;
  seed: number;
  distribution: 'uniform' | 'normal';
  /** Yields from screening, each with a Clopper-Pearson 95 % interval. */
  yield: { fha: YieldEstimate; ideal: YieldEstimate; interval: 'clopper-pearson-95' };
  confirmed: {
    /** Corners the simulation ran. */
    count: number;
    /** Distinct samples among them. */
    samples: number;
    /** Confirmed samples with a check outside in simulation. */
    outside: number;
    /** The ideal model against the simulation over the confirmed corners. */
    agreement: MetricAgreement[];
  };
  /** Per limit: Spearman rank correlation of each tolerance with the sample's worst usage, strongest first. */
  sensitivity: { limit: string; source: 'ideal' | 'fha'; ranking: SensitivityEntry[] }[];
  /** Per limit: the sample closest to (or furthest beyond) its bound; a state limit (ZVS, region) only where it is not met. */
  worst: WorstSample[];
  /** Operating points (corner ids without the sample part), in corner order. */
  operatingPoints: string[];
}

/** The run facts the statistics echo. */
export interface RunFacts {
  seed: number;
  distribution: 'uniform' | 'normal';
}

function estimate(verdicts: (boolean | null)[]): YieldEstimate {
  const meets = verdicts.filter((v) => v === true).length;
  const unknown = verdicts.filter((v) => v === null).length;
  return { ...clopperPearson(meets, Math.max(1, verdicts.length)), meets, unknown };
}

/** The ideal usage of a check, or FHA's where the ideal model gives none. */
function screenedUsage(c: CheckLike): { usage: number; source: 'ideal' | 'fha' } | null {
  for (const source of ['ideal', 'fha'] as const) {
    const u = usageOf(c, source);
    if (u !== null) return { usage: u, source };
  }
  return null;
}

/** Per limit and sample, the worst usage over the sample's operating points on one side (null when any is missing). */
function worstPerSample(samples: Map<number, SampleCornerLike[]>, limit: string, side: Side): (number | null)[] {
  return [...samples.values()].map((cs) => {
    let worst = -Infinity;
    for (const c of cs) {
      const ch = c.checks?.find((x) => x.limit === limit);
      if (!ch) continue;
      const u = usageOf(ch, side);
      if (u === null) return null;
      worst = Math.max(worst, u);
    }
    return worst === -Infinity ? null : worst;
  });
}

/**
 * The statistics of a Monte Carlo run, computed from its corner results alone (pure), so that the
 * results of several shards can be merged and the statistics computed again over the union.
 * Corners without a sample number (explicit corners) are left out.
 */
export function monteCarloStatistics(corners: readonly SampleCornerLike[], facts: RunFacts): MonteCarloStatistics {
  const samples = bySample(corners);
  const groups = [...samples.values()];
  const limits = [...new Set(corners.flatMap((c) => (c.checks ?? []).map((ch) => ch.limit)))];
  const deviations = Object.fromEntries(SAMPLED_PARAMETERS.map((p) => [p, groups.map((cs) => cs[0]!.inputs.deviation?.[p] ?? 0)]));

  const sensitivity = limits.flatMap((limit) => {
    const kind = corners.flatMap((c) => c.checks ?? []).find((ch) => ch.limit === limit)?.kind;
    if (kind === 'state') return [];
    const ideal = worstPerSample(samples, limit, 'ideal');
    const useIdeal = ideal.some((v) => v !== null);
    const ranking = rankSensitivity(deviations, useIdeal ? ideal : worstPerSample(samples, limit, 'fha'));
    return ranking.length ? [{ limit, source: useIdeal ? 'ideal' as const : 'fha' as const, ranking }] : [];
  });

  const worst = limits.flatMap((limit): WorstSample[] => {
    let best: (Omit<WorstSample, 'usage'> & { usage: number }) | null = null;
    for (const c of corners) {
      const ch = c.checks?.find((x) => x.limit === limit);
      const u = ch && c.inputs.sample !== undefined ? screenedUsage(ch) : null;
      if (u && (!best || u.usage > best.usage)) best = { limit, sample: c.inputs.sample!, id: c.id, ...u };
    }
    // a state met everywhere (usage 0) has no worst sample
    if (!best || best.usage === 0) return [];
    return [{ ...best, usage: Number.isFinite(best.usage) ? best.usage : null }];
  });

  const confirmed = corners.filter((c) => c.inputs.sample !== undefined && c.sim !== null);
  const outsideSamples = new Set(confirmed.filter((c) => (c.checks ?? []).some((ch) => ch.sim?.within === false)).map((c) => c.inputs.sample!));
  return {
    samples: groups.length,
    seed: facts.seed,
    distribution: facts.distribution,
    yield: { fha: estimate(groups.map((cs) => sampleMeets(cs, 'fha'))), ideal: estimate(groups.map((cs) => sampleMeets(cs, 'ideal'))), interval: 'clopper-pearson-95' },
    confirmed: {
      count: confirmed.length,
      samples: new Set(confirmed.map((c) => c.inputs.sample!)).size,
      outside: outsideSamples.size,
      agreement: agreement(confirmed),
    },
    sensitivity,
    worst,
    operatingPoints: [...new Set(corners.filter((c) => c.inputs.sample !== undefined).map(operatingPoint))],
  };
}
