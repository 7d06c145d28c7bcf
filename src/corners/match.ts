/**
 * Corner-id patterns (`--only`): `*` matches any run of characters, `?` one character, letters match
 * either case. A pattern with a wildcard must match the whole id; one without matches any part of it
 * (`v390` picks every corner at 390 V).
 *
 * No regular expression and no backtracking: the pattern splits at `*` into pieces that must occur in
 * order; the first is anchored at the start, the last at the end, and each middle piece is taken at its
 * leftmost place after the previous one (leftmost is never worse, since `*` absorbs any gap). The work
 * is at most (id length) x (pattern length) character comparisons, whatever the pattern: a pattern such
 * as twenty `*0` pairs before an `x` used to make a backtracking matcher run for minutes.
 */
export function matchesPattern(pattern: string, id: string): boolean {
  const p = pattern.toLowerCase();
  const s = id.toLowerCase();
  if (!p.includes('*') && !p.includes('?')) return s.includes(p);
  const pieces = p.split('*');
  if (pieces.length === 1) return p.length === s.length && at(s, 0, p);
  const first = pieces[0]!;
  const last = pieces[pieces.length - 1]!;
  if (first.length + last.length > s.length || !at(s, 0, first) || !at(s, s.length - last.length, last)) return false;
  let pos = first.length;
  const end = s.length - last.length;
  for (const piece of pieces.slice(1, -1)) {
    if (piece === '') continue;
    const found = find(s, piece, pos, end);
    if (found < 0) return false;
    pos = found + piece.length;
  }
  return true;
}

/** Does `piece` (with `?` wildcards) match `s` at `i`? */
function at(s: string, i: number, piece: string): boolean {
  for (let k = 0; k < piece.length; k++) {
    const c = piece[k]!;
    if (c !== '?' && c !== s[i + k]) return false;
  }
  return true;
}

/** Leftmost start >= from where `piece` matches and ends by `end`; -1 if none. */
function find(s: string, piece: string, from: number, end: number): number {
  for (let i = from; i + piece.length <= end; i++) if (at(s, i, piece)) return i;
  return -1;
}
