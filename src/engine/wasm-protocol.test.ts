import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { finishRun } from './wasm-protocol.js';
import { sharedFile } from '../../tests/support/shared.js';

const raw = (name: string) => new Uint8Array(readFileSync(sharedFile('raw', name)));
const job = { id: 'j', deck: 'x\n.end\n', timeoutMs: 1000 };
const done = (over: object) => ({ type: 'done' as const, jobId: 1, lines: [], nonceOk: true, constants: false, ...over });

describe('finishRun (wasm worker report -> SimResult)', () => {
  it('parses the transferred raw bytes of a good run', () => {
    const r = finishRun(job, done({ raw: raw('rc-tran.ngspice45.wasm.raw') }), 12);
    expect(r.ok).toBe(true);
    expect(r.vectors['v(out)']).toHaveLength(1009);
    expect(r.wallMs).toBe(12);
  });

  it('never returns data whose header lacks the nonce, even when no error was printed', () => {
    const r = finishRun(job, done({ nonceOk: false, raw: raw('rc-tran.ngspice45.wasm.raw') }), 1);
    expect(r.failure?.kind).toBe('engine');
    expect(r.failure?.message).toMatch(/title nonce/);
    expect(r.vectors).toEqual({});
  });

  it("treats the 'Constant values' plot (1 point, no variables) as an input failure", () => {
    expect(finishRun(job, done({ constants: true }), 1).failure?.kind).toBe('input');
  });

  it('marks a run that printed an abort as failed even though its file is complete', () => {
    // wasm writes out.raw after the abort, so the file declares its rows; only the messages tell.
    const lines = ['doAnalyses: TRAN:  Timestep too small; time = 1e-06, timestep = 1.25e-21: trouble with swm-instance s1', 'run simulation(s) aborted'];
    const r = finishRun(job, done({ lines, raw: raw('timestep-abort.ngspice45.wasm.raw') }), 1);
    expect(r.failure).toMatchObject({ kind: 'convergence', atTime: 1e-6 });
    expect(r.partial).toBe(true);
  });
});
