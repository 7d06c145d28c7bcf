import { describe, expect, it } from 'vitest';
import { attachMeasured, measuredReport, type MeasuredPoint } from '../../measured/index.js';
import type { CornerResult, Results } from '../../results/types.js';
import { MEASURED_CAUTION } from '../measured.js';
import { benchAnchor } from './escape.js';
import { loadDemo } from './fixture.test-support.js';
import { gainFigureData } from './gainData.js';
import { renderHtmlReport } from './index.js';
import { renderMeasuredSection } from './measured.js';

const demo = await loadDemo();

/**
 * The recorded demo run with four of its corners turned into bench points (invented, for rendering):
 * Vout at the simulated fs scaled by the given factor, so each sim gap is known in advance:
 * (f Vsim - Vsim) / Vsim = f - 1.
 */
const SCALES: Record<string, number> = { v390_100pct_reg_nom: 0.97, v340_25pct_reg_nom: 1, v410_100pct_reg_nom: 0.99, v390_25pct_reg_nom: 1.015 };
function benchRun(): Results {
  const corners = demo.results.corners.map((c): CornerResult => {
    const f = SCALES[c.id];
    if (f === undefined) return c;
    const point: MeasuredPoint = { line: 2 + Object.keys(SCALES).indexOf(c.id), vin: c.inputs.vin, load: { kind: 'ohm', value: c.inputs.load }, fs: c.sim!.fs, vout: c.sim!.vout * f,
      ...(f === 0.97 ? { tankCurrentRms: c.sim!.tankCurrentRms * 1.05, pin: 250, note: 'probe <b>1 kV</b> & "diff"' } : {}) };
    return attachMeasured(c, point, 0.02);
  });
  const results = { ...demo.results, corners };
  return { ...results, measured: measuredReport(results, 'bench/unit1.csv', 0.02) };
}

const results = benchRun();
const html = renderHtmlReport({ ...demo, results });
const gainSection = html.slice(html.indexOf('<section id="gain">'), html.indexOf('</section>', html.indexOf('<section id="gain">')));
const benchSection = html.slice(html.indexOf('<section id="measured">'), html.indexOf('</section>', html.indexOf('<section id="measured">')));

describe('bench points in the HTML report', () => {
  it('draws one triangle per bench point on the gain plot, plus one in the legend, and declares them per panel', () => {
    expect(benchSection.length).toBeGreaterThan(0);
    const markers = [...gainSection.matchAll(/<path class="pt-meas" d="M([\d.-]+) ([\d.-]+)l5 9h-10z"/g)];
    expect(markers).toHaveLength(4 + 1);
    const declared = [...gainSection.matchAll(/data-measured="(\d+)"/g)].map((m) => Number(m[1]));
    expect(declared).toEqual([1, 2, 1]); // Vin 340, 390, 410
    expect(gainSection).toMatch(/<span><svg class="sw"[^>]*><path class="pt-meas"[^>]*\/><\/svg>measured on the bench/);
    // each marker links to its row in the bench table, which exists
    for (const id of Object.keys(SCALES)) {
      expect(gainSection).toContain(`<a href="#${benchAnchor(id)}" class="op">`);
      expect(benchSection).toContain(`<tr id="${benchAnchor(id)}"`);
    }
  });

  it('puts a bench point at the gain of its Vout by the simulation\'s own gain definition', () => {
    // sim.gain is n (Vout + VF) / Vin,eff computed in measure/; a point measured at exactly the
    // simulated Vout must land on the simulated gain (closed-form identity, same n, VF and Vin,eff)
    const points = gainFigureData(results, demo.design).panels.flatMap((p) => p.points).filter((p) => p.measured);
    expect(points).toHaveLength(4);
    for (const p of points) {
      const f = SCALES[p.id]!;
      expect(p.measured!.fs).toBe(p.sim!.fs);
      // M_meas - M_sim = n (f - 1) Vsim / Vin,eff = (f - 1) Vsim / perGain
      const c = results.corners.find((x) => x.id === p.id)!;
      const perGain = (c.sim!.vout + 0.5) / c.sim!.gain; // demo rectifier forwardVoltage 0.5 V, centre-tapped: one diode conducts
      expect(p.measured!.gain).toBeCloseTo(c.sim!.gain + ((f - 1) * c.sim!.vout) / perGain, 9);
    }
  });

  it('draws no bench marker without the design and says why', () => {
    const noDesign = renderHtmlReport({ results, waveforms: demo.waveforms });
    expect(noDesign).not.toContain('class="pt-meas"');
    expect(noDesign).toContain('The measured points are not drawn');
    expect(noDesign).toContain('<section id="measured">'); // the table needs no design
  });

  it('lists the points largest simulation gap first, one row per measured metric, with gaps of every model', () => {
    const order = [...benchSection.matchAll(/<tr id="b-([^"]+)"/g)].map((m) => m[1]!.replace(/_5f_/g, '_'));
    expect(order).toEqual(['v390_100pct_reg_nom', 'v390_25pct_reg_nom', 'v410_100pct_reg_nom', 'v340_25pct_reg_nom']);
    // the 0.97 point: Vout and tank current rows, both sim gaps known: -3.0 % (flagged beyond 2 %) and +5.0 %
    const first = benchSection.slice(benchSection.indexOf('<tr id="b-v390'), benchSection.indexOf('<tr id="b-v390_5f_25pct'));
    expect(first.match(/<tr[ >]/g)).toHaveLength(2);
    expect(first).toContain('rowspan="2"');
    expect(first).toContain('<td class="err flag">-3.0%<span class="mark"');
    expect(first).toContain('<td class="err flag">+5.0%<span class="mark"');
    expect(first).toContain('✗ sim misses by more than 2 %');
    expect(first).toContain('probe &lt;b&gt;1 kV&lt;/b&gt; &amp; &quot;diff&quot;');
    // efficiency: Pout / Pin by hand, Vout^2 / R / 250 W
    const c = results.corners.find((x) => x.id === 'v390_100pct_reg_nom')!;
    expect(first).toContain(`${((((c.sim!.vout * 0.97) ** 2 / c.inputs.load) / 250) * 100).toFixed(1)} %`);
    // the point measured at the simulated Vout: within, 0.0 % against sim, FHA gap (Vsim - Vfha)/|Vfha|
    const exact = benchSection.slice(benchSection.indexOf('<tr id="b-v340'));
    expect(exact).toContain('✓ within 2 %');
    const k = demo.results.corners.find((x) => x.id === 'v340_25pct_reg_nom')!;
    expect(exact).toContain(`${k.sim!.vout >= k.fha.vout! ? '+' : '-'}${Math.abs(((k.sim!.vout - k.fha.vout!) / k.fha.vout!) * 100).toFixed(1)}%`);
  });

  it('carries the caution, the miss count and the pattern hint', () => {
    expect(benchSection).toContain(MEASURED_CAUTION.replace(/\n/g, ' '));
    expect(benchSection).toContain('<strong>1 of 4</strong> points missed by the simulation');
    expect(results.measured!.hint).not.toBeNull();
    expect(benchSection).toContain(`<strong>Pattern:</strong> ${results.measured!.hint!.message}`);
    expect(benchSection).toContain('<code>bench/unit1.csv</code>');
  });

  it('leaves the section out of a run without bench points', () => {
    expect(renderMeasuredSection(demo.results)).toBe('');
    expect(renderHtmlReport(demo)).not.toContain('<section id="measured">');
  });
});
