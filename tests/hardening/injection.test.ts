// Injection through the design file: names, model files and model paths must never put a dot command,
// a foreign file or a path outside the output folder into what tankcheck writes. The threat model:
// a .control block in a deck runs `shell` under native ngspice.
import { existsSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { execFileSync } from 'node:child_process';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import fc from 'fast-check';
import { afterAll, describe, expect, it } from 'vitest';
import { runCli } from '../support/cli.js';
import { makeDesign } from '../support/design.js';
import { expandCorners } from '../../src/corners/expand.js';
import { insideDir } from '../../src/run/files.js';
import { safeName } from '../../src/netlist/render.js';
import { baseTree, emit, setAt } from './support/designText.js';
import { GOOD_DIODE, markerPath, modelPayloads, namePayloads } from './support/payload.js';

const dir = mkdtempSync(join(tmpdir(), 'tankcheck-inject-'));
const marker = markerPath();
const includeTarget = join(dir, 'evil-include.lib');
writeFileSync(includeTarget, `.control\nshell touch ${marker}\n.endc\n`);

afterAll(() => rmSync(dir, { recursive: true, force: true }));

function design(name: string, edits: Record<string, string>, devices?: { file: string; name: string }): string {
  const tree = baseTree();
  for (const [k, v] of Object.entries(edits)) setAt(tree, k, v);
  let text = emit(tree).text;
  if (devices) text += `devices:\n  diodeModel:\n    file: ${JSON.stringify(devices.file)}\n    name: ${devices.name}\n`;
  const file = join(dir, name);
  writeFileSync(file, text);
  return file;
}

/** fha, decks and run all refuse the file (exit 2) and create none of their outputs. */
async function expectAllRefuse(file: string, tag: string): Promise<string> {
  const out = join(dir, `out-${tag}`);
  const decks = join(dir, `decks-${tag}`);
  const fha = await runCli(['fha', file, '--json', join(out, 'x.json')]);
  const dk = await runCli(['decks', file, '-o', decks]);
  const run = await runCli(['run', file, '--engine', 'ngspice', '--out', out, '--cache-dir', join(out, 'cache')]);
  for (const r of [fha, dk, run]) expect(r.code, r.stderr).toBe(2);
  expect(existsSync(out) || existsSync(decks)).toBe(false);
  expect(existsSync(marker)).toBe(false);
  return fha.stderr;
}

describe('model files (devices.*.file) pass the line filter or the design is refused', () => {
  for (const [label, text] of Object.entries(modelPayloads(marker, includeTarget))) {
    it(`refused: ${label}`, async () => {
      const lib = join(dir, `m-${label.replace(/\W+/g, '_')}.lib`);
      writeFileSync(lib, text);
      const stderr = await expectAllRefuse(design(`m-${label.replace(/\W+/g, '_')}.yaml`, {}, { file: lib, name: 'dgood' }), label.replace(/\W+/g, '_'));
      // the problem points into the model file with a line, and never echoes the payload
      expect(stderr).toMatch(new RegExp(`^${lib.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}:\\d+:\\d+: devices\\.diodeModel\\.file: `, 'm'));
      expect(stderr).not.toContain(marker);
    });
  }

  it('a clean model file is accepted and inlined; the deck stays 7-bit ASCII with no dot command from the user but .model', async () => {
    const lib = join(dir, 'clean.lib');
    writeFileSync(lib, `* vendor header\n${GOOD_DIODE}\n+ \n`);
    const decks = join(dir, 'decks-clean');
    const r = await runCli(['decks', design('clean.yaml', {}, { file: lib, name: 'dgood' }), '-o', decks]);
    expect(r.code, r.stderr).toBe(0);
    const deck = readFileSync(join(decks, readdirSync(decks).find((f) => f.endsWith('.cir'))!), 'latin1');
    expect(deck).toContain(GOOD_DIODE);
    expect(deck).toMatch(/^[\x00-\x7f]*$/);
    expect(deck).not.toMatch(/^\s*(\.control|\.endc|shell|\.include|\.inc|\.lib)\b/im);
  });
});

describe('model paths: traversal and special files', () => {
  it('../../etc/passwd (relative traversal to a real file) fails the filter: exit 2, no content in messages, nothing written', async () => {
    const rel = `${'../'.repeat(resolve(dir).split('/').length)}etc/passwd`;
    expect(resolve(dir, rel)).toBe('/etc/passwd');
    const stderr = await expectAllRefuse(design('passwd.yaml', {}, { file: rel, name: 'dgood' }), 'passwd');
    expect(stderr).toMatch(/etc\/passwd:1:1: devices\.diodeModel\.file: /);
    const firstLine = readFileSync('/etc/passwd', 'utf8').split('\n')[0];
    expect(stderr).not.toContain(firstLine.split(':')[0] + ':'); // e.g. "root:" never appears
  });

  it('a directory, /dev/zero, /dev/null and a FIFO are refused as not regular files, at the design line, without blocking', async () => {
    const fifo = join(dir, 'pipe.lib');
    execFileSync('mkfifo', [fifo]);
    for (const [tag, file] of [['dir', '/etc'], ['zero', '/dev/zero'], ['null', '/dev/null'], ['fifo', fifo]] as const) {
      const t0 = performance.now();
      const stderr = await expectAllRefuse(design(`special-${tag}.yaml`, {}, { file, name: 'dgood' }), `special-${tag}`);
      expect(performance.now() - t0).toBeLessThan(5000);
      expect(stderr).toMatch(new RegExp(`special-${tag}\\.yaml:\\d+:\\d+: devices\\.diodeModel\\.file: model file ".*": is not a regular file`));
    }
  });

  it('a model in a folder with a non-ASCII name is read; only its ASCII text reaches the deck', async () => {
    mkdirSync(join(dir, 'modèles'), { recursive: true });
    writeFileSync(join(dir, 'modèles', 'd.lib'), `${GOOD_DIODE}\n`);
    const decks = join(dir, 'decks-nonascii');
    const r = await runCli(['decks', design('nonascii-path.yaml', {}, { file: 'modèles/d.lib', name: 'dgood' }), '-o', decks]);
    expect(r.code, r.stderr).toBe(0);
    for (const f of readdirSync(decks)) expect(readFileSync(join(decks, f), 'latin1')).toMatch(/^[\x00-\x7f]*$/);
  });
});

describe('design names and model names', () => {
  for (const [label, value] of Object.entries(namePayloads(marker))) {
    it(`refused name: ${label}`, async () => {
      const file = design(`n-${label.replace(/\W+/g, '_')}.yaml`, { name: value });
      const stderr = await expectAllRefuse(file, `n-${label.replace(/\W+/g, '_')}`);
      expect(stderr).toMatch(new RegExp(`:1:7: name: expected a name of 1 to 80 characters`));
    });
  }

  it('refused model name with a newline and a dot command', async () => {
    const lib = join(dir, 'ok.lib');
    writeFileSync(lib, `${GOOD_DIODE}\n`);
    const stderr = await expectAllRefuse(design('model-name.yaml', {}, { file: lib, name: JSON.stringify('dgood\n.control') }), 'model-name');
    expect(stderr).toMatch(/devices\.diodeModel\.name: expected a model or subcircuit name .* contains a line break/);
  });

  it('names that are legal but look like dot commands or paths (".control", "..", ".end", "shell touch x") give safe decks', async () => {
    for (const [i, name] of ['.control', '..', '.end', 'shell touch pwned'].entries()) {
      const decks = join(dir, `decks-legal-${i}`);
      const r = await runCli(['decks', design(`legal-${i}.yaml`, { name: JSON.stringify(name) }), '-o', decks]);
      expect(r.code, r.stderr).toBe(0);
      const files = readdirSync(decks);
      expect(files.sort()).toEqual(['index.csv', 'v390_100pct_f110k_nom.cir']);
      const deck = readFileSync(join(decks, 'v390_100pct_f110k_nom.cir'), 'latin1');
      expect(deck.split('\n')[0]).toMatch(/^tankcheck [A-Za-z0-9_-][A-Za-z0-9_.-]*$/);
      expect(deck).not.toMatch(/^\s*(\.control|\.endc|shell)/im);
      expect(deck.match(/^\.end\s*$/gm)).toHaveLength(1); // only our own .end, last
      expect(deck.trimEnd().endsWith('.end')).toBe(true);
    }
  });
});

describe('safeName (names in deck comments and titles)', () => {
  it('keeps [A-Za-z0-9_.-], turns the rest and a leading dot into "_", caps at 80 characters', () => {
    expect(safeName('.control')).toBe('_control');
    expect(safeName('..')).toBe('_.');
    expect(safeName('x\n.control\nshell rm -rf /')).toBe('x_.control_shell_rm_-rf_');
    expect(safeName('Ωmega tank')).toBe('_mega_tank');
    expect(safeName('')).toBe('_');
    expect(safeName('a'.repeat(200))).toHaveLength(80);
    fc.assert(fc.property(fc.string({ unit: 'binary', maxLength: 200 }), (s) => {
      expect(safeName(s)).toMatch(/^[A-Za-z0-9_-][A-Za-z0-9_.-]{0,79}$/);
    }), { numRuns: 1000, seed: 31 });
  });
});

describe('output paths', () => {
  it('insideDir refuses names that escape the folder', () => {
    for (const bad of ['../x.cir', '../../etc/cron.d/x', '/etc/passwd', 'a/../../b', '', '.', 'a/..']) {
      expect(() => insideDir(dir, bad), bad).toThrow(/refusing to write outside/);
    }
    expect(insideDir(dir, 'v390_100pct_reg_nom.cir')).toBe(join(dir, 'v390_100pct_reg_nom.cir'));
  });

  it('500 generated designs (extreme values, explicit corners, tolerance sets): every corner id is a plain file name inside the output folder', () => {
    const value = fc.double({ min: -300, max: 300, noNaN: true }).map((e) => 10 ** e).filter((x) => x > 0 && Number.isFinite(x));
    fc.assert(fc.property(fc.array(value, { minLength: 1, maxLength: 3 }), fc.array(value, { minLength: 1, maxLength: 3 }), fc.array(value, { maxLength: 3 }), fc.constantFrom('nominal', 'extremes'), (vins, loads, fss, corners) => {
      const d = makeDesign({
        operating: { vin: vins, load: loads.map((v) => ({ kind: 'ohm', value: v })), ratedPower: 100, frequency: fss.length ? fss : 'regulate',
          corners: vins.map((v, i) => ({ vin: v, load: { kind: 'percent', value: loads[i % loads.length] }, frequency: null })) },
        tolerances: { lr: 0.1, cr: 0.1, lm: 0.1, corners: corners as 'nominal' | 'extremes' },
      });
      const ids = expandCorners(d).map((c) => c.id);
      expect(new Set(ids).size).toBe(ids.length);
      for (const id of ids) {
        expect(id).toMatch(/^[A-Za-z0-9_-][A-Za-z0-9_.-]*$/);
        expect(insideDir(dir, `${id}.cir`)).toBe(join(dir, `${id}.cir`));
      }
    }), { numRuns: 500, seed: 29 });
  });

  it('--only with thousands of wildcards finishes at once; an overlong pattern is a usage error (exit 2)', async () => {
    const file = design('only.yaml', {});
    const t0 = performance.now();
    const r = await runCli(['fha', file, '--only', `${'*'.repeat(150)}x`]);
    expect(performance.now() - t0).toBeLessThan(10_000);
    // no id ends in x: matching nothing is a usage error, not an empty green study
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/no corner matches/);
    const long = await runCli(['fha', file, '--only', '*'.repeat(5000)]);
    expect(long.code).toBe(2);
    expect(long.stderr).toMatch(/--only.*at most 200 characters/);
  });
});
