import { mkdtempSync, readFileSync, rmSync, writeFileSync, mkdirSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, relative } from 'node:path';
import { execFileSync } from 'node:child_process';
import { afterAll, describe, expect, it } from 'vitest';
import { DesignError, loadDesign, loadDesignOrThrow } from './load.js';
import { formatProblem } from './problem.js';

const demoPath = new URL('../../examples/demo.yaml', import.meta.url).pathname;
const demo = readFileSync(demoPath, 'utf8');
const dir = mkdtempSync(join(tmpdir(), 'tankcheck-load-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

const DIODE = '* invented parameters\n.model DFAST D(IS=1e-12 N=1 RS=0.01 CJO=50p)\n';
const withDevices = (diodeFile: string, name = 'DFAST'): string =>
  `${demo}devices:\n  diodeModel: {file: ${diodeFile}, name: ${name}}\n`;

function write(name: string, content: string | Uint8Array): string {
  const path = join(dir, name);
  writeFileSync(path, content);
  return path;
}

describe('loadDesign', () => {
  it('loads the demo file', async () => {
    const r = await loadDesign(demoPath);
    expect(r.ok && r.design.tank.lr).toBe(60e-6);
    expect(r.ok && r.design.file).toBe(demoPath);
  });
  it('reads model files relative to the design file and attaches the filtered text', async () => {
    mkdirSync(join(dir, 'models'), { recursive: true });
    write('models/d.lib', DIODE.replace(/\n/g, '\r\n'));
    const r = await loadDesign(write('with-model.yaml', withDevices('models/d.lib')));
    if (!r.ok) throw new Error(r.problems.map((p) => formatProblem(p, 'x')).join('\n'));
    expect(r.design.devices.diodeModel).toEqual({ file: 'models/d.lib', name: 'DFAST', text: DIODE });
  });
  it('reports model-file problems against the model file and its lines', async () => {
    write('evil.lib', `${DIODE}.control\nshell rm -rf ~\n.endc\n`);
    const r = await loadDesign(write('evil.yaml', withDevices('evil.lib')));
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.problems.map((p) => formatProblem(p, 'evil.yaml').replace(dir, '<dir>'))).toEqual([
        '<dir>/evil.lib:3:1: devices.diodeModel.file: ".control" is not allowed in a model file: a .control block runs simulator commands',
        '<dir>/evil.lib:4:1: devices.diodeModel.file: "shell" is not allowed in a model file: shell commands are never allowed',
        '<dir>/evil.lib:5:1: devices.diodeModel.file: ".endc" is not allowed in a model file: a .control block runs simulator commands',
      ]);
    }
  });
  it('reports a model name the file does not define, and a missing model file', async () => {
    write('d2.lib', DIODE);
    const r = await loadDesign(write('wrong-name.yaml', withDevices('d2.lib', 'DSLOW')));
    expect(!r.ok && r.problems.map((p) => formatProblem(p, 'w.yaml').replace(dir, '<dir>'))).toEqual([
      '<dir>/d2.lib: devices.diodeModel.name: "DSLOW" is not defined by a .model or .subckt line in "d2.lib" (found: DFAST)',
    ]);
    const m = await loadDesign(write('missing-model.yaml', withDevices('nope.lib')));
    expect(!m.ok && m.problems.map((p) => formatProblem(p, 'm.yaml').replace(dir, '<dir>'))).toEqual([
      // the design file's line that names the model file (withDevices appends it as the last line)
      `m.yaml:${demo.split('\n').length + 1}:22: devices.diodeModel.file: model file "nope.lib" (looked for <dir>/nope.lib): the file does not exist`,
    ]);
  });
  it('refuses a model path that is not a regular file (FIFO, device, directory) at once, without blocking on it', async () => {
    const fifo = join(dir, 'models.fifo');
    execFileSync('mkfifo', [fifo]);
    for (const target of [fifo, '/dev/zero', dir]) {
      const r = await loadDesign(write('special.yaml', withDevices(target)));
      expect(!r.ok && r.problems.map((p) => p.message)).toEqual([`model file "${target}": is not a regular file (a device, pipe or socket cannot be read as a design or model file)`]);
    }
  });
  it('refuses non-UTF-8 bytes with their line and column', async () => {
    // "µ" saved as Latin-1 is the single byte 0xB5, which is not valid UTF-8
    const path = write('latin1.yaml', Buffer.from(demo.replace('  lr: 60 uH\n', '  lr: 60 \u00b5H\n'), 'latin1'));
    const r = await loadDesign(path);
    expect(!r.ok && r.problems.map((p) => formatProblem(p, 'latin1.yaml'))).toEqual([
      'latin1.yaml:9:10: byte 0xB5 is not valid UTF-8; save the design file as UTF-8',
    ]);
  });
  it('refuses files over 1 MB, directories, FIFOs, devices and missing files', async () => {
    const big = await loadDesign(write('big.yaml', `${demo}${'#'.repeat(1_000_001)}\n`));
    expect(!big.ok && big.problems[0].code).toBe('too-large');
    const d = await loadDesign(dir);
    expect(!d.ok && d.problems[0].message).toBe('this is a directory, not a file');
    // a FIFO (or device) as the design file is refused at once instead of waiting for a writer forever
    const fifo = join(dir, 'design.fifo');
    execFileSync('mkfifo', [fifo]);
    for (const special of [fifo, '/dev/zero']) {
      const f = await loadDesign(special);
      expect(!f.ok && f.problems[0]).toMatchObject({ code: 'io', message: 'is not a regular file (a device, pipe or socket cannot be read as a design or model file)' });
    }
    const none = await loadDesign(join(dir, 'none.yaml'));
    expect(!none.ok && none.problems[0]).toMatchObject({ code: 'io', message: 'the file does not exist' });
  });
});

describe('loadDesignOrThrow', () => {
  it('returns the design, or throws a DesignError listing every problem', async () => {
    expect((await loadDesignOrThrow(demoPath)).design.name).toBe('kiosk-aux-240w');
    const path = write('two-errors.yaml', demo.replace('lr: 60 uH', 'lr: 60 uF').replace('esr: 20 mohm', 'esr: -1'));
    const err = await loadDesignOrThrow(path).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(DesignError);
    expect((err as DesignError).problems.map((p) => p.path)).toEqual(['tank.lr', 'output.esr']);
    expect((err as DesignError).message.split('\n')).toHaveLength(2);
    expect((err as DesignError).message).toMatch(/^.*two-errors\.yaml:9:7: tank\.lr: /);
  });
});

describe('model file paths in problems', () => {
  it('are shown relative to the design path as given (here relative to the working directory)', async () => {
    write('rel.lib', '.control\n');
    const rel = relative(process.cwd(), write('rel.yaml', withDevices('rel.lib')));
    const r = await loadDesign(rel);
    expect(!r.ok && r.problems[0].file).toBe(relative(process.cwd(), join(dir, 'rel.lib')));
    expect(!r.ok && formatProblem(r.problems[0], rel)).toMatch(/^\.\..*rel\.lib:1:1: devices\.diodeModel\.file: "\.control" is not allowed/);
  });
});
