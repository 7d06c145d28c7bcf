// Proof with the real system ngspice that a crafted design cannot create a file: every payload of
// support/payload.ts goes through `tankcheck run --engine ngspice` and `tankcheck decks`, and every deck
// that gets written is also run by hand (`ngspice -b`), as a user would. A positive control shows that
// the same payload does create the marker when it reaches a deck, so the absence is meaningful.
import { existsSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { execa } from 'execa';
import { afterAll, describe, expect, it } from 'vitest';
import { runCli } from '../support/cli.js';
import { baseTree, emit, setAt } from './support/designText.js';
import { GOOD_DIODE, markerPath, modelPayloads, namePayloads } from './support/payload.js';

const dir = mkdtempSync(join(tmpdir(), 'tankcheck-inject-ng-'));
const marker = markerPath();
const relMarker = `tankcheck-pwned-rel-${marker.slice(-16)}`;

afterAll(() => rmSync(dir, { recursive: true, force: true }));

function design(file: string, name: string, model?: string): string {
  const tree = baseTree();
  setAt(tree, 'name', name);
  setAt(tree, 'operating.load', '[100%]');
  let text = emit(tree).text;
  if (model !== undefined) {
    writeFileSync(`${file}.lib`, model);
    text += `devices:\n  diodeModel:\n    file: ${JSON.stringify(`${file}.lib`)}\n    name: dgood\n`;
  }
  writeFileSync(file, text);
  return file;
}

/** Runs every .cir in a folder with plain `ngspice -b` there (cwd = the folder). */
async function handRunAll(folder: string): Promise<number> {
  if (!existsSync(folder)) return 0;
  const decks = readdirSync(folder).filter((f) => f.endsWith('.cir'));
  for (const d of decks) await execa('ngspice', ['-b', d], { cwd: folder, reject: false, timeout: 60_000, stdin: 'ignore' });
  return decks.length;
}

describe('positive control: the payload works when it reaches a deck', () => {
  it('a tankcheck deck with an appended .control block creates the marker under ngspice -b', async () => {
    const decks = join(dir, 'control-decks');
    expect((await runCli(['decks', design(join(dir, 'control.yaml'), 'control'), '-o', decks])).code).toBe(0);
    const deckFile = join(decks, readdirSync(decks).find((f) => f.endsWith('.cir'))!);
    const probe = `${marker}-control`;
    writeFileSync(deckFile, readFileSync(deckFile, 'latin1').replace(/^\.end\s*$/m, `.control\nshell touch ${probe}\n.endc\n.end`));
    await execa('ngspice', ['-b', deckFile], { cwd: decks, reject: false, timeout: 60_000, stdin: 'ignore' });
    expect(existsSync(probe)).toBe(true);
    rmSync(probe);
  });
});

describe('crafted designs cannot create a file through system ngspice', () => {
  const cases: [string, string, string | undefined][] = [
    ...Object.entries(namePayloads(marker)).map(([label, name]): [string, string, string | undefined] => [`name: ${label}`, name, undefined]),
    ['name: legal ".control"', '".control"', undefined],
    ['name: legal "shell touch <relative marker>"', JSON.stringify(`shell touch ${relMarker}`), undefined],
    ...Object.entries(modelPayloads(marker, join(dir, 'evil-include.lib'))).map(([label, model]): [string, string, string | undefined] => [`model: ${label}`, 'model-payload', model]),
  ];
  writeFileSync(join(dir, 'evil-include.lib'), `.control\nshell touch ${marker}\n.endc\n`);

  it(`${cases.length} payloads through run --engine ngspice, decks, and hand runs of every written deck: no marker file appears`, async () => {
    const outcomes: string[] = [];
    for (const [i, [label, name, model]] of cases.entries()) {
      const file = design(join(dir, `case-${i}.yaml`), name, model);
      const run = await runCli(['run', file, '--engine', 'ngspice', '--out', join(dir, `out-${i}`), '--no-cache']);
      const decks = join(dir, `decks-${i}`);
      const dk = await runCli(['decks', file, '-o', decks]);
      const handRuns = await handRunAll(decks);
      expect(run.code, `${label}: ${run.stderr}`).not.toBe(70);
      outcomes.push(`${label}: run ${run.code}, decks ${dk.code}, hand runs ${handRuns}`);
      expect(existsSync(marker), label).toBe(false);
      expect(existsSync(join(decks, relMarker)), label).toBe(false);
    }
    // the legal names do run (exit 1: FHA vs simulation diverge on this design; 0 would be fine too)
    expect(outcomes.filter((o) => /run [01], decks 0, hand runs 1/.test(o))).toHaveLength(2);
    // everything else is refused up front
    expect(outcomes.filter((o) => /run 2, decks 2, hand runs 0/.test(o))).toHaveLength(cases.length - 2);
    expect(existsSync(marker)).toBe(false);
  });
});
