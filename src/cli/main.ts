import { Command, CommanderError, InvalidArgumentError, Option } from 'commander';
import { loadDesign, formatProblem, designJsonSchema, type Design } from '../design/index.js';
import { predictStudy } from '../run/study.js';
import { renderFhaTable } from '../report/table.js';
import { renderResultsJson } from '../report/json.js';
import { renderResultsCsv } from '../report/csv.js';
import { fsReason, writeFilesAtomic } from '../run/files.js';
import { writeDecks } from './decks.js';
import { runCommand, HUGE_PLAN, type RunFlags } from './run.js';
import { mergeCommand, type MergeFlags } from './merge.js';
import { parseSize, pruneCache } from './cache.js';
import { parseShard } from '../plan/shard.js';
import { reportCommand } from './report.js';
import { EXIT, renderExitTable, UsageError } from './exit.js';
import { requireMatches } from './common.js';
import { checkOutputFile, checkOutputFolder } from './outputs.js';
import { helpExamples, initCommand } from './init.js';
import { TOOL_VERSION } from '../version.js';

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

/** Checks a --only pattern's length (the matcher itself takes any pattern in bounded time). */
function onlyPattern(v: string): string {
  if (v.length > MAX_ONLY_LENGTH) throw new InvalidArgumentError(`at most ${MAX_ONLY_LENGTH} characters`);
  return v;
}

const quiet = '-q, --quiet';
const quietText = 'print only warnings and errors (for CI); the exit code still tells the outcome';
const onlyText = 'corners whose id matches: * and ? wildcards match the whole id, a plain pattern any part of it';

