import { describe, expect, it } from 'vitest';
import type { Results } from '../../results/types.js';
import { rowAnchor, waveAnchor } from './escape.js';
import { loadDemo, syntheticStudy } from './fixture.test-support.js';
import { renderHtmlReport, SECTIONS } from './index.js';
import { TABLE_METRICS } from './table.js';
import { WAVES_OPEN, waveformCorners } from './waveforms.js';

const demo = await loadDemo();
const html = renderHtmlReport(demo);
const count = (s: string, needle: string | RegExp) => (typeof needle === 'string' ? s.split(needle).length - 1 : (s.match(needle) ?? []).length);
/** The opening tags of every <svg class="plot ..."> with their data-series, and the series paths inside each. */
function plots(page: string): { kind: string; declared: number; paths: number }[] {
  return [...page.matchAll(/<svg class="plot (\w+)"[^>]*data-series="(\d+)"[^>]*>([\s\S]*?)<\/svg><\/svg>/g)].map((m) => ({
    kind: m[1]!, declared: Number(m[2]), paths: count(m[3]!, m[1] === 'gain' ? '<path class="curve" data-series=' : '<path class="series" data-series='),
  }));
}

describe('renderHtmlReport on the recorded demo run', () => {
  it('is one self-contained page with the sections in order', () => {
    expect(html.startsWith('<!doctype html>')).toBe(true);
    // the Monte Carlo section appears only in Monte Carlo runs (report/html/statistics.test.ts),
    // the bench section only with measured points (report/html/measured.test.ts)
    const at = SECTIONS.filter(([id]) => id !== 'statistics' && id !== 'measured').map(([id]) => html.indexOf(`<section id="${id}">`));
    expect(html).not.toContain('<section id="statistics">');
    expect(at.every((x) => x > 0)).toBe(true);
    expect([...at].sort((a, b) => a - b)).toEqual(at);
    expect(count(html, '<script>')).toBe(1);
    expect(count(html, '<style>')).toBe(1);
  });

  it('loads nothing from outside: no http(s) or protocol-relative URL anywhere, and a CSP that forbids loads', () => {
    expect(html).not.toMatch(/(src|href)\s*=\s*["']?\s*(https?:)?\/\//i);
    expect(html).not.toMatch(/https?:/i);
    expect(html).not.toMatch(/url\(/i);
    expect(html).toContain(`content="default-src 'none';`);
  });

  it('has one table row per corner, each with its anchor', () => {
    expect(count(html, /<tr id="c-/g)).toBe(demo.results.corners.length);
    for (const c of demo.results.corners) expect(html).toContain(`<tr id="${rowAnchor(c.id)}" data-status="${c.status}">`);
  });

  it('flags exactly the diverged table metrics, with symbol and reason, not colour alone', () => {
    const keys = new Set(TABLE_METRICS.map((m) => m.key));
    const expected = demo.results.corners.flatMap((c) => c.comparison).filter((r) => keys.has(r.metric) && r.verdict === 'diverged');
    expect(expected.length).toBeGreaterThan(0);
    const cells = [...html.matchAll(/<td class="err flag"[^>]*title="([^"]*)"[^>]*>[^<]*<span class="mark"[^>]*>▲<\/span>/g)];
    expect(cells).toHaveLength(expected.length);
    expect(cells.map((m) => m[1])).toEqual(expect.arrayContaining([expect.stringContaining('docs/method.md#diode-currents')]));
  });

  it('draws one gain curve per load and Vin and the declared number of series in every plot', () => {
    const p = plots(html);
    const gain = p.filter((x) => x.kind === 'gain');
    expect(gain).toHaveLength(3); // Vin 340, 390, 410
    expect(gain.reduce((n, x) => n + x.paths, 0)).toBe(3 * 2); // x 2 loads
    for (const x of p) expect(x.paths).toBe(x.declared);
    expect(count(html, 'class="boundary"')).toBeGreaterThanOrEqual(3);
    expect(count(html, 'class="pt-sim"')).toBe(6);
    expect(count(html, 'class="pt-fha"')).toBeGreaterThanOrEqual(6);
  });

  it('draws waveforms for the nominal and every diverged corner, seven series each (CT rectifier: 2 diodes)', () => {
    const picked = waveformCorners(demo.results);
    expect(picked[0]!.id).toBe('v340_25pct_reg_nom');
    expect(picked).toHaveLength(6); // every demo corner diverged
    for (const c of picked) expect(html).toContain(`<figure class="wave" id="${waveAnchor(c.id)}">`);
    const waves = plots(html).filter((x) => x.kind === 'wave');
    expect(waves).toHaveLength(demo.waveforms.length);
    expect(waves.every((w) => w.declared === 7)).toBe(true);
    expect(count(html, 'No waveform excerpt for this corner')).toBe(6 - demo.waveforms.length);
  });

  it('links the worst divergences to rows that exist', () => {
    const links = [...html.matchAll(/<table class="worst">[\s\S]*?<\/table>/g)][0]![0].match(/href="#([^"]+)"/g)!;
    expect(links).toHaveLength(demo.results.summary.worst.length);
    for (const l of links) expect(html).toContain(`<tr id="${l.slice(7, -1)}"`);
  });

  it('is deterministic and cites the method sources and the safety caution', () => {
    expect(renderHtmlReport(demo)).toBe(html);
    for (const s of ['Erickson and D. Maksimović', 'Steigerwald', 'Batarseh', 'mains-voltage', 'bench validation', 'local codes']) expect(html).toContain(s);
  });
});

describe('renderHtmlReport edge cases', () => {
  it('escapes every string taken from the results', () => {
    const evil = '<script>alert(1)</script>';
    const r: Results = structuredClone(demo.results);
    r.design.name = evil;
    r.design.file = `x"><img src=x onerror=alert(2)>.yaml`;
    r.engine = { name: evil, version: evil };
    const c = r.corners[0]!;
    c.id = `"><img src=x onerror=alert(3)>`;
    c.inputs.loadLabel = evil;
    c.divergences[0]!.reason = evil;
    c.comparison.find((x) => x.verdict === 'diverged')!.reason = evil;
    c.fha.warnings = [evil];
    c.sim!.mode = evil;
    r.summary.worst[0]!.id = c.id;
    c.status = evil as never;
    const page = renderHtmlReport({ results: r, waveforms: [], design: demo.design });
    expect(page).not.toContain('<script>alert');
    expect(page).not.toContain('<img');
    expect(page).toContain('&lt;script&gt;alert(1)&lt;/script&gt;');
    expect(count(page, '<script>')).toBe(1);
  });

  it('says so when the design is missing and draws the points only', () => {
    const page = renderHtmlReport({ results: demo.results, waveforms: demo.waveforms });
    expect(page).toContain('The design file was not available');
    expect(count(page, '<path class="curve"')).toBe(0);
    expect(count(page, 'class="pt-sim"')).toBe(6);
  });

  it('shows the incomplete banner only for an interrupted run', () => {
    expect(html).not.toContain('Incomplete run');
    expect(renderHtmlReport({ ...demo, results: { ...demo.results, incomplete: true } })).toContain('Incomplete run');
  });

  it('renders 200 corners quickly and leanly (sanity bounds, not a benchmark)', () => {
    const big = syntheticStudy(demo.results, demo.waveforms);
    expect(big.results.corners).toHaveLength(200);
    const t0 = performance.now();
    const page = renderHtmlReport({ ...big, design: demo.design });
    expect(performance.now() - t0).toBeLessThan(10_000);
    expect(count(page, /<tr id="c-/g)).toBe(200);
    expect(count(page, '<path class="curve"')).toBe(5 * 4);
    expect(count(page, '<path class="band"')).toBe(5 * 4); // 10 tank sets per Vin and load
    expect(count(page, '<figure class="map">')).toBe(10);
    // Figures past WAVES_OPEN wait in an inert template; all 200 corners diverged.
    const lazy = page.slice(page.indexOf('<template>'));
    expect(count(page, '<figure class="wave"') - count(lazy, '<figure class="wave"')).toBe(WAVES_OPEN);
    expect(count(page, '<figure class="wave"')).toBe(200);
    expect(page.length).toBeLessThan(4e6);
  });
});
