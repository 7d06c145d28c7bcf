import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { importsOf, readLayers, violations, type Layers } from './boundary.js';

const ROOT = join(import.meta.dirname, '..', '..');
const SRC = join(ROOT, 'src');
const layers = readLayers(readFileSync(join(ROOT, 'DEVELOPERS.md'), 'utf8'));

/** Production sources of a folder (tests and test support are allowed to read fixtures). */
function sources(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true, recursive: true })
    .filter((e) => e.isFile() && /\.(ts|mts|js|mjs)$/.test(e.name) && !/\.test\.ts$|\.test-support\.ts$/.test(e.name))
    .map((e) => join(e.parentPath, e.name));
}

describe('dependency direction (folder lists read from DEVELOPERS.md)', () => {
  it('lists the folders the rule names', () => {
    for (const f of ['units', 'design', 'corners', 'fha', 'tdmodel', 'netlist', 'measure', 'compare', 'report', 'results']) expect(layers.pure).toContain(f);
    expect(layers.edge).toEqual(expect.arrayContaining(['engine', 'run', 'cli']));
  });

  it('classifies every folder of src/ as pure or edge', () => {
    const folders = readdirSync(SRC, { withFileTypes: true }).filter((e) => e.isDirectory()).map((e) => e.name);
    const unlisted = folders.filter((f) => !layers.pure.includes(f) && !layers.edge.includes(f));
    expect(unlisted, 'add each new folder to "Pure folders" or "Edge folders" in DEVELOPERS.md').toEqual([]);
  });

  it('no pure folder imports Node I/O, engine/, run/ or cli/, or reads the clock, randomness or env', () => {
    const found = layers.pure.flatMap((folder) => {
      let files: string[];
      try { files = sources(join(SRC, folder)); } catch { return []; } // a listed folder not created yet
      return files.flatMap((f) => violations(SRC, f, readFileSync(f, 'utf8'), layers));
    });
    expect(found).toEqual([]);
  });
});

describe('the boundary check itself', () => {
  const L: Layers = { pure: ['fha', 'units'], edge: ['engine', 'run', 'cli'], pureRootFiles: ['version.ts'], adapters: ['fha/disk.ts'] };
  const at = (rel: string) => join(SRC, rel);

  it('finds static, re-export, side-effect, dynamic and require imports, not commented ones', () => {
    const src = [
      "import { a } from './a.js';", "import type { B } from '../b.js';", "export { c } from './c.js';",
      "import './d.js';", "const e = await import('./e.js');", "const f = require('f');",
      "// import { g } from 'node:fs';", '/* import h from "node:os"; */',
    ].join('\n');
    expect(importsOf(src)).toEqual(['./a.js', '../b.js', './c.js', './d.js', './e.js', 'f']);
  });

  it('reports Node built-ins, edge folders, unlisted folders, impure globals; passes pure imports', () => {
    const bad = [
      "import { readFileSync } from 'node:fs';", "import { join } from 'path';",
      "import { runStudy } from '../run/study.js';", "import { x } from '../engine/types.js';",
      "import { y } from '../other/y.js';", "import { z } from '../index.js';",
      'const t = Date.now();', 'const r = Math.random();', 'const v = process.env.HOME;',
    ].join('\n');
    expect(violations(SRC, at('fha/gain.ts'), bad, L)).toHaveLength(9);
    const good = "import { q } from '../units/parse.js';\nimport { TOOL_VERSION } from '../version.js';\nimport YAML from 'yaml';\nconst d = new Date(0);";
    expect(violations(SRC, at('fha/gain.ts'), good, L)).toEqual([]);
  });

  it('leaves edge folders and listed adapters alone', () => {
    const io = "import { readFileSync } from 'node:fs';";
    expect(violations(SRC, at('run/files.ts'), io, L)).toEqual([]);
    expect(violations(SRC, at('fha/disk.ts'), io, L)).toEqual([]);
  });

  it('reads the lists from the labelled lines', () => {
    const md = ['# x', '- Pure folders: `units` `fha/`', '- Edge folders: `run`', '- Pure files in src: `version.ts`', '- Adapters inside pure folders: `design/load.ts` (reads files)'].join('\n');
    expect(readLayers(md)).toEqual({ pure: ['units', 'fha'], edge: ['run'], pureRootFiles: ['version.ts'], adapters: ['design/load.ts'] });
  });
});
