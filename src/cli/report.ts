import { access } from 'node:fs/promises';
import { dirname, join } from 'node:path';
import type { Design } from '../design/types.js';
import type { WaveformExcerpt } from '../results/types.js';
import type { ReadResult } from '../results/read.js';
import { formatProblem } from '../design/problem.js';
import { renderHtmlReport } from '../report/html/index.js';
import { writeFilesAtomic } from '../run/files.js';
import { loadResultsFile, loadWaveformsFile } from '../run/resultsFile.js';
import { loadDesign } from '../design/index.js';
import { checkOutputFile } from './outputs.js';
import { UsageError } from './exit.js';

/** The value read, or every problem on stderr and exit 2. */
export function orRefuse<T>(r: ReadResult<T>, what: string): T {
  if (r.ok) return r.value;
  for (const p of r.problems) process.stderr.write(`${formatProblem(p, p.file ?? what)}\n`);
  throw new UsageError(`${what}: cannot be used (${r.problems.length} problem(s)); nothing was written`);
}

/** `tankcheck report results.json -o report.html`: the HTML report from saved results. */
export async function reportCommand(file: string, o: { out: string; design?: string; waveforms?: string; quiet?: boolean },
  load: (f: string) => Promise<Design>): Promise<void> {
  await checkOutputFile(o.out, '--out');
  const results = orRefuse(await loadResultsFile(file), file);
  const wfile = o.waveforms ?? join(dirname(file), 'waveforms.json');
  // the default companion file may be absent (the report then has no waveform section); one that is there must be sound
  const present = o.waveforms !== undefined || (await access(wfile).then(() => true, () => false));
  const waveforms: WaveformExcerpt[] = present ? orRefuse(await loadWaveformsFile(wfile), wfile) : [];
  // The design gives the FHA curves. An explicit --design must load and be the design the results are
  // from (another design's curves beside these points would look right and be wrong); the file named in
  // the results is tried as written and beside the results file, and the report goes without curves if
  // it is absent or now holds another design.
  let design: Design | undefined;
  if (o.design) {
    design = await load(o.design);
    if (design.name !== results.design.name) {
      throw new UsageError(`--design ${o.design} is design "${design.name}", but ${file} is from design "${results.design.name}": its FHA curves would not belong to these results`);
    }
  } else if (results.design.file) {
    for (const candidate of [results.design.file, join(dirname(file), results.design.file)]) {
      const r = await loadDesign(candidate).catch(() => undefined);
      if (r?.ok && r.design.name === results.design.name) { design = r.design; break; }
    }
    if (!design) process.stderr.write(`note: design file ${results.design.file} (design "${results.design.name}") not found; the report shows points without FHA curves (use --design)\n`);
  }
  await writeFilesAtomic([{ path: o.out, text: renderHtmlReport({ results, waveforms, design }) }]);
  if (!o.quiet) process.stdout.write(`wrote ${o.out}\n`);
}
