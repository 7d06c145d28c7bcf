import { describe, expect, it } from 'vitest';
import { selectConfirm } from './confirm.js';
import type { CheckLike, SampleCornerLike } from './corners.js';

const check = (limit: string, value: number, bound: number, kind: 'max' | 'min' = 'max'): CheckLike =>
  ({ limit, kind, bound, fha: { value, within: kind === 'max' ? value <= bound : value >= bound }, ideal: null, sim: null });

// 40 corners: crVoltage rises with the sample number, frequency.min falls with it.
const corners: SampleCornerLike[] = Array.from({ length: 40 }, (_, k) => ({
  id: `v390_100pct_reg_s${String(k).padStart(4, '0')}`,
  inputs: { vin: 390, load: 2.4, fs: null, sample: k },
  status: 'screened',
  checks: [check('crVoltage', 300 + k, 400), check('frequency.min', 100e3 - 1e3 * (k % 7), 60e3, 'min'), { ...check('zvs', 0, 0), kind: 'state', bound: true, fha: { value: k !== 3, within: k !== 3 } }],
  sim: null,
}));

describe('selectConfirm', () => {
  it('spreads the worst picks over the limits, worst first, then adds a seeded validation set', () => {
    const picks = selectConfirm(corners, 8, 42);
    expect(picks).toHaveLength(8);
    const worst = picks.filter((p) => p.reason === 'worst');
    expect(worst).toHaveLength(6); // 8 minus a quarter for validation
    // limits by their worst usage: zvs not met (infinite), crVoltage 339/400, frequency.min 60/94
    expect(worst.slice(0, 3).map((p) => [p.limit, p.id.slice(-5)])).toEqual([
      ['zvs', 's0003'], ['crVoltage', 's0039'], ['frequency.min', 's0006'],
    ]);
    // zvs has one corner that is not met: its turn passes on to the others afterwards
    expect(worst.slice(3).map((p) => p.limit)).toEqual(['crVoltage', 'frequency.min', 'crVoltage']);
    expect(new Set(picks.map((p) => p.id)).size).toBe(8);
  });

  it('is deterministic for a seed, and the validation set changes with the seed', () => {
    expect(selectConfirm(corners, 12, 42)).toEqual(selectConfirm(corners, 12, 42));
    const v = (seed: number) => selectConfirm(corners, 12, seed).filter((p) => p.reason === 'validation').map((p) => p.id);
    expect(v(42)).not.toEqual(v(43));
  });

  it('never exceeds the corners or the budget; 0 confirms nothing', () => {
    expect(selectConfirm(corners, 0, 1)).toEqual([]);
    expect(selectConfirm(corners.slice(0, 3), 20, 1)).toHaveLength(3);
    expect(selectConfirm(corners, 1, 1)).toEqual([{ id: 'v390_100pct_reg_s0003', reason: 'worst', limit: 'zvs' }]);
  });
});
