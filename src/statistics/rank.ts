/**
 * Ranks 1..n of the values, ties sharing the mean of the ranks they span (the usual treatment
 * for Spearman's coefficient).
 */
export function ranks(values: readonly number[]): number[] {
  const order = values.map((v, i) => [v, i] as const).sort((a, b) => a[0] - b[0]);
  const out = new Array<number>(values.length);
  for (let i = 0; i < order.length;) {
    let j = i;
    while (j + 1 < order.length && order[j + 1]![0] === order[i]![0]) j++;
    const r = (i + j) / 2 + 1;
    for (let k = i; k <= j; k++) out[order[k]![1]] = r;
    i = j + 1;
  }
  return out;
}

/** Pearson's product-moment correlation; null when either series is constant or shorter than 3. */
export function pearson(x: readonly number[], y: readonly number[]): number | null {
  const n = x.length;
  if (n !== y.length) throw new RangeError(`pearson needs series of one length, got ${n} and ${y.length}`);
  if (n < 3) return null;
  let mx = 0;
  let my = 0;
  for (let i = 0; i < n; i++) { mx += x[i]!; my += y[i]!; }
  mx /= n;
  my /= n;
  let sxy = 0;
  let sxx = 0;
  let syy = 0;
  for (let i = 0; i < n; i++) {
    const dx = x[i]! - mx;
    const dy = y[i]! - my;
    sxy += dx * dy; sxx += dx * dx; syy += dy * dy;
  }
  if (sxx === 0 || syy === 0) return null;
  return Math.max(-1, Math.min(1, sxy / Math.sqrt(sxx * syy)));
}

/**
 * Spearman's rank correlation coefficient (C. Spearman, "The proof and measurement of association
 * between two things", American Journal of Psychology 15, 1904): Pearson's coefficient of the
 * ranks, so any monotonic dependence counts fully. Used as a sampling-based sensitivity measure
 * as in A. Saltelli et al., "Global Sensitivity Analysis: The Primer", Wiley 2008, section 1.2.
 * Null when either series is constant.
 */
export function spearman(x: readonly number[], y: readonly number[]): number | null {
  return pearson(ranks(x), ranks(y));
}
