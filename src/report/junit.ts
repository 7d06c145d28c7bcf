import type { CornerResult, Results } from '../results/types.js';
import type { LimitCheck } from '../limits/types.js';
import { describeCheck } from '../limits/describe.js';
import { failingDivergences, type FailOn } from '../results/gate.js';
import { plain } from '../units/display.js';

export function xmlEscape(s: string): string {
  return s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&apos;' })[c]!)
    // XML 1.0 forbids most control characters even when escaped.
    .replace(/[\u0000-\u0008\u000b\u000c\u000e-\u001f]/g, '');
}

export interface JunitOptions {
  /** Which divergences fail a corner's test case (results/gate.ts). @default 'default' */
  failOn?: FailOn;
}

type Outcome = { kind: 'pass'; out?: string } | { kind: 'failure' | 'error'; message: string; text: string } | { kind: 'skipped'; message: string };

function testcase(cls: string, name: string, o: Outcome): string {
  const head = `  <testcase classname="${xmlEscape(cls)}" name="${xmlEscape(name)}" time="0"`;
  if (o.kind === 'pass') return o.out ? `${head}>\n    <system-out>${xmlEscape(o.out)}</system-out>\n  </testcase>` : `${head}/>`;
  if (o.kind === 'skipped') return `${head}>\n    <skipped message="${xmlEscape(o.message)}"/>\n  </testcase>`;
  return `${head}>\n    <${o.kind} message="${xmlEscape(o.message)}">${xmlEscape(o.text)}</${o.kind}>\n  </testcase>`;
}

const divLine = (d: CornerResult['divergences'][number]): string => {
  const cause = d.cause;
  return `${d.metric}: FHA ${fmt(d.fha)}, sim ${fmt(d.sim)}${d.error !== null ? `, error ${(d.error * 100).toFixed(2)} % (tolerance ${((d.tolerance ?? 0) * 100).toFixed(1)} %)` : ''}${d.unexpectedSign ? ' [sign contradicts FHA theory]' : ''}${cause ? ` [${cause}]` : ''} - ${d.reason}`;
};

/** The corner's own test case: the simulation ran, settled and has no divergence that fails the run. */
function cornerOutcome(c: CornerResult, failOn: FailOn): Outcome {
  if (c.status === 'failed') return { kind: 'error', message: `${c.failure?.kind ?? 'failed'}: ${c.failure?.message ?? ''}`, text: c.failure?.detail ?? '' };
  if (c.status === 'unreachable' && c.sim) {
    // simulated and found out of reach: a failed design check with its reason, not a tool error
    return { kind: 'failure', message: 'unreachable', text: [c.failure?.message ?? 'target output unreachable', ...c.divergences.map((d) => `${d.metric}: ${d.reason}`)].join('\n') };
  }
  if (c.status === 'predicted' || c.status === 'unreachable') return { kind: 'skipped', message: 'not simulated' };
  const failing = failingDivergences(c, failOn);
  const lines = failing.map(divLine);
  if (c.status === 'not-settled') {
    lines.unshift(`not settled after ${c.sim?.cycles ?? 0} cycles (settle error ${((c.sim?.settleError ?? 0) * 100).toFixed(3)} %)`);
    return { kind: 'failure', message: 'not settled', text: lines.join('\n') };
  }
  if (failing.length) {
    const what = failOn === 'divergence' ? 'metric(s) beyond tolerance' : 'unexplained divergence(s)';
    return { kind: 'failure', message: `${failing.length} ${what}`, text: lines.join('\n') };
  }
  const explained = c.divergences.map(divLine);
  return { kind: 'pass', ...(explained.length ? { out: `divergences with a known cause:\n${explained.join('\n')}` } : {}) };
}

/** One limit at one corner: fails when the simulation is outside the bound. */
function checkOutcome(c: CornerResult, k: LimitCheck): Outcome {
  if (c.status === 'failed') return { kind: 'skipped', message: 'the corner failed to simulate' };
  if (!k.sim) return { kind: 'skipped', message: `not simulated; ${describeCheck(k)}` };
  if (k.sim.within === null) return { kind: 'skipped', message: `no simulated value; ${describeCheck(k)}` };
  if (!k.sim.within) return { kind: 'failure', message: `${k.limit} outside${k.flip ? ' (FHA said within)' : ''}`, text: describeCheck(k) };
  return { kind: 'pass', ...(k.flip ? { out: describeCheck(k) } : {}) };
}

/**
 * JUnit XML: per corner one test case for the simulation and its comparison with FHA (name: the
 * corner id), and one per corner and limit (name `corner: limit`, class `tankcheck.<design>.limits`),
 * so a CI dashboard names the failing limit. Divergences fail a corner's case as the exit code does
 * (`failOn`); a corner that failed to simulate is an error with the simulator's reason.
 */
export function renderJunit(results: Results, opts: JunitOptions = {}): string {
  const failOn = opts.failOn ?? 'default';
  const cls = `tankcheck.${results.design.name}`;
  const cases: { xml: string; kind: Outcome['kind'] }[] = [];
  for (const c of results.corners) {
    const o = cornerOutcome(c, failOn);
    cases.push({ xml: testcase(cls, c.id, o), kind: o.kind });
    for (const k of c.checks ?? []) {
      const ko = checkOutcome(c, k);
      cases.push({ xml: testcase(`${cls}.limits`, `${c.id}: ${k.limit}`, ko), kind: ko.kind });
    }
    if (c.measured) {
      const mo = measuredOutcome(c);
      cases.push({ xml: testcase(`${cls}.measured`, `${c.id}: vs bench (line ${c.measured.line})`, mo), kind: mo.kind });
    }
  }
  const n = (k: Outcome['kind']) => cases.filter((x) => x.kind === k).length;
  const counts = `tests="${cases.length}" failures="${n('failure')}" errors="${n('error')}"`;
  return `<?xml version="1.0" encoding="UTF-8"?>\n<testsuites ${counts}>\n<testsuite name="${xmlEscape(`tankcheck ${results.design.name}`)}" ${counts} skipped="${n('skipped')}">\n${cases.map((x) => x.xml).join('\n')}\n</testsuite>\n</testsuites>\n`;
}

/** A measured point's case: a failure when the simulation misses it by more than compare.measured. */
function measuredOutcome(c: CornerResult): Outcome {
  const m = c.measured!;
  if (m.within === null) return { kind: 'skipped', message: 'not simulated' };
  const gaps = Object.entries(m.errors.sim ?? {}).map(([k, e]) => `${k}: measured ${fmt((m as unknown as Record<string, number>)[k])}, sim ${fmt((c.sim as unknown as Record<string, number>)[k])}, gap ${(e * 100).toFixed(2)} %`);
  return m.within ? { kind: 'pass', out: gaps.join('\n') }
    : { kind: 'failure', message: `simulation misses the measured point by more than ${(m.tolerance * 100).toFixed(1)} %`, text: gaps.join('\n') };
}

const fmt = (v: unknown): string => plain(v, 5);
