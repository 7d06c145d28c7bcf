import { Command, CommanderError, InvalidArgumentError } from 'commander';
import { readFile, writeFile, access } from 'node:fs/promises';
import { fileURLToPath } from 'node:url';
import { loadDesign, formatProblem, designJsonSchema, type Design } from '../design/index.js';
import { predictStudy } from '../run/study.js';
import { renderFhaTable } from '../report/table.js';
import { renderResultsJson } from '../report/json.js';
import { renderResultsCsv } from '../report/csv.js';
import { writeFilesAtomic } from '../run/files.js';
import { writeDecks } from './decks.js';
import { runCommand, type RunFlags } from './run.js';
import { reportCommand } from './report.js';
import { EXIT, renderExitTable, UsageError } from './exit.js';
import { TOOL_VERSION } from '../version.js';

const DEMO = fileURLToPath(new URL('../../examples/demo.yaml', import.meta.url));

/** Load and validate a design file; every problem goes to stderr and becomes exit code 2. */
export async function loadOrReport(file: string): Promise<Design> {
  const r = await loadDesign(file);
  if (!r.ok) {
    for (const p of r.problems) process.stderr.write(`${formatProblem(p, file)}\n`);
    process.stderr.write(`${file}: ${r.problems.length} problem(s); nothing was written.\n`);
    throw new ExitSignal(EXIT.invalid);
  }
  for (const w of r.warnings) process.stderr.write(`warning: ${formatProblem(w, file)}\n`);
  return r.design;
}

/** Thrown inside commands to end with a given exit code after output was written. */
export class ExitSignal extends Error {
  constructor(readonly code: number) {
    super(`exit ${code}`);
  }
}

function positiveInt(v: string): number {
  const n = Number(v);
  if (!Number.isInteger(n) || n < 1) throw new InvalidArgumentError('expected a whole number >= 1');
  return n;
}

/** Longest --only pattern accepted: corner ids are far shorter. */
export const MAX_ONLY_LENGTH = 200;

/**
 * Checks a --only pattern. Runs of '*' collapse to one: each '*' becomes '.*' in the matcher, and a
 * few thousand of them in a row make the regular expression backtrack for minutes.
 */
function onlyPattern(v: string): string {
  if (v.length > MAX_ONLY_LENGTH) throw new InvalidArgumentError(`at most ${MAX_ONLY_LENGTH} characters`);
  return v.replace(/\*{2,}/g, '*');
}

