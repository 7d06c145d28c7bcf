import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { EXIT, EXIT_TABLE, exitCodeFor, renderExitTable } from './exit.js';
import type { Results } from '../results/types.js';

const results = (over: Partial<Results['summary']>, corners: unknown[] = [], extra: Partial<Results> = {}): Results =>
  ({ corners, summary: { failed: 0, ...over }, ...extra } as unknown as Results);
const explained = { id: 'a', status: 'diverged', checks: [], divergences: [{ metric: 'gain', cause: 'approximation' }] };

describe('exit codes', () => {
  it('one table with every code, in code order', () => {
    expect(EXIT_TABLE.map((e) => e.code)).toEqual(Object.values(EXIT).sort((a, b) => a - b));
    expect(renderExitTable().split('\n')).toHaveLength(EXIT_TABLE.length);
  });
  it('README shows the same table, row for row', () => {
    const readme = readFileSync(new URL('../../README.md', import.meta.url), 'utf8');
    const section = readme.slice(readme.indexOf('### Exit codes'), readme.indexOf('### Output files'));
    const rows = [...section.matchAll(/^\| (\d+) \| (.+) \|$/gm)].map((m) => ({ code: Number(m[1]), meaning: m[2] }));
    expect(rows).toEqual(EXIT_TABLE);
  });
  it('interrupted > failed > checks; explained divergences pass unless failOn divergence', () => {
    expect(exitCodeFor(results({}, [explained]))).toBe(EXIT.ok);
    expect(exitCodeFor(results({}, [explained]), 'divergence')).toBe(EXIT.diverged);
    expect(exitCodeFor(results({}, [{ ...explained, divergences: [{ metric: 'gain' }] }]))).toBe(EXIT.diverged);
    expect(exitCodeFor(results({ failed: 1 }, [{ ...explained, status: 'failed' }]))).toBe(EXIT.failed);
    expect(exitCodeFor(results({}, [], { incomplete: true }))).toBe(EXIT.interrupted);
  });
});
