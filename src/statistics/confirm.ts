import { sampleRng } from './prng.js';
import { usageOf, type SampleCornerLike } from './corners.js';

/** Why a corner was picked for simulation. */
export interface ConfirmPick {
  id: string;
  /** 'worst': among the worst screened margins of `limit`; 'validation': the seeded random set. */
  reason: 'worst' | 'validation';
  limit?: string;
}

/** Share of the confirm budget given to the random validation set (at least one corner when the budget is 2 or more). */
export const VALIDATION_SHARE = 0.25;

/** Random stream of the validation set: sample numbers are >= 0, so this index is never a sample's. */
const VALIDATION_STREAM = 0x7fffffff;

/** A corner's usage of one limit from screening: the ideal model's, or FHA's where it has none. */
function screened(c: SampleCornerLike, limit: string): number | null {
  const ch = c.checks?.find((x) => x.limit === limit);
  if (!ch) return null;
  const u = usageOf(ch, 'ideal') ?? usageOf(ch, 'fha');
  // a state that is met says nothing about closeness to its bound: only states not met rank
  return ch.kind === 'state' && u === 0 ? null : u;
}

/**
 * Which screened corners the simulation confirms, within `budget` corners (pure, deterministic):
 * 1. the worst margins, spread over the limits: round-robin over the limits (the one whose worst
 *    corner uses most of its bound first), each turn taking that limit's next corner by highest
 *    usage (ties by id) not taken yet;
 * 2. a validation set drawn at random (seeded; a partial Fisher-Yates shuffle of the remaining
 *    corners in id order), so the screening's accuracy is also measured away from the extremes.
 * When the limits offer fewer candidates than their share, the validation set takes the rest.
 */
export function selectConfirm(corners: readonly SampleCornerLike[], budget: number, seed: number): ConfirmPick[] {
  const pool = corners.filter((c) => c.inputs.sample !== undefined);
  const n = Math.min(Math.max(0, Math.floor(budget)), pool.length);
  if (n === 0) return [];
  const validation = n >= 2 ? Math.max(1, Math.floor(n * VALIDATION_SHARE)) : 0;
  const picks: ConfirmPick[] = [];
  const taken = new Set<string>();

  const limits = [...new Set(pool.flatMap((c) => (c.checks ?? []).map((ch) => ch.limit)))];
  const ranked = limits.map((limit) => ({
    limit,
    list: pool.map((c) => ({ id: c.id, u: screened(c, limit) }))
      .filter((x): x is { id: string; u: number } => x.u !== null)
      .sort((a, b) => b.u - a.u || (a.id < b.id ? -1 : a.id > b.id ? 1 : 0)),
    next: 0,
  }))
    // the limit closest to (or furthest beyond) its bound takes the first turn
    .sort((a, b) => (b.list[0]?.u ?? -Infinity) - (a.list[0]?.u ?? -Infinity));
  const worstBudget = n - validation;
  for (let progress = true; picks.length < worstBudget && progress;) {
    progress = false;
    for (const r of ranked) {
      if (picks.length >= worstBudget) break;
      while (r.next < r.list.length && taken.has(r.list[r.next]!.id)) r.next++;
      if (r.next >= r.list.length) continue;
      const id = r.list[r.next++]!.id;
      taken.add(id);
      picks.push({ id, reason: 'worst', limit: r.limit });
      progress = true;
    }
  }

  const rest = pool.map((c) => c.id).filter((id) => !taken.has(id)).sort();
  const rng = sampleRng(seed, VALIDATION_STREAM, 0);
  for (let i = 0; picks.length < n && i < rest.length; i++) {
    const j = i + Math.floor(rng.next() * (rest.length - i));
    [rest[i], rest[j]] = [rest[j]!, rest[i]!];
    picks.push({ id: rest[i]!, reason: 'validation' });
  }
  return picks;
}
