/**
 * Deterministic split of a study's work items into N shards, balanced by estimated cost.
 *
 * Longest-processing-time-first list scheduling (Graham, "Bounds on multiprocessing timing
 * anomalies", SIAM J. Appl. Math. 17(2), 1969): items by decreasing cost (ties by plan order) go
 * one by one to the shard with the least cost so far (ties: the lowest shard). Its makespan is at
 * most 4/3 - 1/(3N) of the optimum, and no shard exceeds the lightest by more than one item's cost.
 * It reads only the costs and their order, so every machine, --jobs setting and cache state gives
 * the same split.
 */

/** A shard: 1-based index K of N. */
export interface ShardSpec {
  index: number;
  count: number;
}

/** Which shard (0-based) each item goes to, for items with the given estimated costs (>= 0). */
export function assignShards(costs: readonly number[], count: number): number[] {
  if (!Number.isInteger(count) || count < 1) throw new RangeError(`shard count must be a whole number >= 1, got ${count}`);
  const order = costs.map((c, i) => ({ c: Number.isFinite(c) && c > 0 ? c : 0, i })).sort((a, b) => b.c - a.c || a.i - b.i);
  const load = new Array<number>(count).fill(0);
  const out = new Array<number>(costs.length);
  for (const { c, i } of order) {
    let best = 0;
    for (let k = 1; k < count; k++) if (load[k]! < load[best]!) best = k;
    out[i] = best;
    load[best]! += c;
  }
  return out;
}

/** Indices (in plan order) of the items in shard `spec` (1-based index). */
export function shardItems(costs: readonly number[], spec: ShardSpec): number[] {
  const where = assignShards(costs, spec.count);
  return where.flatMap((k, i) => (k === spec.index - 1 ? [i] : []));
}

/**
 * Read a shard argument: `K/N` with 1 <= K <= N. With `indexFromEnv` (the value of the variable
 * named by --shard-index-env, 0-based as a Kubernetes Indexed Job's JOB_COMPLETION_INDEX), the
 * argument is the count N alone (or `K/N`, whose K must then agree). Returns a message on bad input.
 */
export function parseShard(arg: string | undefined, indexFromEnv?: { name: string; value: string | undefined }): ShardSpec | string {
  const whole = (s: string) => (/^\d{1,6}$/.test(s) ? Number(s) : NaN);
  let index = NaN;
  let count = NaN;
  if (arg !== undefined) {
    const m = /^\s*(\d+)\s*\/\s*(\d+)\s*$/.exec(arg);
    if (m) {
      index = whole(m[1]!);
      count = whole(m[2]!);
    } else if (indexFromEnv) count = whole(arg.trim());
    else return `--shard expects K/N (for example 2/4), got "${arg}"`;
  }
  if (indexFromEnv) {
    const v = indexFromEnv.value;
    if (v === undefined || v.trim() === '') return `--shard-index-env: the variable ${indexFromEnv.name} is not set`;
    const zeroBased = whole(v.trim());
    if (Number.isNaN(zeroBased)) return `--shard-index-env: ${indexFromEnv.name}="${v}" is not a whole number (a 0-based index is expected)`;
    if (!Number.isNaN(index) && index !== zeroBased + 1) return `--shard ${arg} disagrees with ${indexFromEnv.name}=${v} (0-based, so shard ${zeroBased + 1})`;
    index = zeroBased + 1;
    if (Number.isNaN(count)) return '--shard-index-env needs the shard count: --shard N (or --shard K/N)';
  }
  if (!(count >= 1)) return `the shard count must be at least 1, got ${arg}`;
  if (!(index >= 1 && index <= count)) return `shard ${Number.isNaN(index) ? '?' : index} is outside 1..${count}`;
  return { index, count };
}