function program(): Command {
  const p = new Command('tankcheck')
    .description('LLC resonant converter corners: FHA predictions checked against ngspice simulation')
    .version(TOOL_VERSION, '-V, --version')
    .exitOverride()
    .configureOutput({ writeErr: (s) => process.stderr.write(s) });

  p.command('init').argument('[file]', 'where to write the demo design', 'demo.yaml')
    .option('--force', 'overwrite an existing file')
    .description('write the demo design file (an invented 24 V / 240 W half-bridge supply)')
    .action(async (file: string, o: { force?: boolean }) => {
      if (!o.force && (await access(file).then(() => true, () => false))) throw new UsageError(`${file} exists; use --force to overwrite`);
      await writeFile(file, await readFile(DEMO, 'utf8'));
      process.stdout.write(`wrote ${file}\n`);
    });

  p.command('fha').argument('<design>', 'design file (YAML)')
    .option('--json <file>', 'write results JSON (FHA only)')
    .option('--csv <file>', 'write results CSV (FHA only)')
    .option('--only <pattern>', 'corners whose id matches (* and ? wildcards)', onlyPattern)
    .description('FHA prediction for every corner')
    .action(async (file: string, o: { json?: string; csv?: string; only?: string }) => {
      const design = await loadOrReport(file);
      const results = predictStudy({ ...design, file }, o.only);
      process.stdout.write(renderFhaTable(results));
      const files = [];
      if (o.json) files.push({ path: o.json, text: renderResultsJson(results) });
      if (o.csv) files.push({ path: o.csv, text: renderResultsCsv(results) });
      await writeFilesAtomic(files);
    });

  p.command('decks').argument('<design>', 'design file (YAML)')
    .requiredOption('-o, --out <dir>', 'folder for the decks and index.csv')
    .option('--only <pattern>', 'corners whose id matches', onlyPattern)
    .description('write one SPICE deck per corner (runs by hand with ngspice -b) and an index')
    .action(async (file: string, o: { out: string; only?: string }) => {
      const design = await loadOrReport(file);
      const n = await writeDecks(design, o.out, o.only);
      process.stdout.write(`wrote ${n} decks and index.csv to ${o.out}\n`);
    });

  p.command('run').argument('<design>', 'design file (YAML)')
    .option('--engine <name>', 'wasm (embedded, default) or ngspice (system binary)', 'wasm')
    .option('--ngspice-path <path>', 'ngspice binary for --engine ngspice')
    .option('--jobs <n>', 'corners simulated at once (default: from cores and free memory)', positiveInt)
    .option('--out <dir>', 'folder for results.json, results.csv, junit.xml, waveforms.json', 'tankcheck-out')
    .option('--only <pattern>', 'corners whose id matches', onlyPattern)
    .option('--baseline <results.json>', 'compare with an earlier run and flag regressions')
    .option('--baseline-tolerance <fraction>', 'relative change of a simulated metric that counts as moved', '0.01')
    .option('--html <file>', 'also write the HTML report')
    .option('--no-cache', 'simulate every corner even if a cached result exists')
    .option('--cache-dir <dir>', 'corner cache folder', '.tankcheck-cache')
    .option('--keep-decks', 'keep the simulator work folders (system ngspice)')
    .option('--timeout <seconds>', 'wall-clock limit per simulator run', positiveInt)
    .option('--fail-on <what>', '"divergence": exit 1 on any divergence beyond tolerance (default: only on unexplained ones)')
    .option('--measured <file>', 'CSV of points measured on a prototype (vin, load, fs, vout, ...): each is simulated at its fs and compared')
    .description('simulate every corner and compare with FHA')
    .addHelpText('after', `\nExit codes:\n${renderExitTable()}\n`)
    .action(async (file: string, o: RunFlags) => {
      const design = await loadOrReport(file);
      throw new ExitSignal(await runCommand({ ...design, file }, o));
    });

  p.command('report').argument('<results>', 'results.json from tankcheck run')
    .requiredOption('-o, --out <file>', 'HTML file to write')
    .option('--design <file>', 'design file for the FHA curves (default: the one named in the results)')
    .option('--waveforms <file>', 'waveforms.json (default: beside the results file)')
    .description('write the self-contained HTML report from saved results')
    .action(async (file: string, o: { out: string; design?: string; waveforms?: string }) => {
      await reportCommand(file, o, loadOrReport);
    });

  p.command('schema').description('print the JSON Schema of the design file format')
    .action(() => {
      process.stdout.write(`${JSON.stringify(designJsonSchema, null, 2)}\n`);
    });
  return p;
}

/** CLI entry: returns the exit code (only bin/tankcheck.js sets it on the process). */
export async function main(argv: string[]): Promise<number> {
  try {
    await program().parseAsync(argv);
    return EXIT.ok;
  } catch (e) {
    if (e instanceof ExitSignal) return e.code;
    if (e instanceof CommanderError) return e.exitCode === 0 ? EXIT.ok : EXIT.invalid;
    if (e instanceof UsageError) {
      process.stderr.write(`tankcheck: ${e.message}\n`);
      return EXIT.invalid;
    }
    if (e instanceof Error && e.name === 'EngineUnavailableError') {
      process.stderr.write(`tankcheck: engine unavailable: ${e.message}\n`);
      return EXIT.engineUnavailable;
    }
    process.stderr.write(`tankcheck: internal error (please report): ${e instanceof Error ? e.stack ?? e.message : String(e)}\n`);
    return EXIT.internal;
  }
}
