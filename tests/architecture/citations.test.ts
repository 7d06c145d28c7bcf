import { readdirSync, readFileSync } from 'node:fs';
import { join, relative } from 'node:path';
import { describe, expect, it } from 'vitest';
import { REPO_ROOT } from '../support/shared.js';

/** Text files of the repository that users or contributors read (not node_modules, not build output). */
function files(dir: string): string[] {
  return readdirSync(join(REPO_ROOT, dir), { withFileTypes: true, recursive: true })
    .filter((e) => e.isFile() && /\.(ts|mts|mjs|js|md|json|yaml|cir)$/.test(e.name))
    .map((e) => join(e.parentPath, e.name));
}
const TREES = ['src', 'tests', 'bench', 'docs', 'examples', 'templates', 'scripts', 'schema', 'shared'];
const all = [...TREES.flatMap(files), join(REPO_ROOT, 'README.md'), join(REPO_ROOT, 'DEVELOPERS.md')];
const rel = (f: string) => relative(REPO_ROOT, f);

describe('citations stay inside the repository', () => {
  // spelled in pieces so that this file does not match itself
  const outside = [['method', 'reference'].join('[- ]'), ['engine', 'notes'].join('[- ]'), '/work/' + 'shared', '\\.\\./' + 'shared'];
  it('no file points at a document outside the repository', () => {
    const re = new RegExp(outside.join('|'), 'i');
    const hits = all.flatMap((f) => readFileSync(f, 'utf8').split('\n').flatMap((l, i) => (re.test(l) ? [`${rel(f)}:${i + 1}: ${l.trim().slice(0, 100)}`] : [])));
    // the repository's own shared/ folder: reach it with sharedFile() of tests/support/shared.ts
    expect(hits, 'cite published works or docs/; reach shared/ through sharedFile()').toEqual([]);
  });

  it('every section of docs/method.md named anywhere exists as an anchor there', () => {
    const anchors = new Set([...readFileSync(join(REPO_ROOT, 'docs', 'method.md'), 'utf8').matchAll(/<a id="([a-z0-9-]+)"><\/a>/g)].map((m) => m[1]));
    expect(anchors.size).toBeGreaterThan(20);
    const named = all.flatMap((f) => {
      const text = readFileSync(f, 'utf8');
      const direct = [...text.matchAll(/docs\/method\.md#([a-z0-9-]+)/g)].map((m) => m[1]!);
      // reasons name their section through compare/reasons.ts doc('...'); a comma list "#a, #b" continues the first
      const viaDoc = [...text.matchAll(/\bdoc\('([a-z0-9-]+)'\)/g)].map((m) => m[1]!);
      const listed = [...text.matchAll(/docs\/method\.md#[a-z0-9-]+((?:, #[a-z0-9-]+)+)/g)].flatMap((m) => [...m[1]!.matchAll(/#([a-z0-9-]+)/g)].map((x) => x[1]!));
      return [...direct, ...viaDoc, ...listed].map((a) => ({ file: rel(f), anchor: a }));
    });
    expect(named.length).toBeGreaterThan(20);
    expect(named.filter((n) => !anchors.has(n.anchor))).toEqual([]);
  });
});
