import { describe, expect, it } from 'vitest';
import { renderHtmlReport } from './index.js';
import { limitText, renderLimits, renderMissed, STRESS_ROWS_MAX } from './limits.js';
import { predictStudy } from '../../run/study.js';
import { makeDesign } from '../../../tests/support/design.js';

// Worked-example design (FHA Cr peak 392.7 V at 90 kHz, Vin 400 V), with invented limits.
const design = makeDesign({ operating: { vin: [380, 400] }, limits: { frequency: { min: 60e3, max: 150e3 }, zvs: 'ignore', crVoltage: 450, derating: 0.9 } });
const results = predictStudy(design);
const [a, b] = results.corners;
for (const c of [a!, b!]) {
  c.status = 'ok';
  for (const k of c.checks!) k.sim = { ...k.fha };
}
const cr = a!.checks!.find((k) => k.limit === 'crVoltage')!;
a!.status = 'outside-limits';
cr.sim = { value: 420, within: false }; // bound 450 V x 0.9 = 405 V
cr.flip = true;

describe('limits in the HTML report', () => {
  it('"FHA missed this" names the corner and the limit, with the values and the bound', () => {
    const html = renderMissed(results);
    expect(html).toContain('FHA missed this: 1 limit check(s)');
    expect(html).toContain(`${a!.id}</a> crVoltage: sim 420 V OUTSIDE`);
    expect(html).toContain('bound &lt;= 405 V (FHA missed this)');
    const clean = structuredClone(results);
    clean.corners[0]!.checks!.find((k) => k.limit === 'crVoltage')!.flip = false;
    expect(renderMissed(clean)).toContain('FHA missed nothing');
  });
  it('the corner map says the limit verdict in text, not colour alone', () => {
    expect(limitText(a!)).toBe('! outside crVoltage · FHA missed');
    expect(limitText(b!)).toBe('✓ within limits');
  });
  it('one stress figure per numeric limit with the bound, and the rating when derated', () => {
    const html = renderLimits(results, design);
    expect(html.match(/data-plot="stress"/g)).toHaveLength(3); // frequency.min, frequency.max, crVoltage
    expect(html).toContain('data-limit="crVoltage"');
    expect(html).toContain('bound &lt;= 405 V');
    expect(html).toContain('rating 450 V');
    expect(html).toMatch(/class="pt-sim out"/);
  });
  it('the page has the list at the top, the frequency band on the gain plot and outside-limits in the status key', () => {
    const html = renderHtmlReport({ results, waveforms: [], design });
    expect(html.indexOf('FHA missed this')).toBeLessThan(html.indexOf('id="gain"'));
    expect(html.match(/<rect class="fwindow"/g)).toHaveLength(2); // one panel per Vin
    expect(html).toContain('! outside limits');
    expect(html).not.toContain('? outside-limits');
  });
  it('a large study shows the corners closest to each bound, closest first, and says so', () => {
    const many = structuredClone(results);
    many.corners = Array.from({ length: STRESS_ROWS_MAX + 10 }, (_, i) => {
      const c = structuredClone(results.corners[1]!);
      c.id = `c${i}`;
      c.checks!.find((k) => k.limit === 'crVoltage')!.sim = { value: 300 + i, within: true };
      return c;
    });
    const html = renderLimits(many, design);
    expect(html).toContain(`crVoltage: the ${STRESS_ROWS_MAX} of ${STRESS_ROWS_MAX + 10} corners closest to the bound`);
    const fig = html.slice(html.indexOf('data-limit="crVoltage"'));
    expect(fig.indexOf(`>c${STRESS_ROWS_MAX + 9}<`)).toBeLessThan(fig.indexOf(`>c${STRESS_ROWS_MAX + 8}<`));
    expect(fig).not.toContain('>c0<');
  });
});
