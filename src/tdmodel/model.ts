import type { RectMode, TdParams } from './types.js';

/**
 * Normalized circuit: voltages in units of Vin, impedances of Zr = sqrt(Lr/Cr), currents of
 * Vin/Zr, time of 1/wr = sqrt(Lr Cr). Then Lr = Cr = 1 and every number is of order one.
 * State vector x = (i_r, i_m, v_cr, v_b), v_b the bridge voltage (HB node; FB v_A - v_B).
 */
export interface Circuit {
  lm: number;
  /** Effective bridge capacitance: HB 2 Coss; FB Coss (two legs of 2 Coss in series). */
  ce: number;
  /** Switch path resistance: HB rdsOn, FB 2 rdsOn. */
  rs: number;
  /** Rectifier resistance referred to the primary, n^2 rd (CT) or 2 n^2 rd (FB). */
  rd: number;
  /** Clamp voltage of Lm in P/N, n (Vo + V_drop). */
  vc: number;
  vl: number;
  vh: number;
  /** DC value of the Cr voltage: Vin/2 (HB) or 0 (FB). */
  vdc: number;
  half: number;
  td: number;
  /** Lm / (Lr + Lm): share of the loop voltage on Lm in O. */
  k: number;
  base: { v: number; i: number; t: number; z: number };
  /** Diodes in the current path and the source-charge factor (HB 1, FB 2). */
  nd: number;
  srcFactor: number;
  modes: Map<string, ModeSys>;
}

/** Linear system x' = A x + b of one (bridge, rectifier) combination; rho bounds its rate. */
export interface ModeSys {
  a: Float64Array;
  b: Float64Array;
  rho: number;
}

/**
 * Bridge condition: pinned to a rail (switch or body diode), free (tank current charging the node
 * capacitance), or float (no node capacitance and neither rail can carry the current: the tank
 * current is held at zero and the node sits between the rails).
 */
export type BridgeKind = 'pin' | 'free' | 'float';

/** Collects every invalid parameter; throws one RangeError listing them all. */
export function checkParams(p: TdParams, vo: number): void {
  const bad: string[] = [];
  const pos = { vin: p.vin, fs: p.fs, lr: p.lr, cr: p.cr, lm: p.lm, n: p.n } as const;
  for (const [k, v] of Object.entries(pos)) if (!(v > 0 && Number.isFinite(v))) bad.push(`${k} must be > 0 (got ${v})`);
  const nonneg = { coss: p.coss, deadTime: p.deadTime, vf: p.vf, rd: p.rd, rdsOn: p.rdsOn, vo } as const;
  for (const [k, v] of Object.entries(nonneg)) if (!(v >= 0 && Number.isFinite(v))) bad.push(`${k} must be >= 0 (got ${v})`);
  if (p.deadTime >= 0.5 / p.fs) bad.push(`deadTime ${p.deadTime} s must be below half a period ${0.5 / p.fs} s`);
  if (bad.length > 0) throw new RangeError(`tdmodel: ${bad.join('; ')}`);
}

/** Builds the normalized circuit for the output held at vo (V). */
export function normalize(p: TdParams, vo: number): Circuit {
  checkParams(p, vo);
  const fb = p.inverter === 'full-bridge';
  const nd = p.rectifier === 'center-tapped' ? 1 : 2;
  const z = Math.sqrt(p.lr / p.cr);
  const base = { v: p.vin, z, i: p.vin / z, t: Math.sqrt(p.lr * p.cr) };
  const lm = p.lm / p.lr;
  const ce = (fb ? p.coss : 2 * p.coss) / p.cr;
  const c: Circuit = {
    lm,
    // Below 1e-6 Cr the node swing (~1e-5 rad) and its energy are negligible: no capacitance.
    ce: ce < 1e-6 ? 0 : ce,
    rs: (fb ? 2 * p.rdsOn : p.rdsOn) / z,
    rd: (p.n * p.n * nd * p.rd) / z,
    vc: (p.n * (vo + nd * p.vf)) / p.vin,
    vl: fb ? -1 : 0,
    vh: 1,
    vdc: fb ? 0 : 0.5,
    half: 0.5 / p.fs / base.t,
    td: p.deadTime / base.t,
    k: lm / (1 + lm),
    base,
    nd,
    srcFactor: fb ? 2 : 1,
    modes: new Map(),
  };
  for (const bk of ['pin', 'free', 'float'] as const) for (const m of ['P', 'N', 'O'] as const) c.modes.set(bk + m, buildMode(c, bk, m));
  return c;
}

