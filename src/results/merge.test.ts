import { describe, expect, it } from 'vitest';
import { mergeParts, type MergePart, type ShardInfo } from './merge.js';
import type { CornerResult, Results } from './types.js';

const corner = (id: string): CornerResult => ({ id } as unknown as CornerResult);
const FP = 'a'.repeat(64);

/** A part holding plan items `items` (of 5: ids c0..c4) as shard k/n. */
function part(k: number, n: number, items: number[], over: Partial<ShardInfo> = {}, source = `part-${k}`): MergePart {
  const shard: ShardInfo = { index: k, count: n, total: 5, items, fingerprint: FP, ...over };
  const results = { corners: items.map((i) => corner(`c${i}`)), shard } as unknown as Results;
  return { source, results, waveforms: items.map((i) => ({ id: `c${i}`, fs: 1, t: [], series: {}, edges: [] })) };
}

describe('mergeParts', () => {
  it('puts the corners and excerpts of complete, disjoint shards back in plan order, whatever the part order', () => {
    const r = mergeParts([part(2, 3, [1, 4]), part(3, 3, [2]), part(1, 3, [0, 3])]);
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.corners.map((c) => c.id)).toEqual(['c0', 'c1', 'c2', 'c3', 'c4']);
    expect(r.waveforms.map((w) => w.id)).toEqual(['c0', 'c1', 'c2', 'c3', 'c4']);
  });

  const problems = (parts: MergePart[]) => {
    const r = mergeParts(parts);
    return r.ok ? [] : r.problems;
  };

  it('names a missing shard', () => {
    expect(problems([part(1, 3, [0, 3]), part(3, 3, [2])])).toEqual(['missing shard 2/3']);
  });

  it('names a shard given twice', () => {
    expect(problems([part(1, 2, [0, 1, 2]), part(1, 2, [0, 1, 2], {}, 'copy'), part(2, 2, [3, 4])])).toEqual(['shard 1/2 is given twice: part-1 and copy']);
  });

  it('refuses a part from another study or another split', () => {
    expect(problems([part(1, 2, [0, 1, 2]), part(2, 2, [3, 4], { fingerprint: 'b'.repeat(64) })])[0]).toMatch(/part-2: from another study/);
    expect(problems([part(1, 2, [0, 1, 2]), part(2, 3, [3, 4])])[0]).toMatch(/part-2: shard 2\/3 of 5 items does not match part-1 \(2 shards of 5 items\)/);
  });

  it('refuses a truncated part, overlapping items and uncovered items', () => {
    const short = part(2, 2, [3, 4]);
    short.results.corners.pop();
    expect(problems([part(1, 2, [0, 1, 2]), short])[0]).toMatch(/lists 2 plan items but holds 1 corners/);
    expect(problems([part(1, 2, [0, 1, 2]), part(2, 2, [2, 3])])).toEqual(['plan item 2 (c2) is in part-1 and part-2', 'plan items not covered by any part: 4']);
  });

  it('refuses a whole-study results file and an empty list', () => {
    const whole = part(1, 1, [0, 1, 2, 3, 4]);
    delete (whole.results as Partial<Results>).shard;
    expect(problems([whole])[0]).toMatch(/not a shard/);
    expect(problems([])).toEqual(['no parts to merge']);
  });
});
