import type { CornerResult, ResultsSummary } from './types.js';

/** Counts by status, simulation totals and the worst divergences (largest |error| / tolerance first). */
export function summarize(corners: CornerResult[], worstCount = 10): ResultsSummary {
  const count = (s: CornerResult['status']) => corners.filter((c) => c.status === s).length;
  const worst = corners
    .flatMap((c) => c.divergences.map((d) => ({ id: c.id, metric: d.metric, error: d.error, tolerance: d.tolerance })))
    .sort((a, b) => severity(b) - severity(a) || a.id.localeCompare(b.id) || a.metric.localeCompare(b.metric))
    .slice(0, worstCount);
  return {
    corners: corners.length,
    ok: count('ok'),
    diverged: count('diverged'),
    failed: count('failed'),
    notSettled: count('not-settled'),
    predicted: count('predicted'),
    unreachable: count('unreachable'),
    outsideLimits: count('outside-limits'),
    // only in Monte Carlo runs, so other results files keep their bytes
    ...(count('screened') ? { screened: count('screened') } : {}),
    flips: corners.reduce((s, c) => s + (c.checks ?? []).filter((x) => x.flip).length, 0),
    simulations: corners.reduce((s, c) => s + (c.sim ? c.sim.simulations : 0), 0),
    worst,
  };
}

/** Status disagreements rank above any numeric divergence. */
function severity(d: { error: number | null; tolerance: number | null }): number {
  if (d.error === null || d.tolerance === null || d.tolerance === 0) return Number.MAX_VALUE;
  return Math.abs(d.error) / d.tolerance;
}