/** The commander program (exported so tests can check that documented flags exist). */
export function program(): Command {
  const p = new Command('tankcheck')
    .description('LLC resonant converter corners: FHA predictions checked against ngspice simulation')
    .version(TOOL_VERSION, '-V, --version')
    .exitOverride()
    .configureOutput({ writeErr: (s) => process.stderr.write(s) })
    .addHelpText('after', `\n${helpExamples()}\n\nExit codes:\n${renderExitTable()}\n`);

  p.command('init').argument('[file]', 'where to write the demo design', 'demo.yaml')
    .option('-o, --out <file>', 'where to write the demo design (instead of [file])')
    .option('--force', 'overwrite an existing file')
    .option(quiet, quietText)
    .description('write the demo design file (an invented 24 V / 240 W half-bridge supply)')
    .addHelpText('after', '\nExample:\n  tankcheck init my-design.yaml')
    .action(async (arg: string, o: { out?: string; force?: boolean; quiet?: boolean }) => {
      await initCommand(o.out ?? arg, o);
    });

  p.command('fha').argument('<design>', 'design file (YAML)')
    .option('-o, --json <file>', 'write results JSON (FHA only)')
    .option('--csv <file>', 'write results CSV (FHA only)')
    .option('--only <pattern>', onlyText, onlyPattern)
    .option(quiet, quietText)
    .description('FHA prediction for every corner')
    .addHelpText('after', '\nExample:\n  tankcheck fha demo.yaml --only \'v390_*\' -o fha.json')
    .action(async (file: string, o: { json?: string; csv?: string; only?: string; quiet?: boolean }) => {
      const design = await loadOrReport(file);
      requireMatches(design, o.only);
      if (o.json) await checkOutputFile(o.json, '--json');
      if (o.csv) await checkOutputFile(o.csv, '--csv');
      const results = predictStudy({ ...design, file }, o.only);
      if (!o.quiet) process.stdout.write(renderFhaTable(results));
      const files = [];
      if (o.json) files.push({ path: o.json, text: renderResultsJson(results) });
      if (o.csv) files.push({ path: o.csv, text: renderResultsCsv(results) });
      await writeFilesAtomic(files);
    });

  p.command('decks').argument('<design>', 'design file (YAML)')
    .requiredOption('-o, --out <dir>', 'folder for the decks and index.csv')
    .option('--only <pattern>', onlyText, onlyPattern)
    .option(quiet, quietText)
    .option('--shard <K/N>', 'only the decks of shard K of N (1-based) of the plan')
    .description('write one SPICE deck per corner (runs by hand with ngspice -b) and an index')
    .addHelpText('after', '\nExample:\n  tankcheck decks demo.yaml -o decks && cd decks && ngspice -b v390_100pct_reg_nom.cir')
    .action(async (file: string, o: { out: string; only?: string; quiet?: boolean; shard?: string }) => {
      const design = await loadOrReport(file);
      requireMatches(design, o.only);
      const shard = o.shard !== undefined ? parseShard(o.shard) : undefined;
      if (typeof shard === 'string') throw new UsageError(shard);
      await checkOutputFolder(o.out, '--out');
      const n = await writeDecks(design, o.out, o.only, shard);
      if (!o.quiet) process.stdout.write(`wrote ${n} decks and index.csv to ${o.out}\n`);
    });

  p.command('run').argument('<design>', 'design file (YAML)')
    .addOption(new Option('--engine <name>', 'wasm (embedded) or ngspice (system binary)').choices(['wasm', 'ngspice']).default('wasm'))
    .option('--ngspice-path <path>', 'ngspice binary for --engine ngspice')
    .option('--jobs <n>', 'corners simulated at once (default: from cores and free memory)', positiveInt)
    .option('-o, --out <dir>', 'folder for results.json, results.csv, junit.xml, waveforms.json, run-log.json', 'tankcheck-out')
    .option('--only <pattern>', onlyText, onlyPattern)
    .option('--baseline <results.json>', 'compare with an earlier run and flag regressions')
    .option('--baseline-tolerance <fraction>', 'relative change of a simulated metric that counts as moved', '0.01')
    .option('--html <file>', 'also write the HTML report')
    .option('--no-cache', 'simulate every corner even if a cached result exists')
    .option('--cache-dir <dir>', 'corner cache folder', '.tankcheck-cache')
    .option('--keep-decks', 'keep the simulator work folders (system ngspice)')
    .option('--timeout <seconds>', 'wall-clock limit per simulator run', positiveInt)
    .addOption(new Option('--fail-on <what>', '"divergence": exit 1 on any divergence beyond tolerance (default: only on unexplained ones)').choices(['divergence']))
    .option('--measured <file>', 'CSV of points measured on a prototype (vin, load, fs, vout, ...): each is simulated at its fs and compared')
    .option(quiet, quietText)
    .option('--shard <K/N>', 'run shard K of N (1-based) of the plan; with --shard-index-env, the count N')
    .option('--shard-index-env <NAME>', 'read the shard index from this variable, counted from 0 (JOB_COMPLETION_INDEX)')
    .option('--dry-run', 'print the plan (corners, cost, shards) and stop; nothing is simulated')
    .option('--yes', `run a plan of more than ${HUGE_PLAN} simulated corners on this machine`)
    .description('simulate every corner and compare with FHA')
    .addHelpText('after', `\n${helpExamples()}\n\nExit codes:\n${renderExitTable()}\n`)
    .action(async (file: string, o: RunFlags) => {
      const design = await loadOrReport(file);
      throw new ExitSignal(await runCommand({ ...design, file }, o));
    });

  p.command('merge').argument('<parts...>', 'shard parts: results.json files or the folders holding them')
    .requiredOption('-o, --out <dir>', 'folder for the merged results.json, results.csv, junit.xml, waveforms.json')
    .option('--html <file>', 'also write the HTML report of the merged result')
    .option('--baseline <results.json>', 'compare the merged result with an earlier run')
    .option('--baseline-tolerance <fraction>', 'relative change of a simulated metric that counts as moved', '0.01')
    .option('--fail-on <what>', '"divergence": exit 1 on any divergence beyond tolerance')
    .description('merge the shards of one study into the files a single run writes (byte-identical)')
    .addHelpText('after', `\nExit codes (of the merged result; 2 also for parts that do not make one study):\n${renderExitTable()}\n`)
    .action(async (parts: string[], o: MergeFlags) => {
      throw new ExitSignal(await mergeCommand(parts, o));
    });

  p.command('cache').description('manage the corner cache')
    .command('prune')
    .option('--max-size <size>', 'keep at most this many bytes: k, M, G are binary (1024, 1024^2, 1024^3), e.g. 500M', '500M')
    .option('--cache-dir <dir>', 'corner cache folder', '.tankcheck-cache')
    .description('remove the oldest cache entries (by modification time) until the cache fits --max-size')
    .action(async (o: { maxSize: string; cacheDir: string }) => {
      const max = parseSize(o.maxSize);
      if (max === null) throw new UsageError(`--max-size expects bytes with an optional k, M or G (binary: 1024 each), e.g. 500M; got ${JSON.stringify(o.maxSize)}`);
      const r = await pruneCache(o.cacheDir, max);
      process.stdout.write(`${o.cacheDir}: ${r.entries} entries, ${r.bytes} bytes; removed ${r.removed} oldest (${r.freed} bytes); ${r.bytes - r.freed} bytes left (limit ${max})\n`);
    });

  p.command('report').argument('<results>', 'results.json from tankcheck run')
    .requiredOption('-o, --out <file>', 'HTML file to write')
    .option('--design <file>', 'design file for the FHA curves (default: the one named in the results)')
    .option('--waveforms <file>', 'waveforms.json (default: beside the results file)')
    .option(quiet, quietText)
    .description('write the self-contained HTML report from saved results')
    .addHelpText('after', '\nExample:\n  tankcheck report tankcheck-out/results.json -o report.html')
    .action(async (file: string, o: { out: string; design?: string; waveforms?: string; quiet?: boolean }) => {
      await reportCommand(file, o, loadOrReport);
    });

  p.command('schema').description('print the JSON Schema of the design file format (also tankcheck/schema/design.schema.json)')
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
    // a file-system error that slipped past the checks up front (a disk filling up, a folder removed
    // meanwhile) is the environment's problem, not a bug
    const fs = e as NodeJS.ErrnoException;
    if (fs instanceof Error && typeof fs.code === 'string' && typeof fs.syscall === 'string') {
      process.stderr.write(`tankcheck: ${fs.path ?? fs.syscall}: ${fsReason(fs)}\n`);
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
