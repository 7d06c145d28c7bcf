import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { normaliseVectorName, parseRaw, RawFormatError } from './rawfile.js';
import { sharedFile } from '../../tests/support/shared.js';

const fixture = (name: string) => readFileSync(sharedFile('raw', name));

describe('parseRaw on a transient plot (ngspice-39, rc-tran.cir)', () => {
  const [plot] = parseRaw(fixture('rc-tran.ngspice39.raw'));

  it('reads the header', () => {
    expect(plot.title).toBe('rc and rl step responses from zero state');
    expect(plot.plotname).toBe('Transient Analysis');
    expect(plot.flags).toBe('real');
    expect(plot.variables.map((v) => [v.name, v.type])).toEqual([['time', 'time'], ['v(out)', 'voltage'], ['i(vsense)', 'current']]);
    expect(plot.points).toBe(1009);
    expect(plot.aborted).toBe(false);
  });

  it('matches the RC step response v = V(1 - exp(-t/RC)) within 1e-3 V', () => {
    // First-order RC charging from zero state, closed form (any circuits textbook, e.g. Hayt & Kemmerly).
    const t = plot.vectors.time;
    const v = plot.vectors['v(out)'];
    for (let i = 0; i < t.length; i++) expect(Math.abs(v[i] - (1 - Math.exp(-t[i] / 1e-3)))).toBeLessThan(1e-3);
    expect(t[t.length - 1]).toBeCloseTo(5e-3, 12);
  });

  it('matches the RL step current i = V/R (1 - exp(-t R/L)) within 1e-3 relative', () => {
    // First-order RL, closed form; tau = L/R = 10 mH / 100 ohm = 0.1 ms.
    const t = plot.vectors.time;
    const i = plot.vectors['i(vsense)'];
    for (let k = 0; k < t.length; k++) expect(Math.abs(i[k] - 0.01 * (1 - Math.exp(-t[k] / 1e-4)))).toBeLessThan(1e-3 * 0.01);
  });

  it('reads the wasm-written file (ngspice-45.2, extra Command: line) to the same names and values', () => {
    const [w] = parseRaw(fixture('rc-tran.ngspice45.wasm.raw'));
    expect(w.variables.map((v) => v.name)).toEqual(['time', 'v(out)', 'i(vsense)']);
    expect(w.points).toBe(plot.points);
    const a = plot.vectors['v(out)'];
    const b = w.vectors['v(out)'];
    for (let k = 0; k < a.length; k++) expect(Math.abs(a[k] - b[k])).toBeLessThan(1e-9);
  });
});

describe('parseRaw on truncated and aborted files', () => {
  it('infers rows from the bytes and drops the partial last row of a truncated copy', () => {
    const [full] = parseRaw(fixture('rc-tran.ngspice39.raw'));
    const [cut] = parseRaw(fixture('rc-tran.ngspice39.truncated.raw'));
    expect(cut.declaredPoints).toBe(1009);
    expect(cut.points).toBe(504);
    expect(cut.aborted).toBe(true);
    expect(Array.from(cut.vectors['v(out)'])).toEqual(Array.from(full.vectors['v(out)'].subarray(0, 504)));
  });

  it('recovers the rows of a run that aborted with No. Points: 0 (capacitor ramp I/C until 1 us)', () => {
    const [p] = parseRaw(fixture('timestep-abort.ngspice39.raw'));
    expect(p.declaredPoints).toBe(0);
    expect(p.aborted).toBe(true);
    expect(p.points).toBe(1037);
    const t = p.vectors.time;
    const v = p.vectors['v(a)'];
    expect(t[t.length - 1]).toBeCloseTo(1e-6, 12); // the abort time ngspice reports: "time = 1e-06"
    // C dv/dt = I: 1 mA into 1 nF ramps at 1e6 V/s while the switch is open (below 1 V).
    for (let k = 0; k < t.length; k++) if (t[k] < 0.99e-6) expect(Math.abs(v[k] - 1e6 * t[k])).toBeLessThan(1e-3);
  });

  it('returns a plot with no rows for a header cut off by a failed operating point', () => {
    const plots = parseRaw(fixture('op-fail.ngspice39.raw'));
    expect(plots).toHaveLength(1);
    expect(plots[0].points).toBe(0);
    expect(plots[0].aborted).toBe(true);
    expect(plots[0].plotname).toBe('Transient Analysis');
  });

  it('rejects bytes that are not a raw file', () => {
    expect(() => parseRaw(Buffer.from('hello world\n'))).toThrow(RawFormatError);
    expect(() => parseRaw(Buffer.from('Title: x\nNo. Variables: two\nBinary:\n'))).toThrow(RawFormatError);
    expect(parseRaw(new Uint8Array(0))).toEqual([]);
  });
});

