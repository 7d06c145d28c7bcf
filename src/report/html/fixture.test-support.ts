// Test data for the HTML report: a recorded run of examples/demo.yaml and a synthetic large study.
import { readFileSync } from 'node:fs';
import type { Design } from '../../design/types.js';
import { loadDesignOrThrow } from '../../design/load.js';
import type { CornerResult, Results, WaveformExcerpt } from '../../results/types.js';
import { sharedFile } from '../../../tests/support/shared.js';

const here = (f: string) => sharedFile('report', f);

/**
 * Recorded output of `tankcheck run examples/demo.yaml --engine ngspice` (ngspice-39): the full
 * results and the waveform excerpts of three of its six corners (see shared/report/README.md).
 */
export async function loadDemo(): Promise<{ results: Results; waveforms: WaveformExcerpt[]; design: Design }> {
  const results = JSON.parse(readFileSync(here('demo-results.json'), 'utf8')) as Results;
  const waveforms = (JSON.parse(readFileSync(here('demo-waveforms.json'), 'utf8')) as { corners: WaveformExcerpt[] }).corners;
  const { design } = await loadDesignOrThrow(new URL('../../../examples/demo.yaml', import.meta.url).pathname);
  return { results, waveforms, design };
}

const SIDES: CornerResult['inputs']['tolerance'][] = [
  { lr: 0, cr: 0, lm: 0 }, { lr: -1, cr: -1, lm: -1 }, { lr: -1, cr: -1, lm: 1 }, { lr: -1, cr: 1, lm: -1 }, { lr: -1, cr: 1, lm: 1 },
  { lr: 1, cr: -1, lm: -1 }, { lr: 1, cr: -1, lm: 1 }, { lr: 1, cr: 1, lm: -1 }, { lr: 1, cr: 1, lm: 1 }, { lr: 1, cr: 0, lm: 0 },
];

/**
 * A large study for size and speed checks, cloned from the demo: Vin x load x tank set (5 x 4 x 10 =
 * 200 corners by default), each a copy of a demo corner with new inputs and id; every copied corner
 * that has a demo excerpt gets one too. The numbers are not physical: for rendering tests only.
 */
export function syntheticStudy(base: Results, waves: WaveformExcerpt[], vins = [340, 360, 380, 400, 410],
  loads = ['25%', '50%', '75%', '100%'], sets = SIDES): { results: Results; waveforms: WaveformExcerpt[] } {
  const corners: CornerResult[] = [];
  const waveforms: WaveformExcerpt[] = [];
  const byId = new Map(waves.map((w) => [w.id, w]));
  for (const vin of vins) for (const [li, label] of loads.entries()) for (const [si, tol] of sets.entries()) {
    const src = base.corners[corners.length % base.corners.length]!;
    const scale = (side: number, x: number) => x * (1 + 0.05 * side);
    const id = `v${vin}_${label.replace('%', 'pct')}_reg_${si === 0 ? 'nom' : `set${si}`}`;
    corners.push({ ...structuredClone(src), id, inputs: { ...src.inputs, vin, loadLabel: label, load: 9.6 / (li + 1),
      lr: scale(tol.lr, src.inputs.lr), cr: scale(tol.cr, src.inputs.cr), lm: scale(tol.lm, src.inputs.lm), tolerance: tol } });
    const w = byId.get(src.id);
    if (w) waveforms.push({ ...w, id });
  }
  return { results: { ...base, corners, summary: { ...base.summary, corners: corners.length } }, waveforms };
}
