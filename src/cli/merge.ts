import { readFile, stat } from 'node:fs/promises';
import { dirname, join } from 'node:path';
import type { Design } from '../design/types.js';
import type { Results, WaveformExcerpt } from '../results/types.js';
import { mergeParts, type MergePart } from '../results/merge.js';
import { assembleResults } from '../run/study.js';
import { writeFilesAtomic } from '../run/files.js';
import { renderResultsJson, renderWaveformsJson } from '../report/json.js';
import { renderResultsCsv } from '../report/csv.js';
import { renderJunit } from '../report/junit.js';
import { renderSamplesCsv } from '../report/samplesCsv.js';
import { renderHtmlReport } from '../report/html/index.js';
import { renderSummary } from '../report/table.js';
import { compareBaseline, renderBaseline } from '../compare/baseline.js';
import { loadDesign } from '../design/index.js';
import { loadResultsFile } from '../run/resultsFile.js';
import { orRefuse } from './report.js';
import { exitCodeFor, UsageError } from './exit.js';
import type { FailOn } from '../results/gate.js';

export interface MergeFlags {
  out: string;
  html?: string;
  baseline?: string;
  baselineTolerance: string;
  failOn?: string;
}

/** A part's results.json with the fields merge relies on checked; problems name the file and field path. */
async function readPart(arg: string): Promise<MergePart> {
  const isDir = await stat(arg).then((s) => s.isDirectory(), () => false);
  const file = isDir ? join(arg, 'results.json') : arg;
  // the one checking reader: a truncated or edited part is refused with its file and field path
  const data = orRefuse(await loadResultsFile(file), file);
  const wfile = join(dirname(file), 'waveforms.json');
  let waveforms: WaveformExcerpt[] = [];
  try {
    waveforms = (JSON.parse(await readFile(wfile, 'utf8')) as { corners?: WaveformExcerpt[] }).corners ?? [];
  } catch (e) {
    // a part without waveforms has none to give; a damaged one is refused
    if ((e as NodeJS.ErrnoException).code !== 'ENOENT') throw new UsageError(`${wfile}: not complete JSON (${e instanceof Error ? e.message : e})`);
  }
  return { source: file, results: data, waveforms };
}

/**
 * `tankcheck merge <parts...> --out DIR`: the shards of one study back into the files one machine
 * writes (same renderers, same bytes); statistics and the measured report are computed again over
 * the union. Any refusal exits 2 before anything is written. Returns the exit code of the merged result.
 */
export async function mergeCommand(args: string[], o: MergeFlags): Promise<number> {
  if (o.failOn !== undefined && o.failOn !== 'divergence') throw new UsageError(`--fail-on takes "divergence", got ${JSON.stringify(o.failOn)}`);
  const failOn: FailOn = o.failOn === 'divergence' ? 'divergence' : 'default';
  const baselineTol = Number(o.baselineTolerance);
  if (!(baselineTol >= 0 && baselineTol < 1)) throw new UsageError('--baseline-tolerance must be a fraction in [0, 1)');
  const parts: MergePart[] = [];
  for (const a of args) parts.push(await readPart(a));
  const m = mergeParts(parts);
  if (!m.ok) throw new UsageError(`cannot merge; nothing was written:\n  ${m.problems.join('\n  ')}`);
  const first = m.first;
  const design = { name: first.design.name, file: first.design.file, compare: { measured: first.measured?.tolerance } as Design['compare'] };
  const plan = {
    measured: first.measured ? { file: first.measured.file, points: new Map() } : null,
    monteCarlo: first.statistics ? { facts: { seed: first.statistics.seed, distribution: first.statistics.distribution, confirm: 0 }, picks: [] } : null,
  };
  const results = assembleResults(design, plan, m.corners, { engine: first.engine, incomplete: m.incomplete });
  if (o.baseline) {
    const base = (await readPart(o.baseline)).results;
    results.baseline = compareBaseline(results, base, o.baseline, baselineTol);
  }
  const files = [
    { path: join(o.out, 'results.json'), text: renderResultsJson(results) },
    { path: join(o.out, 'results.csv'), text: renderResultsCsv(results) },
    { path: join(o.out, 'junit.xml'), text: renderJunit(results, { failOn }) },
    { path: join(o.out, 'waveforms.json'), text: renderWaveformsJson(m.waveforms) },
  ];
  if (results.statistics) files.push({ path: join(o.out, 'samples.csv'), text: renderSamplesCsv(results) });
  if (o.html) {
    let full: Design | undefined;
    if (first.design.file) full = await loadDesign(first.design.file).then((r) => (r.ok ? r.design : undefined), () => undefined);
    files.push({ path: o.html, text: renderHtmlReport({ results, waveforms: m.waveforms, design: full }) });
  }
  await writeFilesAtomic(files);
  process.stdout.write(renderSummary(results));
  if (results.baseline) process.stdout.write(renderBaseline(results.baseline));
  process.stdout.write(`merged ${parts.length} parts (${m.corners.length} corners); wrote ${files.map((f) => f.path).join(', ')}\n`);
  return exitCodeFor(results, failOn);
}
