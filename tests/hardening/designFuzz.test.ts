// Property-based hardening of the design-file boundary: thousands of generated malformed files go
// through `tankcheck fha` and `tankcheck run` in-process. Contract (README "Exit codes", STYLE habit 3):
// exit 2, every problem with its key path and line, nothing written, bounded time, no crash.
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import fc from 'fast-check';
import { afterAll, afterEach, describe, expect, it } from 'vitest';
import { applyMutations, mutations } from './support/badValues.js';
import { baseTree, emit } from './support/designText.js';
import { cleanTargets, escapeRe, expectRefused, positioned, targetsIn } from './support/cliCase.js';

const dir = mkdtempSync(join(tmpdir(), 'tankcheck-fuzz-'));
const file = join(dir, 'design.yaml');
const t = targetsIn(dir);
const valid = emit(baseTree()).text;
afterEach(() => cleanTargets(t));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

/**
 * Fixed seeds keep the default suite reproducible; the heavy suite (tests/heavy) multiplies the case
 * counts by TANKCHECK_FUZZ_SCALE and draws fresh seeds. A failure prints its seed and the shrunk case.
 */
const SCALE = Number(process.env['TANKCHECK_FUZZ_SCALE'] ?? '1');
const n = (count: number): number => count * SCALE;
const params = (numRuns: number, seed: number) => ({ numRuns: n(numRuns), seed: SCALE > 1 ? undefined : seed, endOnFailure: true });

describe('structured mutations of a valid design', () => {
  it('the unmutated base design is accepted (exit 0), so every refusal below is caused by its mutation', async () => {
    const { runCli } = await import('../support/cli.js');
    const { writeFileSync } = await import('node:fs');
    writeFileSync(file, valid);
    expect((await runCli(['fha', file])).code).toBe(0);
  });

  it(`${n(1000)} generated files (1-4 wrong values, types, units, NaN/Infinity, huge/tiny numbers, missing, unknown and duplicated keys): exit 2, each problem at its key path and line`, async () => {
    let cases = 0;
    await fc.assert(fc.asyncProperty(mutations, async (ms) => {
      const { text, expected } = applyMutations(ms);
      const { stderr } = await expectRefused(file, text, t, { alsoRun: cases++ % 4 === 0 });
      for (const e of expected) {
        const re = new RegExp(`^${escapeRe(file)}:${e.line}:\\d+: ${escapeRe(e.path)}(\\[\\d+\\])?: `, 'm');
        expect(stderr, `${e.label}\n${text}`).toMatch(re);
      }
    }), params(1000, 20240611));
    expect(cases).toBe(n(1000));
  });
});

/** The valid design with `bytes` spliced in at a line start, and the 1-based line where they land. */
function splice(bytes: number[], lineIndex: number): { data: Buffer; line: number } {
  const lines = valid.split('\n');
  const at = Math.min(lineIndex, lines.length - 2);
  const before = Buffer.from(lines.slice(0, at).map((l) => `${l}\n`).join(''), 'utf8');
  const rest = Buffer.from(lines.slice(at).join('\n'), 'utf8');
  return { data: Buffer.concat([before, Buffer.from('name2: '), Buffer.from(bytes), rest]), line: at + 1 };
}

