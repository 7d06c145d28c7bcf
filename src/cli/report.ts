import { readFile } from 'node:fs/promises';
import { dirname, join } from 'node:path';
import type { Design } from '../design/types.js';
import type { Results, WaveformExcerpt } from '../results/types.js';
import { renderHtmlReport } from '../report/html/index.js';
import { writeFilesAtomic } from '../run/files.js';
import { UsageError } from './exit.js';
import { loadDesign } from '../design/index.js';

/** `tankcheck report results.json -o report.html`: the HTML report from saved results. */
export async function reportCommand(file: string, o: { out: string; design?: string; waveforms?: string },
  load: (f: string) => Promise<Design>): Promise<void> {
  let results: Results;
  try {
    results = JSON.parse(await readFile(file, 'utf8')) as Results;
  } catch (e) {
    throw new UsageError(`${file}: cannot read results (${e instanceof Error ? e.message : e})`);
  }
  if (results?.schema !== 'tankcheck/results@1') throw new UsageError(`${file}: not a tankcheck results file`);
  const wfile = o.waveforms ?? join(dirname(file), 'waveforms.json');
  let waveforms: WaveformExcerpt[] = [];
  try {
    waveforms = (JSON.parse(await readFile(wfile, 'utf8')) as { corners: WaveformExcerpt[] }).corners ?? [];
  } catch {
    if (o.waveforms) throw new UsageError(`${wfile}: cannot read waveforms`);
  }
  // The design gives the FHA curves. An explicit --design must load; the file named in the results
  // is tried as written and beside the results file, and the report goes without curves if absent.
  let design: Design | undefined;
  if (o.design) design = await load(o.design);
  else if (results.design.file) {
    for (const candidate of [results.design.file, join(dirname(file), results.design.file)]) {
      const r = await loadDesign(candidate).catch(() => undefined);
      if (r?.ok) { design = r.design; break; }
    }
    if (!design) process.stderr.write(`note: design file ${results.design.file} not found; the report shows points without FHA curves (use --design)\n`);
  }
  await writeFilesAtomic([{ path: o.out, text: renderHtmlReport({ results, waveforms, design }) }]);
  process.stdout.write(`wrote ${o.out}\n`);
}
