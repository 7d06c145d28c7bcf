import { readdir, rm, stat } from 'node:fs/promises';
import { join } from 'node:path';

const UNITS: Record<string, number> = { '': 1, k: 1024, K: 1024, M: 1024 ** 2, G: 1024 ** 3 };

/**
 * A cache size limit: a whole or decimal number of bytes with an optional binary multiplier
 * k or K (1024), M (1024^2) or G (1024^3), and an optional trailing B: `500M` is 524 288 000 bytes.
 * Returns null for anything else (a negative number, an unknown unit, `500 mb`, empty).
 */
export function parseSize(s: string): number | null {
  const m = /^\s*(\d+(?:\.\d+)?)\s*([kKMG]?)B?\s*$/.exec(s);
  if (!m) return null;
  return Math.floor(Number(m[1]) * UNITS[m[2]!]!);
}

/**
 * Remove the oldest cache entries (by modification time; ties by name) until the cache holds at
 * most maxBytes. Only entry files (`<2 hex>/<sha256>.json`) count and are removed; temporaries of
 * a writer still running are left alone. Returns what was there and what was removed.
 */
export async function pruneCache(dir: string, maxBytes: number): Promise<{ entries: number; bytes: number; removed: number; freed: number }> {
  const entries: { path: string; size: number; mtime: number }[] = [];
  const subs = await readdir(dir).catch(() => [] as string[]);
  for (const sub of subs.filter((s) => /^[0-9a-f]{2}$/.test(s))) {
    for (const f of await readdir(join(dir, sub)).catch(() => [] as string[])) {
      if (!/^[0-9a-f]{64}\.json$/.test(f)) continue;
      const st = await stat(join(dir, sub, f)).catch(() => null);
      if (st?.isFile()) entries.push({ path: join(dir, sub, f), size: st.size, mtime: st.mtimeMs });
    }
  }
  entries.sort((a, b) => a.mtime - b.mtime || (a.path < b.path ? -1 : 1));
  let bytes = entries.reduce((s, e) => s + e.size, 0);
  const total = bytes;
  let removed = 0;
  for (const e of entries) {
    if (bytes <= maxBytes) break;
    await rm(e.path, { force: true });
    bytes -= e.size;
    removed++;
  }
  return { entries: entries.length, bytes: total, removed, freed: total - bytes };
}
