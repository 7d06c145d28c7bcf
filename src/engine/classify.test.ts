import { describe, expect, it } from 'vitest';
import { classifyRun, cleanLines, findTimestepFailure, parseDiagnostics } from './classify.js';

// Message lines recorded on this machine from Debian ngspice 39.3 (stderr of `ngspice -n -b -r`) and from
// eecircuit-engine 1.8.0 / ngspice-45.2 (`getError()`), for the decks named in each case.
const native = {
  unknownSubckt: ['Error: unknown subckt: x1 out 0 nosuch', '    Simulation interrupted due to error!', '', "Error: there aren't any circuits loaded.", ''],
  noModel: [
    "warning, can't find model 'nomodel' from line",
    '    d1 out 0 nomodel',
    'Error on line 4 or its substitute:',
    '  d1 out 0 nomodel',
    'could not find a valid modelname',
    '    Simulation interrupted due to error!',
    '',
    'Error: circuit not parsed.',
    "Note: no resource usage information for 'time',",
    '\tor no active circuit available',
  ],
  missingInclude: ['Error: Could not find include file models/missing.lib', "Error: there aren't any circuits loaded."],
  timestep: [
    'Reference value :  0.00000e+00\rReference value :  9.36000e-07\rdoAnalyses: TRAN:  Timestep too small; time = 1e-06, timestep = 1.25e-21: trouble with swm-instance s1',
    '',
    '',
    'run simulation(s) aborted',
  ],
  opFailed: [
    'Note: Starting dynamic gmin stepping',
    'Trying gmin =   1.0000E-03 Warning: Further gmin increment',
    'Warning: Dynamic gmin stepping failed',
    'Supplies reduced to  58.2859% Supplies reduced to  38.8239% Note: One successful source step',
    'Supplies reduced to  50.0000% Warning: source stepping failed',
    'Note: Transient op started',
    'Error: Transient op failed, timestep too small',
    '',
    'doAnalyses: TRAN:  Timestep too small; initial timepoint: trouble with node "a"',
    '',
    'run simulation(s) aborted',
  ],
  singularRescued: [
    'Warning: singular matrix:  check node l1#branch',
    '',
    'Note: Starting dynamic gmin stepping',
    'Trying gmin =   1.0000E-03 Note: One successful gmin step',
    'Trying gmin =   1.0000E-04 Note: One successful gmin step',
    'Warning: singular matrix:  check node l1#branch',
    'Reference value :  1.00000e-03\r',
  ],
};
const wasm = {
  unknownDevice: ['Error on line 3 or its substitute:', '  a1 in out gainblk', ' unknown device type - error ', '    Simulation interrupted due to error!', '', 'Error: circuit not parsed.'],
  fatalInclude: ['Error: Could not find include file models/missing.lib', '    While reading test.cir', '', 'ERROR: fatal error in ngspice, exit(1)'],
};

