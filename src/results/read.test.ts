import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { readResults, readWaveforms, MAX_PROBLEMS } from './read.js';
import { formatProblem } from '../design/problem.js';
import { renderResultsJson, renderWaveformsJson } from '../report/json.js';
import { predictStudy } from '../run/study.js';
import { loadDemo } from '../../tests/support/demo.js';
import { sharedFile } from '../../tests/support/shared.js';

const shared = (name: string): string => readFileSync(sharedFile('report', name), 'utf8');
const lines = (r: ReturnType<typeof readResults> | ReturnType<typeof readWaveforms>): string[] => (r.ok ? [] : r.problems.map((p) => formatProblem(p, 'unused')));

describe('readResults', () => {
  it('reads back what tankcheck writes: an FHA-only study and the recorded demo run', async () => {
    const written = renderResultsJson(predictStudy(await loadDemo()));
    const r = readResults(written, 'r.json');
    expect(r.ok && renderResultsJson(r.value)).toBe(written);
    const recorded = readResults(shared('demo-results.json'), 'demo-results.json');
    expect(lines(recorded)).toEqual([]);
    expect(recorded.ok && recorded.value.corners.length).toBe(6);
    // summary counts added after results@1 first shipped: an older file (a baseline) reads with them at 0
    const old = JSON.parse(written);
    delete old.summary.outsideLimits;
    delete old.summary.flips;
    const r2 = readResults(JSON.stringify(old), 'old.json');
    expect(r2.ok && [r2.value.summary.outsideLimits, r2.value.summary.flips]).toEqual([0, 0]);
  });

  it('a truncated file is a JSON problem with the line and column where it ends', async () => {
    const text = renderResultsJson(predictStudy(await loadDemo())).slice(0, 40);
    expect(text.split('\n')).toHaveLength(3);
    expect(lines(readResults(text, 'cut.json'))).toEqual([`cut.json:3:${text.split('\n')[2]!.length + 1}: not valid JSON: the file ends early (truncated?)`]);
  });

  it('hand-edited or partial files name the JSON path at fault', async () => {
    const good = JSON.parse(renderResultsJson(predictStudy(await loadDemo())));
    const edit = (f: (r: any) => void): string[] => { // eslint-disable-line @typescript-eslint/no-explicit-any
      const copy = structuredClone(good);
      f(copy);
      return lines(readResults(JSON.stringify(copy), 'r.json'));
    };
    expect(edit((r) => { r.corners = [null]; })).toEqual(['r.json: corners[0]: expected an object, got null']);
    expect(edit((r) => { delete r.corners; })).toEqual(['r.json: corners: missing']);
    expect(edit((r) => { r.corners[2].fha = null; })).toEqual(['r.json: corners[2].fha: expected an object, got null']);
    expect(edit((r) => { r.corners[1].fha.gain = 'high'; r.corners[0].status = 'great'; })).toEqual([
      'r.json: corners[0].status: expected one of "predicted", "unreachable", "ok", "diverged", "failed", "not-settled", "outside-limits", "screened", got "great"',
      'r.json: corners[1].fha.gain: expected a number or null, got "high"',
    ]);
    expect(edit((r) => { r.corners[1].id = r.corners[0].id; })).toEqual([`r.json: corners[1].id: corner "${good.corners[0].id}" appears twice`]);
    expect(edit((r) => { r.schema = 'tankcheck/results@9'; })).toEqual(['r.json: schema: expected "tankcheck/results@1", got "tankcheck/results@9"']);
    expect(edit((r) => { r.summary.worst = {}; r.corners[0].inputs.tolerance.lr = 2; })).toEqual([
      'r.json: corners[0].inputs.tolerance.lr: expected -1, 0 or 1, got 2',
      'r.json: summary.worst: expected a list, got an object',
    ]);
    // a field a newer tankcheck adds is not a problem
    expect(edit((r) => { r.corners[0].extra = { any: 1 }; })).toEqual([]);
  });

  it('lists at most MAX_PROBLEMS problems and counts the rest', () => {
    const r = readResults(JSON.stringify({ schema: 'tankcheck/results@1', corners: Array.from({ length: 30 }, () => 1) }), 'r.json');
    const l = lines(r);
    expect(l).toHaveLength(MAX_PROBLEMS + 1);
    expect(l[MAX_PROBLEMS]).toMatch(/^r\.json: \d+ more problems not shown$/);
  });

  it('something that is not a results file at all', () => {
    expect(lines(readResults('[1, 2]', 'a.json'))).toEqual(['a.json: expected an object, got a list']);
    expect(lines(readResults('', 'empty.json'))).toEqual(['empty.json:1:1: not valid JSON: the file ends early (truncated?)']);
  });
});

describe('readWaveforms', () => {
  it('reads back the written file and the recorded demo waveforms', () => {
    const excerpt = { id: 'a', fs: 1e5, t: [0, 1e-6], series: { vout: [24, 24.1] }, edges: [0] };
    const r = readWaveforms(renderWaveformsJson([excerpt]), 'w.json');
    expect(r.ok && r.value).toEqual([excerpt]);
    expect(lines(readWaveforms(shared('demo-waveforms.json'), 'demo-waveforms.json'))).toEqual([]);
  });

  it('a series with fewer points than the time axis, and a missing corners list, are problems', () => {
    const bad = { schema: 'tankcheck/waveforms@1', corners: [{ id: 'a', fs: 1e5, t: [0, 1, 2], series: { vout: [1, 2] }, edges: [] }] };
    expect(lines(readWaveforms(JSON.stringify(bad), 'w.json'))).toEqual(['w.json: corners[0].series.vout: has 2 values for 3 time points']);
    expect(lines(readWaveforms('{"schema":"tankcheck/waveforms@1"}', 'w.json'))).toEqual(['w.json: corners: missing']);
  });
});
