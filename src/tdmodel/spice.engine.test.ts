import { describe, expect, it } from 'vitest';
import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { solveSteadyState } from './periodic.js';
import { params, rel } from './cases.test-support.js';
import type { SteadyStateResult, TdParams } from './types.js';

// External reference: ngspice (system binary, tested with ngspice-39) on the same circuit,
// primary-referred: bridge as a pulse source (no dead time), Lr, Cr, Lm, a diode bridge into
// n Vo with Co/n^2 and n^2 RL. The SPICE diodes are exponential (IS 1 uA, N 1): about 0.4 V
// each, two in the path, i.e. 0.2 V per diode on the secondary side of our center-tapped model.

const e = (x: number) => x.toExponential(10);

function deck(p: TdParams, r: SteadyStateResult, rl: number, periods: number): string {
  const T = 1 / p.fs;
  const n = p.n;
  const vp = (p.lm / (p.lr + p.lm)) * (0 - r.seed.vcr); // Lm voltage at t = 0 with the rectifier off
  const vr = n * r.vo;
  const vo = Math.max(vp, 0) + (vr - Math.abs(vp)) / 2; // bridge output nodes with all diodes off
  const from = (periods - 10) * T;
  return `* tdmodel seed check
Vb b 0 PULSE(0 ${p.vin} 0 1n 1n ${e(T / 2 - 1e-9)} ${e(T)})
L1 b c ${e(p.lr)} IC=${e(r.seed.ir)}
C1 c p ${e(p.cr)} IC=${e(r.seed.vcr)}
Lm p 0 ${e(p.lm)} IC=${e(r.seed.im)}
D1 p o dx
D2 0 o dx
D3 m p dx
D4 m 0 dx
Co o m ${e(100e-6 / n / n)} IC=${e(vr)}
Rl o m ${e(n * n * rl)}
Rg m 0 1e9
Eo vout 0 o m 1
.ic v(b)=0 v(p)=${e(vp)} v(c)=${e(vp + r.seed.vcr)} v(o)=${e(vo)} v(m)=${e(vo - vr)}
.model dx D(IS=1e-6 N=1 RS=1e-4 CJO=1p)
.options reltol=1e-4 abstol=1e-9 vntol=1e-6
.tran 5n ${e(periods * T)} 0 ${e(T / 500)} uic
.meas tran irms RMS i(L1) from=${e(from)} to=${e(periods * T)}
.meas tran volast AVG v(vout) from=${e(from)} to=${e(periods * T)}
.meas tran vofirst AVG v(vout) from=0 to=${e(10 * T)}
.end
`;
}

function run(text: string): Record<string, number> {
  const dir = mkdtempSync(join(tmpdir(), 'tdmodel-'));
  try {
    writeFileSync(join(dir, 'deck.cir'), text);
    const out = spawnSync('ngspice', ['-b', 'deck.cir'], { cwd: dir, encoding: 'utf8', timeout: 60_000 });
    const vals: Record<string, number> = {};
    for (const m of out.stdout.matchAll(/^(\w+)\s+=\s+(\S+)/gm)) vals[m[1]] = Number(m[2]);
    return vals;
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

// Without ngspice on PATH these checks are skipped (the rest of the suite does not need it).
describe('seeded ngspice run of shared/checks/worked-example.json circuit', () => {
  for (const [fs, rl] of [[90e3, 4], [130e3, 6]] as const) {
    it(`fs ${fs / 1e3} kHz, RL ${rl} ohm: settled from the first cycle; Vo and Ir,rms agree`, () => {
      const p = params({ fs, vf: 0.1725, rd: 0.0015 });
      const r = solveSteadyState(p, rl);
      const m = run(deck(p, r, rl, 40));
      // 0.3 %: our output is stiff, the SPICE one ripples by about 0.6 % (that alone moved the
      // average by +0.05 % in a fixed-step check) and the diode law is exponential, ours linear.
      expect(rel(m.volast, p.n * r.vo)).toBeLessThan(3e-3);
      expect(rel(m.vofirst, m.volast)).toBeLessThan(2e-3); // no start-up transient to speak of
      expect(rel(m.irms, r.tankCurrentRms)).toBeLessThan(5e-3);
    });
  }
});
