import { describe, expect, it } from 'vitest';
import { cornerFailures, failingDivergences, isUnexplained, runFailures } from './gate.js';
import type { CornerResult, Divergence, Results } from './types.js';
import type { LimitCheck } from '../limits/types.js';

const div = (metric: string, cause?: string): Divergence => ({ metric, fha: 1, sim: 1.2, error: 0.2, tolerance: 0.1, reason: 'r', ...(cause ? { cause } : {}) } as Divergence);
const check = (limit: LimitCheck['limit'], simWithin: boolean | null): LimitCheck =>
  ({ limit, bound: 1, kind: 'max', fha: { value: 0.9, within: true }, ideal: null, sim: simWithin === null ? null : { value: simWithin ? 0.9 : 1.1, within: simWithin }, flip: simWithin === false });
const corner = (over: Partial<CornerResult>): CornerResult => ({ id: 'c', status: 'ok', divergences: [], checks: [], ...over } as CornerResult);

describe('what fails a run (exit code 1)', () => {
  it('a divergence without a cause counts as unexplained', () => {
    expect([isUnexplained(div('x')), isUnexplained(div('x', 'unexplained')), isUnexplained(div('x', 'approximation')), isUnexplained(div('x', 'circuit'))])
      .toEqual([true, true, false, false]);
  });
  it('default: only unexplained divergences; --fail-on divergence: all of them', () => {
    const c = corner({ status: 'diverged', divergences: [div('a', 'approximation'), div('b', 'circuit'), div('c')] });
    expect(failingDivergences(c).map((d) => d.metric)).toEqual(['c']);
    expect(failingDivergences(c, 'divergence').map((d) => d.metric)).toEqual(['a', 'b', 'c']);
    expect(cornerFailures(corner({ status: 'diverged', divergences: [div('a', 'approximation')] }))).toEqual([]);
    expect(cornerFailures(corner({ status: 'diverged', divergences: [div('a', 'approximation')] }), 'divergence')).toEqual(['divergence: a']);
  });
  it('a limit outside in simulation and a corner not settled fail; an FHA-only outside does not', () => {
    expect(cornerFailures(corner({ status: 'outside-limits', checks: [check('crVoltage', false), check('tankCurrentRms', true)] })))
      .toEqual(['outside limits in simulation: crVoltage']);
    expect(cornerFailures(corner({ status: 'predicted', checks: [{ ...check('crVoltage', null), fha: { value: 2, within: false } }] }))).toEqual([]);
    expect(cornerFailures(corner({ status: 'not-settled' }))).toEqual(['not settled']);
  });
  it('a baseline regression fails the run; one line per reason', () => {
    const r = { corners: [corner({ id: 'a', status: 'diverged', divergences: [div('gain')] }), corner({ id: 'b' })],
      baseline: { file: 'b.json', regressed: true } } as unknown as Results;
    expect(runFailures(r)).toEqual(['a: unexplained divergence: gain', 'baseline b.json: regressed']);
    expect(runFailures({ ...r, baseline: undefined, corners: [corner({})] } as Results)).toEqual([]);
  });
});
