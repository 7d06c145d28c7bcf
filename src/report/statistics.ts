import type { MonteCarloStatistics, YieldEstimate } from '../statistics/summary.js';

const pct = (x: number, digits = 1): string => `${(x * 100).toFixed(digits)} %`;
const pad = (s: string, w: number): string => (s.length >= w ? s : s + ' '.repeat(w - s.length));

function yieldLine(name: string, y: YieldEstimate, samples: number): string {
  const unknown = y.unknown ? `; ${y.unknown} without a value at some operating point, counted as not meeting` : '';
  return `  ${pad(name, 11)} ${pad(pct(y.value), 8)} (95 % interval ${pct(y.low)} .. ${pct(y.high)}; ${y.meets} of ${samples} samples${unknown})`;
}

/**
 * The terminal summary of a Monte Carlo run: yield from screening with its interval, what the
 * simulation confirmed and how well the ideal model agreed with it, the worst sample per limit
 * and the sensitivity ranking. Plain text, one block.
 */
export function renderStatistics(s: MonteCarloStatistics): string {
  const lines: string[] = [];
  lines.push(`Monte Carlo: ${s.samples} samples (seed ${s.seed}, ${s.distribution}) x ${s.operatingPoints.length} operating points`);
  lines.push('Yield (every limit met at every operating point), screened:');
  lines.push(yieldLine('FHA', s.yield.fha, s.samples));
  lines.push(yieldLine('ideal model', s.yield.ideal, s.samples));
  lines.push('  interval: Clopper-Pearson, 95 %');
  const c = s.confirmed;
  lines.push(`Confirmed by simulation: ${c.count} corners of ${c.samples} samples; ${c.outside} sample${c.outside === 1 ? '' : 's'} outside a limit in simulation`);
  if (c.agreement.length) {
    lines.push('  ideal model vs simulation (relative error over the confirmed corners):');
    for (const a of c.agreement) lines.push(`    ${pad(a.metric, 24)} median ${pad(pct(a.median, 2), 9)} worst ${pct(a.worst, 2)} (${a.worstId})`);
  }
  if (s.worst.length) {
    lines.push('Worst sample per limit (usage = value / bound, lower limits bound / value; above 100 % is outside):');
    for (const w of s.worst) {
      lines.push(`  ${pad(w.limit, 24)} ${pad(w.usage === null ? 'not met' : pct(w.usage), 9)} sample ${w.sample} (${w.id}, ${w.source === 'ideal' ? 'ideal model' : 'FHA'})`);
    }
  }
  if (s.sensitivity.length) {
    lines.push('Sensitivity (Spearman rank correlation of each tolerance with the worst usage; strongest first):');
    for (const e of s.sensitivity) {
      const ranking = e.ranking.map((r) => `${r.parameter} ${r.rho >= 0 ? '+' : ''}${r.rho.toFixed(2)}`).join(', ');
      lines.push(`  ${pad(e.limit, 24)} ${ranking}`);
    }
  }
  lines.push('Screened corners are not simulated: their status is "screened". The yield is a model estimate, not a production figure.');
  return `${lines.join('\n')}\n`;
}