describe('parseRaw on complex and multi-plot files', () => {
  // First-order low-pass H = 1 / (1 + j f/fc), fc = 1/(2 pi R C) = 100 Hz here (closed form).
  const lowPass = (f: number, fc: number) => ({ mag: 1 / Math.hypot(1, f / fc), phase: -Math.atan(f / fc) });

  it('reads an AC sweep as real and imaginary parts: |H(fc)| = 1/sqrt(2), phase -45 deg', () => {
    const [p] = parseRaw(fixture('rc-ac.ngspice39.raw'));
    expect(p.flags).toBe('complex');
    expect(p.points).toBe(51);
    const f = p.vectors.frequency;
    const re = p.vectors['v(out)'];
    const im = p.imag!['v(out)'];
    expect(p.imag!.frequency).toBeUndefined(); // the scale's imaginary part is garbage and dropped
    for (let k = 0; k < f.length; k++) {
      const { mag, phase } = lowPass(f[k], 100);
      expect(Math.abs(Math.hypot(re[k], im[k]) - mag)).toBeLessThan(1e-6);
      expect(Math.abs(Math.atan2(im[k], re[k]) - phase)).toBeLessThan(1e-6);
    }
    const k100 = Array.from(f).findIndex((x) => Math.abs(x - 100) < 1e-6);
    expect(Math.hypot(re[k100], im[k100])).toBeCloseTo(Math.SQRT1_2, 6);
    expect((Math.atan2(im[k100], re[k100]) * 180) / Math.PI).toBeCloseTo(-45, 4);
  });

  it('reads the ASCII form of the same sweep to the same numbers', () => {
    const [b] = parseRaw(fixture('rc-ac.ngspice39.raw'));
    const [a] = parseRaw(fixture('rc-ac.ngspice39.ascii.raw'));
    expect(a.variables).toEqual(b.variables);
    for (const name of ['v(out)', 'i(v1)']) {
      for (let k = 0; k < b.points; k++) {
        expect(a.vectors[name][k]).toBeCloseTo(b.vectors[name][k], 14);
        expect(a.imag![name][k]).toBeCloseTo(b.imag![name][k], 14);
      }
    }
  });

  it('splits an op + ac + tran file into its three plots', () => {
    const plots = parseRaw(fixture('multi.ngspice39.raw'));
    expect(plots.map((p) => [p.plotname, p.flags, p.points])).toEqual([
      ['AC Analysis', 'complex', 16],
      ['Operating Point', 'real', 1],
      ['Transient Analysis', 'real', 108],
    ]);
    const [ac, op, tran] = plots;
    // Divider 1k / 3k from 4 V: v(out) = 3 V, source current -1 mA (ngspice's sign: into the + terminal).
    expect(op.vectors['v(out)'][0]).toBeCloseTo(3, 9);
    expect(op.vectors['i(v1)'][0]).toBeCloseTo(-1e-3, 12);
    const vt = tran.vectors['v(out)'];
    expect(vt[vt.length - 1]).toBeCloseTo(3, 6);
    // AC: Thevenin 0.75 V/V behind 750 ohm into 1 uF, fc = 1/(2 pi 750 1e-6) = 212.2 Hz.
    const fc = 1 / (2 * Math.PI * 750 * 1e-6);
    for (let k = 0; k < ac.points; k++) {
      const mag = Math.hypot(ac.vectors['v(out)'][k], ac.imag!['v(out)'][k]);
      expect(Math.abs(mag - 0.75 * lowPass(ac.vectors.frequency[k], fc).mag)).toBeLessThan(1e-6);
    }
  });
});

describe('normaliseVectorName', () => {
  it('lower-cases and maps old-style branch names', () => {
    expect(normaliseVectorName('V(OUT)')).toBe('v(out)');
    expect(normaliseVectorName('Vsense#branch')).toBe('i(vsense)');
    expect(normaliseVectorName('i(@do1[id])')).toBe('i(@do1[id])');
  });
});