/** Sets the Lm clamp voltage vc (normalized) and the P/N forcing terms that depend on it. */
export function setCircuitClamp(c: Circuit, vc: number): void {
  c.vc = vc;
  for (const bk of ['pin', 'free', 'float'] as const) {
    for (const m of ['P', 'N'] as const) {
      const b = c.modes.get(bk + m)!.b;
      const v = m === 'P' ? vc : -vc;
      b[0] = bk === 'float' ? 0 : -v;
      b[1] = v / c.lm;
    }
  }
}

function buildMode(c: Circuit, bk: BridgeKind, m: RectMode): ModeSys {
  const a = new Float64Array(16);
  const b = new Float64Array(4);
  if (bk === 'float') {
    // i_r = 0 and v_cr frozen; with a conducting rectifier Lm decays through the diode resistance.
    if (m !== 'O') {
      a[5] = -c.rd / c.lm;
      b[1] = (m === 'P' ? c.vc : -c.vc) / c.lm;
    }
    return { a, b, rho: 1 + c.rd / c.lm };
  }
  const rs = bk === 'pin' ? c.rs : 0;
  if (m === 'O') {
    const l = 1 + c.lm;
    for (const row of [0, 1]) {
      a[row * 4] = -rs / l;
      a[row * 4 + 2] = -1 / l;
      a[row * 4 + 3] = 1 / l;
    }
  } else {
    const vc = m === 'P' ? c.vc : -c.vc;
    a.set([-(rs + c.rd), c.rd, -1, 1], 0);
    a.set([c.rd / c.lm, -c.rd / c.lm, 0, 0], 4);
    b[0] = -vc;
    b[1] = vc / c.lm;
  }
  a[8] = 1;
  if (bk === 'free') a[12] = -1 / c.ce;
  // Fastest natural rate: Lr with Cr (and the node capacitance when free) plus the R/L decay.
  const w2 = 1 + (bk === 'free' ? 1 / c.ce : 0);
  return { a, b, rho: Math.sqrt(w2) + rs + c.rd + c.rd / c.lm };
}

/** Lm voltage the O interval would have: k (v_b - R i_r - v_cr). */
export function vmOpen(c: Circuit, x: ArrayLike<number>, bk: BridgeKind): number {
  const rs = bk === 'pin' ? c.rs : 0;
  if (bk === 'float') return 0; // i_r = i_m = 0 held: no voltage on Lr or Lm
  return c.k * (x[3] - rs * x[0] - x[2]);
}

/**
 * Rectifier state consistent with x: sign of i_sec if clearly non-zero, else the O interval
 * unless its Lm voltage would exceed the clamp (then the rectifier starts conducting).
 */
export function decideRect(c: Circuit, x: Float64Array, bk: BridgeKind, eps = 1e-13, forceOff = false): RectMode {
  const isec = x[0] - x[1];
  if (isec > eps) return 'P';
  if (isec < -eps) return 'N';
  const vm = vmOpen(c, x, bk);
  if (vm > c.vc && !forceOff) return 'P';
  if (vm < -c.vc && !forceOff) return 'N';
  const mid = 0.5 * (x[0] + x[1]);
  x[0] = mid;
  x[1] = mid;
  return 'O';
}
