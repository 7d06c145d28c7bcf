import type { Results } from '../results/types.js';
import { operatingPoint } from '../statistics/corners.js';
import { SAMPLED_PARAMETERS } from '../statistics/sample.js';
import { renderCsv } from './csv.js';

/**
 * samples.csv of a Monte Carlo run: one row per sample and operating point, with the sampled tank,
 * the status (screened or the simulated verdict), the switching frequency from FHA, the ideal
 * model and the simulation, each limit's value on the three, and whether every limit is met.
 * Values are SI (H, F, Hz, V, A); deviations are fractions; a missing value is an empty field.
 */
export function renderSamplesCsv(results: Results): string {
  const corners = results.corners.filter((c) => c.inputs.sample !== undefined);
  const limits = [...new Set(corners.flatMap((c) => (c.checks ?? []).map((x) => x.limit)))];
  const head = ['corner', 'sample', 'operating_point', 'vin_V', 'load_ohm', 'lr_H', 'cr_F', 'lm_H', 'turns_ratio',
    ...SAMPLED_PARAMETERS.map((p) => `dev_${p}`), 'status', 'fs_fha_Hz', 'fs_ideal_Hz', 'fs_sim_Hz',
    ...limits.flatMap((l) => [`${l}_fha`, `${l}_ideal`, `${l}_sim`]), 'within_fha', 'within_ideal', 'within_sim'];
  const all = (side: 'fha' | 'ideal' | 'sim', checks: NonNullable<Results['corners'][number]['checks']>) => {
    const w = checks.map((x) => x[side]?.within ?? null);
    return w.some((x) => x === false) ? 'no' : w.length && w.every((x) => x === true) ? 'yes' : '';
  };
  const lines: unknown[][] = [head];
  for (const c of corners) {
    const i = c.inputs;
    const checks = c.checks ?? [];
    const value = (l: string, side: 'fha' | 'ideal' | 'sim') => {
      const v = checks.find((x) => x.limit === l)?.[side]?.value;
      return v === undefined ? null : v;
    };
    lines.push([c.id, i.sample, operatingPoint(c), i.vin, i.load, i.lr, i.cr, i.lm, i.turnsRatio,
      ...SAMPLED_PARAMETERS.map((p) => i.deviation?.[p] ?? 0), c.status, c.fha.fs, c.ideal?.fs ?? null, c.sim?.fs ?? null,
      ...limits.flatMap((l) => [value(l, 'fha'), value(l, 'ideal'), value(l, 'sim')]),
      all('fha', checks), all('ideal', checks), c.sim ? all('sim', checks) : '']);
  }
  return renderCsv(lines);
}
