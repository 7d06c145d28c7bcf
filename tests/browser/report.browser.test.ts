// The HTML report in headless Chromium: a real demo run (system ngspice), loaded from a file:// URL.
// Needs Debian's chromium: the engine tier's global setup stops with one line when it is missing.
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { chromium, type BrowserContext, type Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { loadDesignOrThrow } from '../../src/design/load.js';
import { createNgspiceEngine } from '../../src/engine/native.js';
import { renderHtmlReport } from '../../src/report/html/index.js';
import { WAVES_OPEN } from '../../src/report/html/waveforms.js';
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
      ({ results, waveforms } = await runStudy(design, { engine, jobs: 2 }));
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
    const loads = new Set(results.corners.map((c) => c.inputs.loadLabel)).size;
    const vins = new Set(results.corners.map((c) => c.inputs.vin)).size;
    expect(plots.filter((p) => p.kind === 'gain')).toHaveLength(vins);
    expect(plots.filter((p) => p.kind === 'gain').reduce((n, p) => n + p.lengths.length, 0)).toBe(loads * vins);
    const drawn = waveforms.filter((w) => results.corners.some((c) => c.id === w.id && (c.status === 'diverged' || c.status === 'outside-limits' || c.id.endsWith('_nom'))));
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
