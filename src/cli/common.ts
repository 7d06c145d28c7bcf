/** Small helpers the commands share. */
import type { Design } from '../design/types.js';
import type { Corner } from '../corners/types.js';
import { expandCorners, filterCorners } from '../corners/expand.js';
import { UsageError } from './exit.js';

/**
 * The design's corners `--only` selects; a pattern that selects none of them and none of `extra`
 * (measured points) is a usage error (exit 2), so that a typo does not pass CI as an empty, green study.
 */
export function requireMatches(design: Design, only: string | undefined, extra: Corner[] = []): Corner[] {
  const all = expandCorners(design);
  const picked = filterCorners(all, only);
  if (picked.length === 0 && only !== undefined && filterCorners(extra, only).length === 0) {
    const some = all.slice(0, 3).map((c) => c.id).join(', ');
    throw new UsageError(`--only ${JSON.stringify(only)}: no corner matches (${all.length} corners, e.g. ${some}; a pattern without * or ? matches any part of an id)`);
  }
  return picked;
}

/**
 * Colour on `stream`? On a terminal `hasColors()` decides, which honours NO_COLOR, FORCE_COLOR and
 * TERM=dumb; anything else (a pipe, a CI log) gets colour only when FORCE_COLOR asks for it.
 */
export function useColor(stream: NodeJS.WriteStream, env: NodeJS.ProcessEnv = process.env): boolean {
  if (stream.isTTY && typeof stream.hasColors === 'function') return stream.hasColors(env);
  const force = env['FORCE_COLOR'];
  return force !== undefined && force !== '0' && force !== 'false';
}