describe('classifyRun', () => {
  it('maps parse errors to input failures with the offending line', () => {
    const a = classifyRun({ lines: native.unknownSubckt, completed: false, exitCode: 1 });
    expect(a.failure).toEqual({ kind: 'input', message: 'Error: unknown subckt: x1 out 0 nosuch' });
    const b = classifyRun({ lines: native.noModel, completed: false, exitCode: 1 });
    expect(b.failure?.kind).toBe('input');
    expect(b.failure?.message).toContain('Error on line 4 or its substitute: d1 out 0 nomodel');
    expect(b.failure?.message).toContain('could not find a valid modelname');
    expect(classifyRun({ lines: native.missingInclude, completed: false, exitCode: 1 }).failure?.kind).toBe('input');
    expect(classifyRun({ lines: wasm.unknownDevice, completed: false }).failure?.kind).toBe('input');
  });

  it('reports a missing include as input even when the wasm engine calls it fatal', () => {
    const c = classifyRun({ lines: wasm.fatalInclude, completed: false });
    expect(c.failure?.kind).toBe('input');
    expect(c.diagnostics.some((d) => /fatal error in ngspice/.test(d.text) && d.level === 'error')).toBe(true);
  });

  it('maps a fatal error without a known cause to an engine failure', () => {
    const c = classifyRun({ lines: ['ERROR: fatal error in ngspice, exit(1)'], completed: false });
    expect(c.failure).toEqual({ kind: 'engine', message: 'ERROR: fatal error in ngspice, exit(1)' });
  });

  it('maps Timestep too small to convergence with the time it names', () => {
    const c = classifyRun({ lines: native.timestep, completed: false, exitCode: 1 });
    expect(c.failure).toEqual({
      kind: 'convergence',
      message: 'doAnalyses: TRAN: Timestep too small; time = 1e-06, timestep = 1.25e-21: trouble with swm-instance s1',
      atTime: 1e-6,
    });
    const op = classifyRun({ lines: native.opFailed, completed: false, exitCode: 1 });
    expect(op.failure).toMatchObject({ kind: 'convergence', atTime: 0 });
  });

  it('keeps singular-matrix and gmin messages as warnings when the run completed', () => {
    const c = classifyRun({ lines: native.singularRescued, completed: true, exitCode: 0 });
    expect(c.failure).toBeUndefined();
    expect(c.diagnostics).toContainEqual({ level: 'warning', text: 'Warning: singular matrix:  check node l1#branch (x2)' });
    expect(c.diagnostics).toContainEqual({ level: 'note', text: 'Note: One successful gmin step (x2)' });
  });

  it('gives timeout and cancel precedence over the message text', () => {
    expect(classifyRun({ lines: native.timestep, completed: false, timedOut: true, timeoutMs: 500 }).failure).toEqual({
      kind: 'timeout',
      message: 'simulation did not finish within 500 ms',
    });
    expect(classifyRun({ lines: [], completed: false, canceled: true, signal: 'SIGTERM' }).failure?.kind).toBe('aborted');
  });

  it('calls an incomplete run with no recognised message an engine failure naming the exit', () => {
    expect(classifyRun({ lines: [], completed: false, signal: 'SIGKILL' }).failure).toEqual({ kind: 'engine', message: 'ngspice killed by SIGKILL' });
    expect(classifyRun({ lines: ['Error: something new'], completed: false, exitCode: 2 }).failure).toEqual({
      kind: 'engine',
      message: 'ngspice exited with code 2: Error: something new',
    });
  });
});

describe('message cleaning', () => {
  it('drops progress output and strips progress prefixes', () => {
    expect(cleanLines(native.opFailed.slice(0, 5))).toEqual([
      'Note: Starting dynamic gmin stepping',
      'Warning: Further gmin increment',
      'Warning: Dynamic gmin stepping failed',
      'Note: One successful source step',
      'Warning: source stepping failed',
    ]);
    expect(cleanLines(['Reference value :  1.00000e-03\rReference value :  2.00000e-03\r'])).toEqual([]);
  });

  it('joins continuation lines and caps the list', () => {
    const d = parseDiagnostics(native.noModel);
    expect(d[1]).toEqual({ level: 'error', text: 'Error on line 4 or its substitute:\nd1 out 0 nomodel' });
    const many = Array.from({ length: 50 }, (_, i) => `Warning: w${i}`);
    const capped = parseDiagnostics(many, 10);
    expect(capped).toHaveLength(11);
    expect(capped[10]).toEqual({ level: 'note', text: '40 more diagnostic lines omitted' });
  });

  it('finds the abort time in the wasm form of the message', () => {
    const lines = ['doAnalyses: TRAN:  Timestep too small; time = 1.2551e-10, timestep = 9.65797e-21: trouble with node "dr#internal"'];
    expect(findTimestepFailure(lines)?.atTime).toBe(1.2551e-10);
  });
});
