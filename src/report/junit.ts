import type { Results } from '../results/types.js';

export function xmlEscape(s: string): string {
  return s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&apos;' })[c]!)
    // XML 1.0 forbids most control characters even when escaped.
    .replace(/[\u0000-\u0008\u000b\u000c\u000e-\u001f]/g, '');
}

/**
 * JUnit XML: one test case per corner; a diverged or not-settled corner is a failure listing its
 * divergences, a corner that failed to simulate is an error with the simulator's reason.
 */
export function renderJunit(results: Results): string {
  const cases = results.corners.map((c) => {
    const name = xmlEscape(c.id);
    const cls = xmlEscape(`tankcheck.${results.design.name}`);
    const time = '0';
    if (c.status === 'failed') {
      const msg = xmlEscape(`${c.failure?.kind ?? 'failed'}: ${c.failure?.message ?? ''}`);
      return `  <testcase classname="${cls}" name="${name}" time="${time}">\n    <error message="${msg}">${xmlEscape(c.failure?.detail ?? '')}</error>\n  </testcase>`;
    }
    if (c.status === 'diverged' || c.status === 'not-settled') {
      const lines = c.divergences.map((d) => `${d.metric}: FHA ${fmt(d.fha)}, sim ${fmt(d.sim)}${d.error !== null ? `, error ${(d.error * 100).toFixed(2)} % (tolerance ${((d.tolerance ?? 0) * 100).toFixed(1)} %)` : ''}${d.unexpectedSign ? ' [sign contradicts FHA theory]' : ''} - ${d.reason}`);
      if (c.status === 'not-settled') lines.unshift(`not settled after ${c.sim?.cycles ?? 0} cycles (settle error ${((c.sim?.settleError ?? 0) * 100).toFixed(3)} %)`);
      const msg = xmlEscape(c.status === 'not-settled' ? 'not settled' : `${c.divergences.length} metric(s) beyond tolerance`);
      return `  <testcase classname="${cls}" name="${name}" time="${time}">\n    <failure message="${msg}">${xmlEscape(lines.join('\n'))}</failure>\n  </testcase>`;
    }
    if (c.status === 'predicted' || c.status === 'unreachable') return `  <testcase classname="${cls}" name="${name}" time="${time}">\n    <skipped message="not simulated"/>\n  </testcase>`;
    return `  <testcase classname="${cls}" name="${name}" time="${time}"/>`;
  });
  const s = results.summary;
  const failures = s.diverged + s.notSettled;
  const skipped = s.predicted + s.unreachable;
  return `<?xml version="1.0" encoding="UTF-8"?>\n<testsuites tests="${s.corners}" failures="${failures}" errors="${s.failed}">\n<testsuite name="${xmlEscape(`tankcheck ${results.design.name}`)}" tests="${s.corners}" failures="${failures}" errors="${s.failed}" skipped="${skipped}">\n${cases.join('\n')}\n</testsuite>\n</testsuites>\n`;
}

function fmt(v: unknown): string {
  return typeof v === 'number' ? Number(v.toPrecision(5)).toString() : String(v);
}
