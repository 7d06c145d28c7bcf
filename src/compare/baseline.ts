import type { BaselineReport, Results } from '../results/types.js';
import { COMPARED } from './compare.js';
import { plain } from '../units/display.js';

/** Default relative change of a simulated metric that counts as a regression against a baseline. */
export const BASELINE_TOLERANCE = 0.01;

/**
 * Compare a run with an earlier results.json: corners added or removed, status changes, and
 * simulated metrics that moved by more than `tolerance` (relative to the baseline value).
 * Limit checks that went from within to outside are listed in `checksOutside` (simulated
 * verdicts; FHA's where a side was not simulated).
 * `regressed` is true for any removed corner, status change, moved metric or check now outside.
 */
export function compareBaseline(current: Results, baseline: Results, file: string, tolerance = BASELINE_TOLERANCE): BaselineReport {
  const before = new Map(baseline.corners.map((c) => [c.id, c]));
  const now = new Map(current.corners.map((c) => [c.id, c]));
  const added = current.corners.filter((c) => !before.has(c.id)).map((c) => c.id);
  const removed = baseline.corners.filter((c) => !now.has(c.id)).map((c) => c.id);
  const statusChanges: BaselineReport['statusChanges'] = [];
  const moved: BaselineReport['moved'] = [];
  const checksOutside: NonNullable<BaselineReport['checksOutside']> = [];
  for (const c of current.corners) {
    const b = before.get(c.id);
    if (!b) continue;
    if (b.status !== c.status) statusChanges.push({ id: c.id, from: b.status, to: c.status });
    for (const k of c.checks ?? []) {
      const before = b.checks?.find((x) => x.limit === k.limit);
      const was = before?.sim?.within ?? before?.fha.within;
      const now = k.sim?.within ?? (k.sim ? null : k.fha.within);
      if (was === true && now === false) checksOutside.push({ id: c.id, limit: k.limit, before: before!.sim?.value ?? before!.fha.value, after: (k.sim ?? k.fha).value, bound: k.bound });
    }
    if (!b.sim || !c.sim) continue;
    for (const { metric } of COMPARED) {
      const x0 = b.sim[metric];
      const x1 = c.sim[metric];
      if (typeof x0 !== 'number' || typeof x1 !== 'number') continue;
      const change = x0 === 0 ? (x1 === 0 ? 0 : Infinity) : (x1 - x0) / Math.abs(x0);
      if (Math.abs(change) > tolerance) moved.push({ id: c.id, metric, before: x0, after: x1, change, tolerance });
    }
    for (const metric of ['zvs', 'zcs', 'region', 'mode'] as const) {
      if (b.sim[metric] !== c.sim[metric]) statusChanges.push({ id: `${c.id}:${metric}`, from: String(b.sim[metric]) as never, to: String(c.sim[metric]) as never });
    }
  }
  return { file, added, removed, statusChanges, moved, checksOutside,
    regressed: removed.length > 0 || statusChanges.length > 0 || moved.length > 0 || checksOutside.length > 0 };
}

export function renderBaseline(r: BaselineReport): string {
  const lines = [`Baseline ${r.file}: ${r.regressed ? 'REGRESSED' : 'no change beyond tolerance'}`];
  if (r.added.length) lines.push(`  added corners: ${r.added.join(', ')}`);
  if (r.removed.length) lines.push(`  removed corners: ${r.removed.join(', ')}`);
  for (const s of r.statusChanges) lines.push(`  ${s.id}: ${s.from} -> ${s.to}`);
  for (const k of r.checksOutside ?? []) lines.push(`  ${k.id} ${k.limit}: within -> outside (${fmtCheck(k.before)} -> ${fmtCheck(k.after)}, bound ${fmtCheck(k.bound)})`);
  for (const m of r.moved) lines.push(`  ${m.id} ${m.metric}: ${m.before.toPrecision(5)} -> ${m.after.toPrecision(5)} (${(m.change * 100).toFixed(2)} %, tolerance ${(m.tolerance * 100).toFixed(2)} %)`);
  return `${lines.join('\n')}\n`;
}

const fmtCheck = (v: unknown): string => plain(v, 5);
