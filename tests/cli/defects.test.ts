// Defects found by using the command line as people do: bad results and baseline files, --only
// matching nothing, output paths that cannot be written, special files as input. Each must end in a
// clear message and exit 2 before any simulation, never in exit 70 with a stack trace.
//
// Unwritable places: the tests run as root, which ignores permission bits, so a read-only folder is
// made with /proc (no one, root included, can create a file there) or a path that runs through a
// regular file.
import { execFileSync } from 'node:child_process';
import { createRequire } from 'node:module';
import { existsSync, mkdirSync, mkdtempSync, readFileSync, realpathSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { runCli } from '../support/cli.js';
import { DEMO_FILE } from '../support/demo.js';

const dir = mkdtempSync(join(tmpdir(), 'tankcheck-defects-'));
const results = join(dir, 'fha.json');
const file = join(dir, 'plain.txt');
let good: { [k: string]: any }; // eslint-disable-line @typescript-eslint/no-explicit-any

beforeAll(async () => {
  expect((await runCli(['fha', DEMO_FILE, '-o', results, '--quiet'])).code).toBe(0);
  good = JSON.parse(readFileSync(results, 'utf8'));
  writeFileSync(file, 'not a folder\n');
});
afterAll(() => execFileSync('rm', ['-rf', dir]));

/** A results file edited by `f`, written to `name`. */
function edited(name: string, f: (r: typeof good) => void): string {
  const copy = structuredClone(good);
  f(copy);
  const p = join(dir, name);
  writeFileSync(p, JSON.stringify(copy));
  return p;
}

describe('report and --baseline read results through the checking reader', () => {
  it('report: truncated, corners:[null], no corners, fha:null -> exit 2 naming file and field path; nothing written', async () => {
    const truncated = join(dir, 'truncated.json');
    writeFileSync(truncated, readFileSync(results, 'utf8').slice(0, 500));
    const cases: [string, RegExp][] = [
      [truncated, /truncated\.json:\d+:\d+: not valid JSON: the file ends early/],
      [edited('nulls.json', (r) => { r.corners = [null]; }), /nulls\.json: corners\[0\]: expected an object, got null/],
      [edited('none.json', (r) => { delete r.corners; }), /none\.json: corners: missing/],
      [edited('fhanull.json', (r) => { r.corners[1].fha = null; }), /fhanull\.json: corners\[1\]\.fha: expected an object, got null/],
    ];
    for (const [bad, re] of cases) {
      const out = join(dir, 'r.html');
      const r = await runCli(['report', bad, '-o', out]);
      expect(r.code, r.stderr).toBe(2);
      expect(r.stderr).toMatch(re);
      expect(r.stderr).not.toMatch(/internal error|at .*\.ts:\d+/);
      expect(existsSync(out)).toBe(false);
    }
  });

  it('--baseline with corners:[null] is refused before the engine is even started', async () => {
    const bad = edited('base-null.json', (r) => { r.corners = [null]; });
    // a missing engine would be exit 4: exit 2 shows the baseline was checked first
    const r = await runCli(['run', DEMO_FILE, '--engine', 'ngspice', '--ngspice-path', '/nonexistent/ngspice', '-o', join(dir, 'o1'), '--baseline', bad]);
    expect(r.code, r.stderr).toBe(2);
    expect(r.stderr).toMatch(/base-null\.json: corners\[0\]: expected an object, got null/);
    expect(r.stderr).toMatch(/--baseline .*base-null\.json: cannot be used/);
    expect(existsSync(join(dir, 'o1'))).toBe(false);
  });

  it('report --design of another design is refused; a waveforms file that is there must be sound', async () => {
    const other = join(dir, 'other.yaml');
    writeFileSync(other, readFileSync(DEMO_FILE, 'utf8').replace(/^name: .*$/m, 'name: another-design'));
    const r = await runCli(['report', results, '-o', join(dir, 'x.html'), '--design', other]);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/--design .*other\.yaml is design "another-design", but .*fha\.json is from design "kiosk-aux-240w"/);
    const w = join(dir, 'w.json');
    writeFileSync(w, '{"schema":"tankcheck/waveforms@1","corners":[{"id":"a"}]}');
    const rw = await runCli(['report', results, '-o', join(dir, 'x.html'), '--waveforms', w]);
    expect(rw.code).toBe(2);
    expect(rw.stderr).toMatch(/w\.json: corners\[0\]\.fs: missing/);
  });

  it('a FIFO as the design file (fha, report --design) is refused at once instead of blocking', async () => {
    const fifo = join(dir, 'design.fifo');
    execFileSync('mkfifo', [fifo]);
    const f = await runCli(['fha', fifo]);
    expect(f.code).toBe(2);
    expect(f.stderr).toMatch(/design\.fifo: is not a regular file/);
    const r = await runCli(['report', results, '-o', join(dir, 'y.html'), '--design', fifo]);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/design\.fifo: is not a regular file/);
  });
});

