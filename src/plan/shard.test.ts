import { describe, expect, it } from 'vitest';
import { assignShards, parseShard, shardItems } from './shard.js';

describe('assignShards (longest processing time first; Graham 1969)', () => {
  // a plan like a real one: regulated corners cost about twice a fixed-frequency corner, plus a few
  // screened Monte Carlo corners that cost next to nothing
  const costs = [2, 1, 2, 1, 2.4, 1, 1.1, 0.01, 0.01, 2, 1, 1, 2.2, 0.01, 1.3];

  it('puts every item in exactly one shard, the same way every time', () => {
    for (const n of [1, 2, 3, 4, 7, 20]) {
      const a = assignShards(costs, n);
      expect(a).toEqual(assignShards([...costs], n));
      const parts = Array.from({ length: n }, (_, k) => shardItems(costs, { index: k + 1, count: n }));
      expect(parts.flat().sort((x, y) => x - y)).toEqual(costs.map((_, i) => i));
    }
  });

  it('balances by cost: no shard exceeds the lightest by more than the largest item', () => {
    for (const n of [2, 3, 4, 5]) {
      const a = assignShards(costs, n);
      const load = Array.from({ length: n }, (_, k) => costs.reduce((s, c, i) => s + (a[i] === k ? c : 0), 0));
      expect(Math.max(...load) - Math.min(...load)).toBeLessThanOrEqual(Math.max(...costs) + 1e-12);
    }
  });

  it('splits 3 equal items over 3 shards one each, and gives empty shards when N exceeds the items', () => {
    expect(assignShards([1, 1, 1], 3)).toEqual([0, 1, 2]);
    expect(shardItems([1, 1], { index: 3, count: 3 })).toEqual([]);
  });
});

describe('parseShard', () => {
  it('reads K/N', () => {
    expect(parseShard('2/3')).toEqual({ index: 2, count: 3 });
    expect(parseShard('0/3')).toMatch(/outside 1..3/);
    expect(parseShard('4/3')).toMatch(/outside/);
    expect(parseShard('2')).toMatch(/expects K\/N/);
  });

  it('takes a 0-based index from the environment (a Kubernetes Indexed Job counts from 0)', () => {
    const env = (value: string | undefined) => ({ name: 'JOB_COMPLETION_INDEX', value });
    expect(parseShard('3', env('0'))).toEqual({ index: 1, count: 3 });
    expect(parseShard('3', env('2'))).toEqual({ index: 3, count: 3 });
    expect(parseShard('3', env('3'))).toMatch(/outside 1..3/);
    expect(parseShard('2/3', env('1'))).toEqual({ index: 2, count: 3 });
    expect(parseShard('1/3', env('1'))).toMatch(/disagrees/);
    expect(parseShard('3', env(undefined))).toMatch(/not set/);
    expect(parseShard(undefined, env('1'))).toMatch(/needs the shard count/);
    expect(parseShard('3', env('x'))).toMatch(/not a whole number/);
  });
});