describe('byte- and text-level attacks', () => {
  it(`${n(300)} generated files with invalid UTF-8 (lone continuation bytes, overlongs, surrogates, truncated sequences): exit 2 at the exact line and column`, async () => {
    const invalid: fc.Arbitrary<number[]> = fc.oneof(
      fc.integer({ min: 0x80, max: 0xbf }).map((b) => [b]),
      fc.constantFrom<number[][]>([0xc0, 0xaf], [0xc1, 0xbf], [0xe0, 0x80, 0xaf], [0xed, 0xa0, 0x80], [0xf4, 0x90, 0x80, 0x80], [0xf8, 0x88, 0x80, 0x80, 0x80], [0xfe], [0xff], [0xe2, 0x82, 0x41], [0xf0, 0x9f, 0x92]),
    );
    await fc.assert(fc.asyncProperty(invalid, fc.nat({ max: 40 }), async (bytes, lineIndex) => {
      const { data, line } = splice(bytes, lineIndex);
      const { stderr } = await expectRefused(file, data, t, { alsoRun: false });
      const hex = bytes[0].toString(16).toUpperCase();
      // column 8: after "name2: " (1-based, in bytes)
      expect(stderr).toMatch(new RegExp(`^${escapeRe(file)}:${line}:8: byte 0x${hex} is not valid UTF-8`, 'm'));
    }), params(300, 7));
  });

  it(`${n(150)} generated deep nestings (flow [[..]], {a: {..}}, block "- - -", indentation) up to 300000 levels: refused quickly with a line`, async () => {
    const nesting = fc.oneof(
      fc.integer({ min: 1, max: 300_000 }).map((d) => `name: ${'['.repeat(d)}${']'.repeat(d)}\n`),
      fc.integer({ min: 1, max: 100_000 }).map((d) => `${valid}extra: ${'{a: '.repeat(d)}1${'}'.repeat(d)}\n`),
      fc.integer({ min: 1, max: 50_000 }).map((d) => `tank: ${'- '.repeat(d)}x\n`),
      fc.integer({ min: 1, max: 400 }).map((d) => Array.from({ length: d }, (_, i) => `${' '.repeat(i)}a:`).join('\n') + ' 1\n'),
    );
    await fc.assert(fc.asyncProperty(nesting, async (text) => {
      const { stderr } = await expectRefused(file, text, t, { alsoRun: false });
      expect(positioned(stderr, file).length).toBeGreaterThan(0);
    }), params(150, 11));
  });

  it(`${n(100)} generated alias bombs ("billion laughs", width 2-12, depth 2-12, also self-reference): refused with the alias line`, async () => {
    const bomb = fc.tuple(fc.integer({ min: 2, max: 12 }), fc.integer({ min: 2, max: 12 }), fc.boolean()).map(([w, d, inName]) => {
      const lines = ['l0: &l0 "lol"'];
      for (let i = 1; i <= d; i++) lines.push(`l${i}: &l${i} [${Array.from({ length: w }, () => `*l${i - 1}`).join(', ')}]`);
      return inName ? `${valid.replace(/^name: .*$/m, `name: *l${d}`)}x:\n${lines.map((l) => `  ${l}`).join('\n')}\n` : `${lines.join('\n')}\n${valid}`;
    });
    const selfRef = fc.constantFrom('a: &a [*a]\n', 'a: &a {b: *a}\n', `${valid}x: &x\n  - *x\n`);
    await fc.assert(fc.asyncProperty(fc.oneof({ weight: 9, arbitrary: bomb }, { weight: 1, arbitrary: selfRef }), async (text) => {
      const { stderr } = await expectRefused(file, text, t, { alsoRun: false });
      expect(positioned(stderr, file).length).toBeGreaterThan(0);
    }), params(100, 13));
  });

  it(`${n(250)} generated random byte strings and random Unicode texts: exit 2 with a positioned problem`, async () => {
    const junk = fc.oneof(
      fc.uint8Array({ maxLength: 4000 }).map((b) => Buffer.from(b)),
      fc.string({ unit: 'grapheme', maxLength: 2000 }),
      fc.string({ unit: fc.constantFrom(':', '-', '[', ']', '{', '}', '&', '*', '!', '|', '>', "'", '"', '%', '@', '`', '#', ',', '?', ' ', '\n', '\t', 'a', '1'), maxLength: 400 }),
    );
    await fc.assert(fc.asyncProperty(junk, async (content) => {
      const { stderr } = await expectRefused(file, content, t, { alsoRun: false });
      expect(positioned(stderr, file).length).toBeGreaterThan(0);
    }), params(250, 17));
  });

  it('a file over 1 MB, a 900 kB key and a 900 kB name are refused without echoing them', async () => {
    const big = await expectRefused(file, `${valid}x: "${'y'.repeat(1_100_000)}"\n`, t);
    expect(big.stderr).toMatch(/larger than 1000000 bytes/);
    const lines = valid.split('\n').length;
    const longKey = await expectRefused(file, `${valid}${'k'.repeat(900_000)}: 1\n`, t);
    expect(longKey.stderr).toMatch(new RegExp(`^${escapeRe(file)}:${lines}:1: `, 'm'));
    const longName = await expectRefused(file, valid.replace(/^name: .*$/m, `name: "${'n'.repeat(900_000)}"`), t);
    expect(longName.stderr).toMatch(new RegExp(`^${escapeRe(file)}:1:7: name: expected a name .*, got "n{40}\\.\\.\\."`, 'm'));
  });
});

describe('random character edits of a valid design (no-crash fuzz)', () => {
  it(`${n(400)} generated edits (insert/delete/replace YAML-significant characters): exit 0 or 2, never a crash, nothing written when refused`, async () => {
    const { runCli } = await import('../support/cli.js');
    const { writeFileSync, existsSync, rmSync } = await import('node:fs');
    const edit = fc.tuple(fc.nat({ max: valid.length - 1 }), fc.nat({ max: 3 }), fc.constantFrom(':', '-', '[', '{', '&a ', '*a', '!!int ', '|', '>', '"', "'", '#', '\t', '\n', '  ', '%', '?', 'µ', '\u0000', ''));
    let refused = 0;
    await fc.assert(fc.asyncProperty(fc.array(edit, { minLength: 1, maxLength: 5 }), async (edits) => {
      let text = valid;
      for (const [pos, del, ins] of edits) text = text.slice(0, pos) + ins + text.slice(pos + del);
      writeFileSync(file, text);
      const r = await runCli(['fha', file, '--json', t.json]);
      expect([0, 2], r.stderr).toContain(r.code);
      if (r.code === 2) {
        refused++;
        expect(existsSync(t.json)).toBe(false);
        expect(r.stderr).toMatch(/nothing was written/);
      } else {
        expect(r.stdout).not.toMatch(/NaN|undefined|Infinity/);
        rmSync(t.json, { force: true });
      }
    }), params(400, 19));
    expect(refused).toBeGreaterThan(n(200));
  });
});
