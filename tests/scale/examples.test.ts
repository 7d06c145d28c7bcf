// The CI and Kubernetes examples parse as YAML and hold the commands docs/scale.md states, with flags the CLI has.
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { parse, parseAllDocuments } from 'yaml';
import type { Command } from 'commander';
import { program } from '../../src/cli/main.js';

const root = fileURLToPath(new URL('../../', import.meta.url));
const read = (f: string) => readFileSync(`${root}${f}`, 'utf8');

/** Every `tankcheck <command> ...` line in a text, joined across YAML folding and shell continuations. */
function commandLines(text: string): string[] {
  const flat = text.replace(/\\\n\s*/g, ' ');
  return [...flat.matchAll(/tankcheck (run|merge|decks|cache prune)\b[^\n|]*/g)].map((m) => m[0].trim());
}

/** Each --flag of a command line must be an option of that command in the commander program. */
function checkFlags(line: string): void {
  const words = line.split(/\s+/);
  const name = words[1]!;
  let cmd = program().commands.find((c) => c.name() === name) as Command | undefined;
  if (name === 'cache') cmd = cmd?.commands.find((c) => c.name() === 'prune');
  expect(cmd, line).toBeDefined();
  const known = new Set(cmd!.options.flatMap((o) => [o.long, o.short].filter(Boolean)));
  for (const w of words.filter((x) => x.startsWith('-'))) expect(known.has(w.split('=')[0]), `${w} in: ${line}`).toBe(true);
}

describe('examples/ci', () => {
  it('the workflow parses and runs shards then a merge with existing flags', () => {
    const wf = parse(read('examples/ci/github-actions.yml'));
    expect(wf.jobs.shard.strategy.matrix.shard).toEqual([1, 2, 3]);
    expect(wf.jobs.merge.needs).toBe('shard');
    const runs = [...wf.jobs.shard.steps, ...wf.jobs.merge.steps].flatMap((s: { run?: string }) => (s.run ? commandLines(s.run) : []));
    expect(runs.some((l) => l.startsWith('tankcheck run') && l.includes('--shard'))).toBe(true);
    expect(runs.some((l) => l.startsWith('tankcheck merge'))).toBe(true);
    runs.forEach(checkFlags);
  });

  it('the Indexed Job has completions = parallelism, reads JOB_COMPLETION_INDEX and merges', () => {
    const docs = parseAllDocuments(read('examples/ci/k8s-indexed-job.yaml')).map((d) => d.toJS());
    const [shards, merge] = docs;
    expect(shards.spec.completionMode).toBe('Indexed');
    expect(shards.spec.completions).toBe(shards.spec.parallelism);
    const args = (job: { spec: { template: { spec: { containers: { args: string[] }[] } } } }) => job.spec.template.spec.containers[0]!.args.join(' ');
    const lines = [...commandLines(args(shards)), ...commandLines(args(merge))];
    expect(lines[0]).toMatch(/--shard-index-env JOB_COMPLETION_INDEX --shard 3\b/);
    expect(lines[1]).toMatch(/^tankcheck merge( \/work\/parts\/part-\d){3} /);
    lines.forEach(checkFlags);
  });

  it('docs/scale.md states the commands the examples hold, with existing flags', () => {
    // the command blocks only (```sh), not the prose around them
    const doc = [...read('docs/scale.md').matchAll(/```sh\n([\s\S]*?)```/g)].map((m) => m[1]).join('\n');
    const lines = commandLines(doc);
    expect(lines.length).toBeGreaterThanOrEqual(6);
    lines.forEach(checkFlags);
    const wf = commandLines(read('examples/ci/github-actions.yml'));
    const k8s = parseAllDocuments(read('examples/ci/k8s-indexed-job.yaml')).flatMap((d) => commandLines(d.toJS().spec.template.spec.containers[0].args.join(' ')));
    for (const l of [...wf, ...k8s]) expect(lines.map((x) => x.replace(/\s+/g, ' ')), l).toContain(l.replace(/\s+/g, ' ').replace(/ \|\|.*$/, ''));
  });
});
