import type { HalfPeriod } from './halfperiod.js';

/** Periodic state z = (i_r, i_m, v_cr - V_dc) at t = 0, normalized, with how it was found. */
export interface Periodic {
  z: number[];
  iterations: number;
  usedFallback: boolean;
  residual: number;
}

const TOL = 1e-12;
const MAX_NEWTON = 40;
const MAX_FIXED = 4000;

/**
 * Difference directions: common current (i_r and i_m together, keeps i_sec), secondary current,
 * Cr voltage, then any extra unknowns. At a state inside an O interval (i_sec = 0) the
 * half-period map has a kink in i_sec; differencing along the first direction keeps the
 * Jacobian exact on that manifold.
 */
function basis(n: number): number[][] {
  const b = [[1, 1, 0], [0.5, -0.5, 0], [0, 0, 1]].map((r) => [...r, ...new Array(n - 3).fill(0)]);
  for (let k = 3; k < n; k++) b.push(new Array(n).fill(0).map((_, j) => (j === k ? 1 : 0)));
  return b;
}

/**
 * Half-wave-symmetric periodic state: the root of F(z) = Phi(z) + z, where Phi maps the state at
 * t = 0 to the state at T/2 (symmetry: x(T/2) = -x(0) for currents and for v_cr - V_dc).
 * Newton with a forward-difference Jacobian and a backtracking line search; if that fails,
 * damped fixed-point iteration (the physical transient, z <- -Phi(z)) and Newton again.
 * Returns null when neither converges.
 */
export function findPeriodic(hp: HalfPeriod, guess: ArrayLike<number>): Periodic | null {
  const count = { n: 0 };
  const res = (z: number[]) => periodResidual(hp, z);
  const first = newton(res, Array.from(guess), count);
  if (first) return { ...first, iterations: count.n, usedFallback: false };
  let z = Array.from(guess);
  for (let i = 0; i < MAX_FIXED; i++) {
    const e = safeRun(hp, z);
    if (!e) return null;
    const next = e.map((v) => -v);
    const step = Math.max(...next.map((v, j) => Math.abs(v - z[j])));
    z = next;
    count.n++;
    if (step < 1e-6 * Math.max(1e-3, ...z.map(Math.abs))) break;
  }
  const second = newton(res, z, count);
  return second ? { ...second, iterations: count.n, usedFallback: true } : null;
}

/** One half period from z; null if the integration failed. */
export function safeRun(hp: HalfPeriod, z: number[]): number[] | null {
  try {
    const e = hp.run(z);
    return e.every(Number.isFinite) ? e : null;
  } catch {
    return null;
  }
}

/** Phi(z) + z: zero at the half-wave-symmetric periodic state. */
export function periodResidual(hp: HalfPeriod, z: number[]): number[] | null {
  const e = safeRun(hp, z);
  return e ? e.map((v, j) => v + z[j]) : null;
}

const norm = (v: number[]) => Math.max(...v.map(Math.abs));

/**
 * Newton on res(u) = 0 (u of length >= 3, the first three the periodic state) with a forward-
 * difference Jacobian in the directions of basis() and backtracking; null if it stalls.
 */
export function newton(
  res: (u: number[]) => number[] | null, u0: number[], count: { n: number }, tol = TOL,
): { z: number[]; residual: number } | null {
  const dirs = basis(u0.length);
  let u = u0;
  let f = res(u);
  if (!f) return null;
  let r = norm(f);
  for (let it = 0; it < MAX_NEWTON; it++) {
    if (r < tol) return { z: u, residual: r };
    count.n++;
    const steps = newtonSteps(res, u, f, dirs);
    if (!steps) return null;
    let accepted = false;
    for (let lambda = 1; lambda >= 1 / 1024 && !accepted; lambda /= 2) {
      for (const step of steps) {
        const ut = u.map((v, j) => v + lambda * step[j]);
        const ft = res(ut);
        const rt = ft ? norm(ft) : Infinity;
        if (ft && rt < (1 - 1e-4 * lambda) * r) { u = ut; f = ft; r = rt; accepted = true; break; }
      }
    }
    if (!accepted) return r < 1e3 * tol ? { z: u, residual: r } : null;
  }
  return r < 1e3 * tol ? { z: u, residual: r } : null;
}

/**
 * Newton step(s) from a forward-difference Jacobian. The secondary-current direction is
 * differenced on both sides: where the state sits on a rectifier boundary (i_sec = 0) the two
 * one-sided slopes differ and both candidate steps are returned (the line search picks one).
 */
function newtonSteps(res: (u: number[]) => number[] | null, u: number[], f: number[], dirs: number[][]): number[][] | null {
  const delta = 1e-7 * Math.max(norm(u), 1e-2);
  const cols: number[][] = [];
  for (let j = 0; j < u.length; j++) {
    const fp = res(u.map((v, k) => v + delta * dirs[j][k]));
    if (!fp) return null;
    cols.push(fp.map((v, i) => (v - f[i]) / delta));
  }
  const fm = res(u.map((v, k) => v - delta * dirs[1][k]));
  const back = fm ? fm.map((v, i) => (f[i] - v) / delta) : null;
  const variants = [cols];
  if (back) {
    const diff = norm(back.map((v, i) => v - cols[1][i]));
    if (diff > 1e-4 * Math.max(norm(back), norm(cols[1]), 1e-9)) variants.push(cols.map((c, j) => (j === 1 ? back : c)));
  }
  const steps: number[][] = [];
  for (const cs of variants) {
    const jac = f.map((_, i) => cs.map((c) => c[i]));
    const y = solveLinear(jac, f.map((v) => -v));
    if (y) steps.push(u.map((_, k) => y.reduce((s, yj, j) => s + yj * dirs[j][k], 0)));
  }
  return steps.length > 0 ? steps : null;
}

/** Solves the square system m x = rhs by Gaussian elimination with partial pivoting. */
export function solveLinear(m: number[][], rhs: number[]): number[] | null {
  const n = rhs.length;
  const a = m.map((row, i) => [...row, rhs[i]]);
  for (let c = 0; c < n; c++) {
    let p = c;
    for (let i = c + 1; i < n; i++) if (Math.abs(a[i][c]) > Math.abs(a[p][c])) p = i;
    if (a[p][c] === 0 || !Number.isFinite(a[p][c])) return null;
    [a[c], a[p]] = [a[p], a[c]];
    for (let i = c + 1; i < n; i++) {
      const f = a[i][c] / a[c][c];
      for (let j = c; j <= n; j++) a[i][j] -= f * a[c][j];
    }
  }
  const x = new Array<number>(n).fill(0);
  for (let i = n - 1; i >= 0; i--) {
    let s = a[i][n];
    for (let j = i + 1; j < n; j++) s -= a[i][j] * x[j];
    x[i] = s / a[i][i];
  }
  return x;
}