describe('--only', () => {
  it('matching nothing is exit 2 "no corner matches" for run, decks and fha, before anything starts', async () => {
    for (const args of [['run', DEMO_FILE, '--engine', 'ngspice', '-o', join(dir, 'o2')], ['decks', DEMO_FILE, '-o', join(dir, 'd2')], ['fha', DEMO_FILE, '-o', join(dir, 'f2.json')]]) {
      const r = await runCli([...args, '--only', 'zzz*']);
      expect(r.code, args[0]).toBe(2);
      expect(r.stderr).toMatch(/--only "zzz\*": no corner matches/);
    }
    expect(['o2', 'd2', 'f2.json'].some((f) => existsSync(join(dir, f)))).toBe(false);
  });

  it('a pattern with many wildcards answers at once; a plain pattern matches a part of the id', async () => {
    const t0 = performance.now();
    const r = await runCli(['fha', DEMO_FILE, '--only', `${'*0'.repeat(20)}x`]);
    expect(r.code).toBe(2); // nothing ends in x
    expect(performance.now() - t0).toBeLessThan(5000); // a sanity bound: the regular expression took over 20 s
    const plain = await runCli(['fha', DEMO_FILE, '--only', '100pct']);
    expect(plain.stdout.split('\n').filter((l) => /^v\d/.test(l))).toHaveLength(3);
  });
});

describe('output paths are checked before any work', () => {
  it('a file where a folder goes, a folder where a file goes, a path through a file, /proc: exit 2, clear message', async () => {
    const folder = join(dir, 'a-folder');
    mkdirSync(folder);
    const cases: [string[], RegExp][] = [
      [['run', DEMO_FILE, '--engine', 'ngspice', '--out', file], /--out .*plain\.txt: is a file; --out takes a folder/],
      [['run', DEMO_FILE, '--engine', 'ngspice', '--out', '/proc/tankcheck-out'], /--out \/proc\/tankcheck-out: cannot write in \/proc/],
      [['run', DEMO_FILE, '--engine', 'ngspice', '--out', join(file, 'sub')], /plain\.txt is a file, not a folder/],
      [['run', DEMO_FILE, '--engine', 'ngspice', '-o', join(dir, 'o3'), '--cache-dir', file], /--cache-dir .*plain\.txt: is a file, not a folder/],
      [['run', DEMO_FILE, '--engine', 'ngspice', '-o', join(dir, 'o3'), '--html', folder], /--html .*a-folder: is a folder; --html takes a file/],
      [['decks', DEMO_FILE, '-o', file], /--out .*plain\.txt: is a file; --out takes a folder/],
      [['fha', DEMO_FILE, '--json', folder], /--json .*a-folder: is a folder; --json takes a file/],
      [['fha', DEMO_FILE, '--csv', '/proc/x.csv'], /--csv \/proc\/x\.csv: cannot write in \/proc/],
      [['report', results, '-o', folder], /--out .*a-folder: is a folder; --out takes a file/],
    ];
    for (const [args, re] of cases) {
      const r = await runCli(args);
      expect(r.code, `${args.join(' ')}\n${r.stderr}`).toBe(2);
      expect(r.stderr).toMatch(re);
      expect(r.stderr).not.toMatch(/internal error|simulating/);
    }
    expect(existsSync(join(dir, 'o3'))).toBe(false);
  });

  it('a read-only working directory: the default output folder is refused before the engine starts', async () => {
    const here = process.cwd();
    process.chdir('/proc');
    try {
      const r = await runCli(['run', DEMO_FILE, '--engine', 'ngspice']);
      expect(r.code).toBe(2);
      expect(r.stderr).toMatch(/--out tankcheck-out: cannot write in \/proc/);
      expect(r.stderr).not.toMatch(/starting the/);
    } finally {
      process.chdir(here);
    }
  });
});

describe('init', () => {
  it('writes the editor schema line, refuses to overwrite (exclusive create), -o names the file', async () => {
    const target = join(dir, 'sub', 'new.yaml');
    mkdirSync(join(dir, 'sub'));
    expect((await runCli(['init', '-o', target])).code).toBe(0);
    const text = readFileSync(target, 'utf8');
    const m = /^# yaml-language-server: \$schema=(\S+)\n/.exec(text);
    expect(m).not.toBeNull();
    // the line points at the schema file of this installation, relative to the file written
    const schema = JSON.parse(readFileSync(join(dir, 'sub', m![1]!), 'utf8'));
    expect(schema.$id).toBe('urn:tankcheck:schema:design:1');
    // and the same file is the package subpath tankcheck/schema/design.schema.json
    expect(createRequire(import.meta.url).resolve('tankcheck/schema/design.schema.json')).toBe(realpathSync(join(dir, 'sub', m![1]!)));
    writeFileSync(target, 'mine\n');
    const again = await runCli(['init', target]);
    expect(again.code).toBe(2);
    expect(again.stderr).toMatch(/exists; use --force/);
    expect(readFileSync(target, 'utf8')).toBe('mine\n');
    expect((await runCli(['init', target, '--force', '--quiet'])).stdout).toBe('');
    expect(readFileSync(target, 'utf8')).toBe(text);
  });
});
