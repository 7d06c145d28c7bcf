import { availableParallelism } from 'node:os';
import { describe, expect, it } from 'vitest';
import { defaultJobs, mapPool, WASM_TWO_WORKER_MIN_FREE } from './pool.js';

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

describe('mapPool', () => {
  it('keeps at most `limit` calls in flight and returns results in input order', async () => {
    let inFlight = 0;
    let peak = 0;
    const delays = [30, 5, 20, 1, 10, 15, 2];
    const out = await mapPool(delays, 3, async (ms, i) => {
      peak = Math.max(peak, ++inFlight);
      await sleep(ms);
      inFlight--;
      return i * 10;
    });
    expect(out).toEqual([0, 10, 20, 30, 40, 50, 60]);
    expect(peak).toBe(3);
  });

  it('starts nothing new after a rejection and rejects with that error once running calls settle', async () => {
    const started: number[] = [];
    let settled = 0;
    const run = mapPool([0, 1, 2, 3, 4, 5], 2, async (i) => {
      started.push(i);
      await sleep(i === 1 ? 1 : 20);
      settled++;
      if (i === 1) throw new Error('boom');
      return i;
    });
    await expect(run).rejects.toThrow('boom');
    expect(started).toEqual([0, 1]);
    expect(settled).toBe(2);
  });

  it('stops starting items once the signal aborts', async () => {
    const ac = new AbortController();
    const started: number[] = [];
    const run = mapPool([0, 1, 2, 3], 1, async (i) => {
      started.push(i);
      if (i === 1) ac.abort(new Error('stop'));
      return i;
    }, ac.signal);
    await expect(run).rejects.toThrow('stop');
    expect(started).toEqual([0, 1]);
  });

  it('handles an empty list', async () => {
    expect(await mapPool([], 2, async (x: number) => x)).toEqual([]);
  });
});

describe('defaultJobs', () => {
  it('is min(CPUs, 2), and 1 for wasm below 1.5 GB free', () => {
    expect(defaultJobs('ngspice', { cpus: 8, freeBytes: 0 })).toBe(2);
    expect(defaultJobs('ngspice', { cpus: 1 })).toBe(1);
    expect(defaultJobs('wasm', { cpus: 8, freeBytes: WASM_TWO_WORKER_MIN_FREE })).toBe(2);
    expect(defaultJobs('wasm', { cpus: 8, freeBytes: WASM_TWO_WORKER_MIN_FREE - 1 })).toBe(1);
    // without host facts it reads this machine: CPUs from the OS (free memory varies, so ngspice)
    expect(defaultJobs('ngspice')).toBe(Math.min(availableParallelism(), 2));
  });
});
