import { createHash } from 'node:crypto';
import { mkdir, readFile } from 'node:fs/promises';
import { join } from 'node:path';
import type { Design } from '../design/types.js';
import type { Corner } from '../corners/types.js';
import type { CornerCache } from './study.js';
import type { CornerOutcome } from './corner.js';
import { buildDeck } from '../netlist/deck.js';
import type { StartPoint } from '../plan/start.js';
import { writeFilesAtomic } from './files.js';
import { TOOL_VERSION } from '../version.js';

/** Bump when the simulation or measurement method changes, so old entries are not reused. */
export const CACHE_FORMAT = 3;

/**
 * Content-addressed corner cache on disk. The key hashes the corner's first deck (every circuit
 * value, the seed and the step profile), the engine version, the measurement and settling settings
 * and the tool version; the value is the simulated outcome (comparison is redone on load).
 */
export function createFileCache(dir: string): CornerCache {
  return {
    key(design: Design, corner: Corner, engineVersion: string, start: StartPoint): string {
      const deck = buildDeck({ design, corner, fs: start.fs, seed: start.seed, cycles: 24, saveCycles: 24 });
      const h = createHash('sha256');
      // the confirm budget picks which corners are simulated, it changes none of them
      h.update(JSON.stringify({ CACHE_FORMAT, TOOL_VERSION, engineVersion, deck: deck.text, sim: { ...design.simulation, confirm: undefined }, target: design.output.voltage, slope: start.slope, regulated: corner.fs === null }));
      return h.digest('hex');
    },
    async get(key: string): Promise<CornerOutcome | undefined> {
      try {
        return JSON.parse(await readFile(join(dir, key.slice(0, 2), `${key}.json`), 'utf8')) as CornerOutcome;
      } catch {
        return undefined;
      }
    },
    async set(key: string, value: CornerOutcome): Promise<void> {
      await mkdir(join(dir, key.slice(0, 2)), { recursive: true });
      await writeFilesAtomic([{ path: join(dir, key.slice(0, 2), `${key}.json`), text: JSON.stringify(value) }]);
    },
  };
}
