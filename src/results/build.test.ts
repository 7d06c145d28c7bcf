import { describe, expect, it } from 'vitest';
import { loadDesignOrThrow } from '../design/load.js';
import { expandCorners } from '../corners/expand.js';
import { predictCorner } from '../fha/predict.js';
import type { SimSummary } from './types.js';
import { cornerInputs, envelope, failed, predicted, simulated, statusOf } from './build.js';
import { TOOL_VERSION } from '../version.js';

const { design } = await loadDesignOrThrow(new URL('../../examples/demo.yaml', import.meta.url).pathname);
const corner = expandCorners(design)[0];
const fha = predictCorner(design, corner);
// only the fields the builders read; the rest of SimSummary does not matter here
const sim = { settled: true, settleError: 1e-4, cycles: 30, runs: 2, simulations: 1 } as SimSummary;
const divergence = { metric: 'vout', fha: 1, sim: 2, error: 1, tolerance: 0.1, reason: 'r', contradicts: false };

describe('statusOf', () => {
  it('ranks failed > not-settled > outside-limits > diverged > ok', () => {
    expect(statusOf({ failed: true, settled: false, outsideLimits: true, diverged: true })).toBe('failed');
    expect(statusOf({ settled: false, outsideLimits: true, diverged: true })).toBe('not-settled');
    expect(statusOf({ settled: true, outsideLimits: true, diverged: true })).toBe('outside-limits');
    expect(statusOf({ settled: true, outsideLimits: false, diverged: true })).toBe('diverged');
    expect(statusOf({ settled: true, diverged: false })).toBe('ok');
  });
});

describe('corner builders', () => {
  it('predicted: FHA only, unreachable when FHA has no frequency', () => {
    const r = predicted(corner, fha);
    expect(r).toMatchObject({ id: corner.id, sim: null, comparison: [], divergences: [], status: 'predicted' });
    expect(r.inputs).toEqual(cornerInputs(corner));
    expect('id' in r.inputs).toBe(false);
    expect(predicted(corner, { ...fha, fs: null }).status).toBe('unreachable');
  });

  it('simulated: status from the measurement and the limits', () => {
    const m = { sim, comparison: [], divergences: [] };
    expect(simulated(corner, fha, m).status).toBe('ok');
    expect(simulated(corner, fha, { ...m, divergences: [divergence] as never }).status).toBe('diverged');
    expect(simulated(corner, fha, { ...m, sim: { ...sim, settled: false } }).status).toBe('not-settled');
    expect(simulated(corner, fha, m, { outsideLimits: true }).status).toBe('outside-limits');
  });

  it('failed: keeps the reason, drops an empty detail, keeps what was measured', () => {
    const r = failed(corner, fha, { kind: 'engine', message: 'timestep too small', detail: '' });
    expect(r).toMatchObject({ status: 'failed', sim: null, failure: { kind: 'engine', message: 'timestep too small' } });
    expect(r.failure).not.toHaveProperty('detail');
    const withSim = failed(corner, fha, { kind: 'regulation', message: 'missed', detail: 'd' }, { sim, comparison: [], divergences: [divergence] as never });
    expect(withSim).toMatchObject({ status: 'failed', sim, failure: { detail: 'd' } });
    expect(withSim.divergences).toHaveLength(1);
  });
});

describe('envelope', () => {
  it('writes the schema, tool, design, engine and summary; incomplete only when true and first after schema', () => {
    const corners = [predicted(corner, fha), failed(corner, fha, { kind: 'engine', message: 'x' })];
    const r = envelope(design, corners, { engine: { name: 'ngspice', version: '45' } });
    expect(r).toMatchObject({ schema: 'tankcheck/results@1', tool: { name: 'tankcheck', version: TOOL_VERSION },
      design: { name: design.name }, engine: { name: 'ngspice', version: '45' } });
    expect(r.summary).toMatchObject({ corners: 2, predicted: 1, failed: 1, simulations: 0 });
    expect(r.summary).not.toHaveProperty('cacheHits'); // a fact of the run, not of the results
    expect(r).not.toHaveProperty('incomplete');
    expect(Object.keys(envelope(design, corners, { engine: null, incomplete: true })).slice(0, 3)).toEqual(['schema', 'incomplete', 'tool']);
  });
});
