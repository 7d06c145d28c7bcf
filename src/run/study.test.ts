// The study orchestrator without an engine: runStudy driven by real ngspice output recorded earlier
// (shared/recorded/study/, written by tests/support/recordedEngine.ts). Re-record after a change
// to the deck or the steady-state loop: RECORD_STUDY=1 npx vitest run src/run/study.test.ts
// (needs the system ngspice), then commit shared/recorded/study/.
import { readFileSync } from 'node:fs';
import { beforeAll, describe, expect, it } from 'vitest';
import { runStudy, type StudyOutput } from './study.js';
import { makeDesign } from '../../tests/support/design.js';
import { sharedFile } from '../../tests/support/shared.js';
import { recordingEngine, replayEngine } from '../../tests/support/recordedEngine.js';

const DIR = sharedFile('recorded', 'study');
const FAIL_ID = 'timestep-abort';
// Worked-example tank (docs: shared/checks/worked-example.json) at 90 kHz, fn = 0.894, with real
// diode drops; three input voltages, fast accuracy so the recording stays small.
const design = makeDesign({
  rectifier: { forwardVoltage: 0.7, resistance: 0.01 },
  operating: { vin: [380, 400, 420] },
  simulation: { accuracy: 'fast', settleTolerance: 0.002 },
});
const IDS = ['v380_4ohm_f90k_nom', 'v400_4ohm_f90k_nom', 'v420_4ohm_f90k_nom'];

let plain: StudyOutput;
beforeAll(async () => {
  if (process.env['RECORD_STUDY']) {
    const rec = recordingEngine(DIR);
    await runStudy(design, { engine: rec });
    // a real ngspice failure, answered later in place of one corner
    await rec.run({ id: FAIL_ID, deck: readFileSync(sharedFile('raw', 'timestep-abort.cir'), 'latin1'), timeoutMs: 60_000 });
    rec.save();
    await rec.close();
  }
  plain = await runStudy(design, { engine: replayEngine(DIR) });
}, 600_000);

describe('runStudy on recorded ngspice output', () => {
  it('reports every corner in expansion order with the engine that produced the output', () => {
    expect(plain.results.corners.map((c) => c.id)).toEqual(IDS);
    expect(plain.results.engine).toEqual({ name: 'ngspice', version: expect.stringMatching(/^ngspice-\d+/) });
    expect(plain.results.incomplete).toBeUndefined();
    expect(plain.waveforms.map((w) => w.id)).toEqual(IDS);
  });

  it('every corner settles and its status follows statusOf from what was measured', () => {
    for (const c of plain.results.corners) {
      expect(c.sim).not.toBeNull();
      expect(c.sim!.settled).toBe(true);
      expect(c.status).toBe(c.divergences.length ? 'diverged' : 'ok');
    }
    const s = plain.results.summary;
    expect(s.corners).toBe(3);
    expect(s.ok + s.diverged).toBe(3);
    expect(s.failed + s.notSettled + s.predicted + s.unreachable).toBe(0);
  });

  it('measured gain sits where theory puts it below resonance: above FHA, within 1 % of the ideal model', () => {
    // docs/method.md#below-resonance: at fn = 0.894 the real gain exceeds FHA's (here by 1.4 %).
    // The ideal model (src/tdmodel) has the intervals FHA misses and the same drops, dead time and
    // on-resistance, but no parasitics or exponential diodes: agreement within 1 % (here 0.1 %).
    for (const c of plain.results.corners) {
      expect(c.fha.fn).toBeCloseTo(0.894113, 5);
      expect(c.sim!.gain).toBeGreaterThan(c.fha.gain!);
      expect(c.ideal).toBeTruthy();
      expect(Math.abs(c.sim!.gain / c.ideal!.gain - 1)).toBeLessThan(0.01);
    }
    // Vout scales with Vin at a fixed frequency (same gain), within the drop and loss share: 2 %
    const [a, , b] = plain.results.corners.map((c) => c.sim!.vout);
    expect(b! / a!).toBeGreaterThan((420 / 380) * 0.98);
    expect(b! / a!).toBeLessThan((420 / 380) * 1.02);
  });

  it('gives the same results with two corners at once (the pool keeps corner order)', async () => {
    const two = await runStudy(design, { engine: replayEngine(DIR), jobs: 2 });
    expect(two.results).toEqual(plain.results);
  });

  it('a failed corner keeps the simulator reason and the others go on', async () => {
    const engine = replayEngine(DIR, { [IDS[1]!]: FAIL_ID });
    const out = await runStudy(design, { engine });
    const [c1, c2, c3] = out.results.corners;
    expect(c2!.status).toBe('failed');
    expect(c2!.sim).toBeNull();
    expect(c2!.failure).toMatchObject({ kind: 'convergence', message: expect.stringMatching(/timestep too small/i) });
    // the retry ladder tried more than once before giving up
    expect(engine.jobs.filter((j) => j === IDS[1]).length).toBeGreaterThan(1);
    expect(c1).toEqual(plain.results.corners[0]);
    expect(c3).toEqual(plain.results.corners[2]);
    expect(out.results.summary.failed).toBe(1);
  });

  it('an interrupted study keeps finished corners, leaves the rest FHA-only and says so', async () => {
    const ac = new AbortController();
    const out = await runStudy(design, { engine: replayEngine(DIR), signal: ac.signal, onProgress: () => ac.abort() });
    expect(out.results.incomplete).toBe(true);
    expect(Object.keys(out.results).slice(0, 2)).toEqual(['schema', 'incomplete']);
    expect(out.results.corners[0]).toEqual(plain.results.corners[0]);
    expect(out.results.corners.slice(1).map((c) => [c.status, c.sim])).toEqual([['predicted', null], ['predicted', null]]);
  });
});
