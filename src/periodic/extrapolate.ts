/**
 * Extrapolation of a converging vector sequence to its limit: reduced rank extrapolation (RRE).
 *
 * A switching converter sampled once per switching period at the same phase gives a sequence of
 * states x_0, x_1, ... (the Poincare map of the circuit). Near the periodic steady state x* the
 * map is linear, x_{k+1} - x* = A (x_k - x*), and the transient is a sum of a few modes (the fast
 * tank modes, the slow beat between the tank and the output capacitor, the capacitor's own
 * charge). RRE finds the affine combination s = sum g_j x_j (sum g_j = 1) whose differences
 * u_j = x_{j+1} - x_j cancel best in the least-squares sense, min || sum g_j u_j ||; for a linear
 * map with at most k modes, k + 1 differences give x* exactly. Using it on the cycle-boundary states
 * of a transient simulation to reach the periodic steady state in a few cycles is the approach of
 * S. Skelboe, "Computation of the periodic steady-state response of nonlinear networks by
 * extrapolation methods", IEEE Trans. Circuits and Systems, vol. CAS-27, no. 3, pp. 161-175, 1980.
 * The RRE formulation and its exactness for linear sequences: A. Sidi, "Vector Extrapolation
 * Methods with Applications", SIAM, 2017, ch. 1-2 (RRE is due to Eddy, 1979, and Mesina, 1977).
 *
 * Pure: no I/O. The caller scales the components so that each is of order one.
 */

/** Solve the small dense system M y = b by Gaussian elimination with partial pivoting; null when singular. */
function solveDense(m: number[][], b: number[]): number[] | null {
  const n = b.length;
  const a = m.map((row, i) => [...row, b[i]!]);
  for (let c = 0; c < n; c++) {
    let p = c;
    for (let r = c + 1; r < n; r++) if (Math.abs(a[r]![c]!) > Math.abs(a[p]![c]!)) p = r;
    if (!(Math.abs(a[p]![c]!) > 0)) return null;
    [a[c], a[p]] = [a[p]!, a[c]!];
    for (let r = c + 1; r < n; r++) {
      const f = a[r]![c]! / a[c]![c]!;
      for (let k = c; k <= n; k++) a[r]![k]! -= f * a[c]![k]!;
    }
  }
  const y = new Array<number>(n).fill(0);
  for (let r = n - 1; r >= 0; r--) {
    let s = a[r]![n]!;
    for (let k = r + 1; k < n; k++) s -= a[r]![k]! * y[k]!;
    y[r] = s / a[r]![r]!;
  }
  return y;
}

/**
 * The RRE limit of the sequence xs (oldest first, each a vector of the same length; at least two).
 * With u_j = x_{j+1} - x_j and the Gram matrix G = U^T U, the weights are g = G^-1 1 / (1^T G^-1 1)
 * and the limit s = sum g_j x_j. With more differences than components G is singular: its null
 * vector is the minimal polynomial of the sequence, which is what the limit needs, so the ridge of
 * `ridge` x trace(G) on the diagonal is kept at rounding level (a larger one biases the limit
 * toward the last states, by several per cent with a mode of 0.97 per cycle). Returns null when the sequence is too short, a difference is not finite, or the
 * weights are not finite.
 */
export function reducedRankExtrapolation(xs: readonly (readonly number[])[], ridge = 1e-15): number[] | null {
  if (xs.length < 2) return null;
  const dim = xs[0]!.length;
  const u = xs.slice(1).map((x, j) => x.map((v, i) => v - xs[j]![i]!));
  if (u.some((d) => d.length !== dim || d.some((v) => !Number.isFinite(v)))) return null;
  const k = u.length;
  const g = u.map((a) => u.map((b) => a.reduce((s, v, i) => s + v * b[i]!, 0)));
  const trace = g.reduce((s, row, i) => s + row[i]!, 0);
  // Already at the limit (no change at all): the last state is it.
  if (trace === 0) return [...xs[xs.length - 1]!];
  for (let i = 0; i < k; i++) g[i]![i]! += ridge * trace;
  const y = solveDense(g, new Array<number>(k).fill(1));
  if (!y) return null;
  const sum = y.reduce((a, b) => a + b, 0);
  if (!(Number.isFinite(sum) && sum !== 0)) return null;
  const w = y.map((v) => v / sum);
  const s = new Array<number>(dim).fill(0);
  for (let j = 0; j < k; j++) for (let i = 0; i < dim; i++) s[i]! += w[j]! * xs[j]![i]!;
  return s.every(Number.isFinite) ? s : null;
}
