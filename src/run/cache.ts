import { createHash } from 'node:crypto';
import { mkdir, readFile } from 'node:fs/promises';
import { join } from 'node:path';
import type { Design } from '../design/types.js';
import type { Corner } from '../corners/types.js';
import type { CornerCache } from './study.js';
import type { CornerOutcome } from './corner.js';
import { buildDeck } from '../netlist/deck.js';
import type { StartPoint } from '../plan/start.js';
import { fsReason, writeFilesAtomic } from './files.js';
import { checkCornerOutcome } from '../results/read.js';
import { TOOL_VERSION } from '../version.js';

/** Bump when the simulation or measurement method changes, so old entries are not reused. */
export const CACHE_FORMAT = 4;

/** Options of the file cache. */
export interface FileCacheOptions {
  /** Called with a one-line warning when an entry is ignored or cannot be written (the run goes on). */
  onWarning?: (message: string) => void;
}

/** What a cache file holds: the entry's own key and corner id, checked on every read. */
interface Entry {
  format: number;
  key: string;
  corner: string;
  outcome: CornerOutcome;
}

/**
 * Content-addressed corner cache on disk. The key hashes the corner's first deck (every circuit
 * value, the seed and the step profile), the engine version, the measurement and settling settings
 * and the tool version; the value is the simulated outcome (comparison is redone on load).
 * The cache is only an accelerator: an entry that does not parse, is not the one asked for (a file
 * copied over another) or does not have the shape of a corner outcome is a miss with a warning, and an
 * entry that cannot be written is a warning; neither stops the run.
 */
export function createFileCache(dir: string, options: FileCacheOptions = {}): CornerCache {
  const warn = options.onWarning ?? (() => {});
  let writeWarned = false;
  const pathOf = (key: string): string => join(dir, key.slice(0, 2), `${key}.json`);
  return {
    key(design: Design, corner: Corner, engineVersion: string, start: StartPoint): string {
      const deck = buildDeck({ design, corner, fs: start.fs, seed: start.seed, cycles: 24, saveCycles: 24 });
      const h = createHash('sha256');
      // the confirm budget picks which corners are simulated, it changes none of them
      h.update(JSON.stringify({ CACHE_FORMAT, TOOL_VERSION, engineVersion, deck: deck.text, sim: { ...design.simulation, confirm: undefined }, target: design.output.voltage, slope: start.slope, regulated: corner.fs === null }));
      return h.digest('hex');
    },
    async get(key: string, cornerId: string): Promise<CornerOutcome | undefined> {
      const file = pathOf(key);
      let text: string;
      try {
        text = await readFile(file, 'utf8');
      } catch {
        return undefined; // not cached yet (or unreadable): simulate
      }
      const why = entryProblem(text, key, cornerId);
      if (why === undefined) return (JSON.parse(text) as Entry).outcome;
      warn(`cache entry ${file} ignored (${why}); corner ${cornerId} is simulated again`);
      return undefined;
    },
    async set(key: string, value: CornerOutcome): Promise<void> {
      const entry: Entry = { format: CACHE_FORMAT, key, corner: value.result.id, outcome: value };
      try {
        await mkdir(join(dir, key.slice(0, 2)), { recursive: true });
        await writeFilesAtomic([{ path: pathOf(key), text: JSON.stringify(entry) }]);
      } catch (e) {
        if (!writeWarned) warn(`cache ${dir} cannot be written (${fsReason(e)}); the run goes on without storing results`);
        writeWarned = true;
      }
    },
  };
}

/** Why a cache file's text is not the entry for (key, corner), or undefined when it is. */
function entryProblem(text: string, key: string, cornerId: string): string | undefined {
  let e: Partial<Entry>;
  try {
    e = JSON.parse(text) as Partial<Entry>;
  } catch {
    return 'not valid JSON';
  }
  if (typeof e !== 'object' || e === null) return 'not a cache entry';
  if (e.format !== CACHE_FORMAT) return `format ${JSON.stringify(e.format)}, expected ${CACHE_FORMAT}`;
  if (e.key !== key) return 'it holds another key: the file was copied or renamed';
  if (e.corner !== cornerId) return `it holds corner ${JSON.stringify(e.corner)}`;
  const problems = checkCornerOutcome(e.outcome);
  if (problems.length > 0) return `outcome${problems[0]!.path ? `.${problems[0]!.path}` : ''}: ${problems[0]!.message}`;
  if (e.outcome!.result.id !== cornerId) return `its result is corner ${JSON.stringify(e.outcome!.result.id)}`;
  return undefined;
}
