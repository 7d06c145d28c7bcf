import type { Results, WaveformExcerpt } from './types.js';

/** What a shard's results.json records about its place in the plan (`results.shard`). */
export interface ShardInfo {
  /** 1-based shard index K. */
  index: number;
  /** Shard count N. */
  count: number;
  /** Items in the whole plan. */
  total: number;
  /** Plan indices (0-based, ascending) of this part's corners, in the order of `corners`. */
  items: number[];
  /** Hash of the design content, engine and version, tool version and plan settings. */
  fingerprint: string;
}

/** One part to merge: its results and waveforms, and where it came from (for messages). */
export interface MergePart {
  source: string;
  results: Results;
  waveforms: WaveformExcerpt[];
}

export type MergeOutcome =
  | { ok: true; corners: Results['corners']; waveforms: WaveformExcerpt[]; incomplete: boolean; first: Results }
  | { ok: false, problems: string[] };

/**
 * Check that the parts are the complete, disjoint shards of one plan, and put their corners (and
 * waveform excerpts) back in plan order. Every problem is named: a part without shard information,
 * a fingerprint or shard count that differs from the first part's, a shard given twice or missing,
 * plan items covered twice or not at all. Pure: the caller reads the files and writes the result.
 */
export function mergeParts(parts: readonly MergePart[]): MergeOutcome {
  const problems: string[] = [];
  if (parts.length === 0) return { ok: false, problems: ['no parts to merge'] };
  const infos = parts.map((p) => p.results.shard as ShardInfo | undefined);
  parts.forEach((p, i) => {
    if (!infos[i]) problems.push(`${p.source}: not a shard (no "shard" in results.json); run it with --shard K/N`);
  });
  if (problems.length) return { ok: false, problems };
  const ref = infos[0]!;
  parts.forEach((p, i) => {
    const s = infos[i]!;
    if (s.fingerprint !== ref.fingerprint) {
      problems.push(`${p.source}: from another study (fingerprint ${s.fingerprint.slice(0, 12)} is not ${ref.fingerprint.slice(0, 12)} of ${parts[0]!.source}): a different design, engine, engine version, tool version or setting`);
    } else if (s.count !== ref.count || s.total !== ref.total) {
      problems.push(`${p.source}: shard ${s.index}/${s.count} of ${s.total} items does not match ${parts[0]!.source} (${ref.count} shards of ${ref.total} items)`);
    }
    if (s.items.length !== p.results.corners.length) problems.push(`${p.source}: lists ${s.items.length} plan items but holds ${p.results.corners.length} corners (a truncated or edited part)`);
  });
  if (problems.length) return { ok: false, problems };
  const seen = new Map<number, string>();
  parts.forEach((p, i) => {
    const k = infos[i]!.index;
    if (seen.has(k)) problems.push(`shard ${k}/${ref.count} is given twice: ${seen.get(k)} and ${p.source}`);
    else seen.set(k, p.source);
  });
  const missing = Array.from({ length: ref.count }, (_, k) => k + 1).filter((k) => !seen.has(k));
  if (missing.length) problems.push(`missing shard${missing.length > 1 ? 's' : ''} ${missing.map((k) => `${k}/${ref.count}`).join(', ')}`);
  if (problems.length) return { ok: false, problems };
  // Array.from, not new Array: flatMap below skips the holes of a sparse array
  const owner: (string | undefined)[] = Array.from({ length: ref.total }, () => undefined);
  const slots: { corner: Results['corners'][number]; item: number }[] = [];
  parts.forEach((p, i) => {
    infos[i]!.items.forEach((item, j) => {
      if (!(Number.isInteger(item) && item >= 0 && item < ref.total)) problems.push(`${p.source}: plan item ${item} is outside 0..${ref.total - 1}`);
      else if (owner[item]) problems.push(`plan item ${item} (${p.results.corners[j]!.id}) is in ${owner[item]} and ${p.source}`);
      else {
        owner[item] = p.source;
        slots.push({ corner: p.results.corners[j]!, item });
      }
    });
  });
  const uncovered = owner.flatMap((o, i) => (o ? [] : [i]));
  if (uncovered.length) problems.push(`plan items not covered by any part: ${uncovered.slice(0, 10).join(', ')}${uncovered.length > 10 ? ', ...' : ''}`);
  if (problems.length) return { ok: false, problems };
  slots.sort((a, b) => a.item - b.item);
  const corners = slots.map((s) => s.corner);
  const excerpts = new Map(parts.flatMap((p) => p.waveforms.map((w) => [w.id, w] as const)));
  const waveforms = corners.flatMap((c) => (excerpts.has(c.id) ? [excerpts.get(c.id)!] : []));
  return { ok: true, corners, waveforms, incomplete: parts.some((p) => p.results.incomplete === true), first: parts[0]!.results };
}
