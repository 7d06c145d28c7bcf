// The retry ladder on a real convergence failure, with both engines. Slow-tagged by the file name.
import { afterAll, describe, expect, it } from 'vitest';
import { createNgspiceEngine } from './native.js';
import { RETRY_LADDER, runWithRetries } from './retry.js';
import { createWasmEngine } from './wasm.js';

// A half-bridge LC tank seeded with Cr = 200 V and Vout = 49 V, gear: the rectifier diode fails at once
// with "Timestep too small" (about 0.1 ns) on both ngspice 39 and 45.2.
const SEEDED = `seeded tank
Vin in 0 400
Vgh gh 0 PULSE(0 1 0 10n 10n 3.5u 7.14u)
Vgl gl 0 PULSE(0 1 3.57u 10n 10n 3.5u 7.14u)
S1 in sw gh 0 swm
S2 sw 0 gl 0 swm
D1 0 sw dmod
D2 sw in dmod
Lr sw a 50u IC=0
Cr a b 47n IC=200
Lm b 0 250u IC=0
Ep p 0 b 0 0.25
Dr p out dmod
Co out 0 100u IC=49
RL out 0 4.6
.model swm sw vt=0.5 vh=0 ron=0.05 roff=1e7
.model dmod d is=1e-12 n=1 rs=0.01 cjo=100p
.options method=gear reltol=1e-3
.save v(out)
.tran 20n 20u 0 20n UIC
.end
`;

const wasm = createWasmEngine();
afterAll(() => wasm.close());

describe('runWithRetries', () => {
  it('native ngspice 39: fails as configured, succeeds on the rshunt rung (RETRY_LADDER, the one ladder the runs use)', async () => {
    const r = await runWithRetries(createNgspiceEngine(), { id: 's', deck: SEEDED, timeoutMs: 20_000 });
    expect(r.attempts.map((a) => [a.label, a.outcome])).toEqual([['as configured', 'convergence'], ['rshunt=1e7', 'ok']]);
    expect(r.ok).toBe(true);
    expect(r.vectors.time[r.vectors.time.length - 1]).toBeCloseTo(20e-6, 12);
  });

  it('wasm ngspice-45.2: rshunt has no effect there and neither has the other method; the start from rest runs', async () => {
    const r = await runWithRetries(wasm, { id: 's', deck: SEEDED, timeoutMs: 20_000 });
    expect(r.attempts.map((a) => [a.label, a.outcome])).toEqual([
      ['as configured', 'convergence'], ['rshunt=1e7', 'convergence'], ['other integration method', 'convergence'], ['zero-state start', 'ok'],
    ]);
    expect(r.attempts.map((a) => a.label)).toEqual(['as configured', ...RETRY_LADDER.map((g) => g.label)]);
    expect(r.ok).toBe(true);
    expect(r.vectors.time[r.vectors.time.length - 1]).toBeCloseTo(20e-6, 12);
  });

  it('a ladder that ends without success returns the last convergence failure naming every rung', async () => {
    const r = await runWithRetries(wasm, { id: 's', deck: SEEDED, timeoutMs: 20_000 }, RETRY_LADDER.slice(0, 2));
    expect(r.attempts.every((a) => a.outcome === 'convergence')).toBe(true);
    expect(r.failure?.kind).toBe('convergence');
    expect(r.failure?.message).toMatch(/after 3 attempts: as configured, rshunt=1e7, other integration method\)$/);
  });

  it('does not retry input failures', async () => {
    const r = await runWithRetries(createNgspiceEngine(), { id: 'b', deck: 'b\nX1 a 0 nosuch\n.tran 1u 1m\n.end\n', timeoutMs: 20_000 });
    expect(r.attempts).toHaveLength(1);
    expect(r.failure?.kind).toBe('input');
  });
});
