// The HTML report in headless Chromium: a real demo run (system ngspice), loaded from a file:// URL.
// Needs Debian's chromium: the engine tier's global setup stops with one line when it is missing.
import { mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { chromium, type BrowserContext, type Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { loadDesignOrThrow } from '../../src/design/load.js';
import { parseMeasured } from '../../src/measured/index.js';
import { createNgspiceEngine } from '../../src/engine/native.js';
import { renderHtmlReport } from '../../src/report/html/index.js';
import { WAVES_OPEN, waveformCorners } from '../../src/report/html/waveforms.js';
import { syntheticStudy } from '../../src/report/html/fixture.test-support.js';
import type { Results, WaveformExcerpt } from '../../src/results/types.js';
import { runStudy } from '../../src/run/study.js';
import { findCommand } from '../../scripts/system-packages.mjs';

const CHROMIUM = findCommand('chromium') ?? '/usr/bin/chromium';
const ARGS = ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking',
  '--disable-component-update', '--disable-sync'];
describe('HTML report in headless Chromium', () => {
  const dir = mkdtempSync(join(tmpdir(), 'tankcheck-report-browser-'));
  let context: BrowserContext;
  let results: Results;
  let waveforms: WaveformExcerpt[];
  let fileUrl: string;
  const requests: string[] = [];
  const errors: string[] = [];
  let page: Page;

  beforeAll(async () => {
    const { design } = await loadDesignOrThrow(new URL('../../examples/demo.yaml', import.meta.url).pathname);
    const engine = createNgspiceEngine({ tmpRoot: dir });
    try {
      // three of the demo's invented bench points (390 V, 10 A at 90, 99 and 110 kHz) beside the design's corners
      const parsed = parseMeasured(readFileSync(new URL('../../examples/demo-measured.csv', import.meta.url), 'utf8'));
      if (!parsed.ok) throw new Error('examples/demo-measured.csv does not parse');
      const points = parsed.points.filter((p) => p.vin === 390 && p.load.kind === 'ampere' && p.load.value === 10);
      ({ results, waveforms } = await runStudy(design, { engine, jobs: 2, measured: { file: 'examples/demo-measured.csv', points } }));
    } finally {
      await engine.close();
    }
    const file = join(dir, 'report.html');
    writeFileSync(file, renderHtmlReport({ results, waveforms, design }));
    fileUrl = pathToFileURL(file).href;
    const big = syntheticStudy(results, waveforms);
    writeFileSync(join(dir, 'big.html'), renderHtmlReport({ ...big, design }));
    context = await chromium.launchPersistentContext(join(dir, 'profile'), { executablePath: CHROMIUM, args: ARGS, headless: true,
      viewport: { width: 1400, height: 900 } });
    page = await context.newPage();
    page.on('request', (r) => requests.push(r.url()));
    page.on('console', (m) => { if (m.type() === 'error') errors.push(m.text()); });
    page.on('pageerror', (e) => errors.push(e.message));
    await page.goto(fileUrl);
  }, 180_000);

  afterAll(async () => {
    await context?.close();
    rmSync(dir, { recursive: true, force: true });
  });

  it('loads only itself and logs no error', () => {
    expect(requests).toEqual([fileUrl]);
    expect(errors).toEqual([]);
  });

  it('draws every plot with its declared number of non-empty series', async () => {
    const plots = await page.$$eval('svg.plot', (svgs) => svgs.map((s) => {
      const kind = s.getAttribute('data-plot');
      const paths = Array.from(s.querySelectorAll(kind === 'gain' ? 'path.curve' : 'path.series')) as unknown as { getTotalLength(): number }[];
      return { kind, declared: Number(s.getAttribute('data-series')), lengths: paths.map((p) => p.getTotalLength()),
        box: s.getBoundingClientRect().width };
    }));
    const vins = new Set(results.corners.map((c) => c.inputs.vin));
    // one curve per load present at each Vin (the bench points add their own load, 10 A, at 390 V)
    const curves = [...vins].reduce((n, v) => n + new Set(results.corners.filter((c) => c.inputs.vin === v).map((c) => c.inputs.loadLabel)).size, 0);
    expect(curves).toBe(2 * 3 + 1);
    expect(plots.filter((p) => p.kind === 'gain')).toHaveLength(vins.size);
    expect(plots.filter((p) => p.kind === 'gain').reduce((n, p) => n + p.lengths.length, 0)).toBe(curves);
    // the nominal corner and every diverged or outside-limits one get a figure; the first WAVES_OPEN
    // are drawn at load, the rest wait in a collapsed block (the 200-corner test below opens it)
    const picked = waveformCorners(results);
    expect(picked.length).toBeGreaterThan(WAVES_OPEN); // the bench corners diverge too: both parts are exercised
    const drawn = picked.slice(0, WAVES_OPEN).filter((c) => waveforms.some((w) => w.id === c.id));
    expect(plots.filter((p) => p.kind === 'wave')).toHaveLength(drawn.length);
    // the demo's limits: frequency min and max, ZVS margin and six ratings, one stress figure each
    expect(plots.filter((p) => p.kind === 'stress')).toHaveLength(9);
    for (const p of plots.filter((x) => x.kind !== 'stress')) {
      expect(p.box).toBeGreaterThan(200);
      expect(p.lengths.length).toBe(p.declared);
      expect(p.declared).toBeGreaterThan(0);
      for (const l of p.lengths) expect(l).toBeGreaterThan(10); // px of drawn line
    }
  });

  it('draws the bench points as triangles on the gain plot with a legend entry, and lists them in the bench table', async () => {
    expect(results.measured?.points).toBe(3);
    const markers = await page.$$eval('#gain svg.plot path.pt-meas', (ps) => ps.map((p) => {
      const b = p.getBoundingClientRect();
      return { w: b.width, h: b.height, fill: p.getAttribute('fill') };
    }));
    expect(markers).toHaveLength(3);
    for (const m of markers) { expect(m.w).toBeGreaterThan(5); expect(m.h).toBeGreaterThan(5); }
    expect(await page.locator('#gain svg.plot[data-measured="3"]').count()).toBe(1); // all three at Vin 390 V
    const legend = page.locator('#gain .legend span', { hasText: 'measured on the bench' });
    expect(await legend.isVisible()).toBe(true);
    expect(await legend.locator('path.pt-meas').count()).toBe(1);
    expect(await page.locator('#bench tbody tr[id^="b-"]').count()).toBe(3);
    expect(await page.locator('#measured .caution').textContent()).toContain('probe and instrument error');
  });

  it('has one table row per corner; the status filter hides rows and counts them', async () => {
    const rows = page.locator('#cmp tbody tr');
    expect(await rows.count()).toBe(results.corners.length);
    const status = results.corners[0]!.status;
    const n = results.corners.filter((c) => c.status === status).length;
    await page.locator(`#cmp-filter input[data-status="${status}"]`).uncheck();
    expect(await page.locator('#cmp tbody tr:visible').count()).toBe(results.corners.length - n);
    expect(await page.locator('#cmp-count').textContent()).toBe(`${results.corners.length - n} of ${results.corners.length} corners shown`);
    await page.locator(`#cmp-filter input[data-status="${status}"]`).check();
    expect(await page.locator('#cmp tbody tr:visible').count()).toBe(results.corners.length);
  });

  it('sorts on a header click, numbers as numbers, both ways', async () => {
    const column = async (i: number) => page.$$eval('#cmp tbody tr', (trs, i) => trs.map((tr) => (tr as unknown as { cells: { textContent: string }[] }).cells[i]!.textContent.trim()), i);
    await page.locator('#cmp thead button', { hasText: /^Vin V$/ }).click();
    const vin = (await column(1)).map(Number);
    expect(vin).toEqual([...vin].sort((a, b) => a - b));
    await page.locator('#cmp thead button', { hasText: /^Vin V$/ }).click();
    expect((await column(1)).map(Number)).toEqual([...vin].sort((a, b) => b - a));
    // fs error column (index 7: corner, Vin, load, status, then fs FHA, ideal, sim, err) sorts by |error|: compare with the results themselves.
    await page.locator('#cmp thead button[data-col="7"]').click();
    const ids = (await column(0)).map((s) => s.replace(/\s*≋$/, ''));
    const fsErr = (id: string) => Math.abs(results.corners.find((c) => c.id === id)!.comparison.find((r) => r.metric === 'fs')!.error!);
    expect(ids.map(fsErr)).toEqual(ids.map(fsErr).sort((a, b) => a - b));
  });

  it('opens a row\'s divergence notes', async () => {
    const cell = page.locator('#cmp tbody tr td.notes').filter({ has: page.locator('button.more') }).first();
    await expect.poll(() => cell.locator('ul').isVisible()).toBe(false);
    await cell.locator('button.more').click();
    expect(await cell.locator('ul').isVisible()).toBe(true);
    expect(await cell.locator('li').count()).toBeGreaterThan(0);
  });

  it('writes a full-page screenshot to test-output/report.png', async () => {
    await page.goto(fileUrl);
    mkdirSync(new URL('../../test-output/', import.meta.url), { recursive: true });
    const png = await page.screenshot({ path: new URL('../../test-output/report.png', import.meta.url).pathname, fullPage: true });
    // a PNG of the whole page: signature, then IHDR width and height (bytes 16-23, big-endian)
    expect(png.subarray(1, 4).toString('latin1')).toBe('PNG');
    const height = (await page.evaluate('document.documentElement.scrollHeight')) as number;
    expect(png.readUInt32BE(16)).toBe(page.viewportSize()!.width);
    expect(png.readUInt32BE(20)).toBe(height);
    expect(height).toBeGreaterThan(page.viewportSize()!.height); // the report is longer than one screen
  });

  it('opens a 200-corner report and draws the deferred waveform figures on demand', async () => {
    const big = await context.newPage();
    const bigErrors: string[] = [];
    big.on('pageerror', (e) => bigErrors.push(e.message));
    big.on('console', (m) => { if (m.type() === 'error') bigErrors.push(m.text()); });
    const t0 = Date.now();
    await big.goto(pathToFileURL(join(dir, 'big.html')).href);
    expect(Date.now() - t0).toBeLessThan(15_000); // sanity bound for a loaded 2-core CI machine, not a benchmark
    expect(await big.locator('#cmp tbody tr').count()).toBe(200);
    const before = await big.locator('svg.plot.wave').count();
    expect(before).toBe(WAVES_OPEN);
    await big.locator('#more-waves > summary').click();
    // the figures are drawn by the details element's toggle event, after the click returns
    await big.waitForFunction(`document.querySelectorAll('svg.plot.wave').length > ${before}`, undefined, { timeout: 10_000 });
    expect(await big.locator('svg.plot.wave').count()).toBeGreaterThan(before);
    expect(bigErrors).toEqual([]);
    await big.close();
  });
});
