import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { parseRaw } from './rawfile.js';
import { assembleResult, implausibleVectors, plotVectors } from './result.js';
import { sharedFile } from '../../tests/support/shared.js';

const fixture = (name: string) => readFileSync(sharedFile('raw', name));

describe('plotVectors', () => {
  it('puts the scale first, sorts the rest, and splits complex vectors into real()/imag()', () => {
    const [ac] = parseRaw(fixture('rc-ac.ngspice39.raw'));
    const v = plotVectors(ac);
    expect(Object.keys(v)).toEqual(['frequency', 'real(i(v1))', 'imag(i(v1))', 'real(v(in))', 'imag(v(in))', 'real(v(out))', 'imag(v(out))']);
    // |H| at the 100 Hz corner of a first-order low-pass is 1/sqrt(2) (closed form).
    const k = Array.from(v.frequency).findIndex((f) => Math.abs(f - 100) < 1e-6);
    expect(Math.hypot(v['real(v(out))'][k], v['imag(v(out))'][k])).toBeCloseTo(Math.SQRT1_2, 6);
  });
});

describe('assembleResult', () => {
  const timestepLines = ['doAnalyses: TRAN:  Timestep too small; time = 1e-06, timestep = 1.25e-21: trouble with swm-instance s1', 'run simulation(s) aborted'];

  it('returns the rows of an aborted raw file as a partial convergence failure', () => {
    const r = assembleResult({ id: 'c', raw: fixture('timestep-abort.ngspice39.raw'), outcome: { lines: timestepLines, completed: false, exitCode: 1 }, wallMs: 5 });
    expect(r).toMatchObject({ id: 'c', ok: false, partial: true, failure: { kind: 'convergence', atTime: 1e-6 }, wallMs: 5 });
    expect(r.vectors.time).toHaveLength(1037);
  });

  it('fails a run that claims success but whose raw file is incomplete or unreadable', () => {
    const cut = assembleResult({ id: 't', raw: fixture('rc-tran.ngspice39.truncated.raw'), outcome: { lines: [], completed: true, exitCode: 0 }, wallMs: 1 });
    expect(cut.failure?.kind).toBe('engine');
    expect(cut.partial).toBe(true);
    const junk = assembleResult({ id: 'j', raw: Buffer.from('not a raw file'), outcome: { lines: [], completed: true }, wallMs: 1 });
    expect(junk.failure?.kind).toBe('engine');
    expect(junk.diagnostics[0].text).toMatch(/unreadable raw file/);
  });

  it('names what is wrong with the raw file of a run that claims success: missing, empty, truncated', () => {
    const ok = { lines: [], completed: true, exitCode: 0 };
    expect(assembleResult({ id: 'n', outcome: ok, wallMs: 1 }).failure).toEqual({ kind: 'engine', message: 'the simulator reported success but no raw file was written' });
    expect(assembleResult({ id: 'e', raw: new Uint8Array(0), outcome: ok, wallMs: 1 }).failure?.message).toBe('the simulator reported success but the raw file is empty');
    const cut = assembleResult({ id: 't', raw: fixture('rc-tran.ngspice39.truncated.raw'), outcome: ok, wallMs: 1 });
    expect(cut.failure?.message).toMatch(/^the simulator reported success but the raw file (is truncated \(\d+ of \d+ rows\)|is incomplete)/);
    // a run that failed on its own keeps the simulator's reason
    const aborted = assembleResult({ id: 'a', raw: fixture('timestep-abort.ngspice39.raw'), outcome: { lines: timestepLines, completed: false, exitCode: 1 }, wallMs: 1 });
    expect(aborted.failure?.message).toMatch(/^doAnalyses: TRAN: Timestep too small/);
  });

  it('refuses rows that cannot be simulator output: non-finite values or time running backwards', () => {
    const [plot] = parseRaw(fixture('multi.ngspice39.raw')).slice(-1);
    expect(implausibleVectors(plot)).toBeUndefined();
    const nan = { ...plot, vectors: { ...plot.vectors, 'v(out)': plot.vectors['v(out)'].map((x, i) => (i === 3 ? NaN : x)) } };
    expect(implausibleVectors(nan)).toBe('v(out) has a value that is not finite (NaN) at row 3');
    const t = plot.vectors.time.slice();
    [t[5], t[6]] = [t[6], t[5]];
    expect(implausibleVectors({ ...plot, vectors: { ...plot.vectors, time: t } })).toMatch(/^time decreases at row 6 /);
  });

  it('returns a complete run as ok with the last plot of a multi-plot file', () => {
    const r = assembleResult({ id: 'm', raw: fixture('multi.ngspice39.raw'), outcome: { lines: [], completed: true, exitCode: 0 }, wallMs: 1 });
    expect(r.ok).toBe(true);
    expect(Object.keys(r.vectors)).toEqual(['time', 'i(v1)', 'v(in)', 'v(out)']);
  });
});
