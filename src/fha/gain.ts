/**
 * Closed-form FHA relations of the LLC tank in normalised form (docs/method.md#gain).
 * fn = fs/fr, q = Zr/Rac, ln = Lm/Lr. All functions are pure and dimensionless.
 */

/** Tank gain M = |Zp / (Zs + Zp)| (the first of the two equivalent forms; the tests check it against the second). */
export function fhaGain(fn: number, q: number, ln: number): number {
  const a = 1 + (1 - 1 / (fn * fn)) / ln;
  const b = q * (fn - 1 / fn);
  // sqrt of the sum, not Math.hypot: 20x faster in V8, and neither term can overflow here.
  return 1 / Math.sqrt(a * a + b * b);
}

/** Input impedance normalised to Zr: Zin/Zr = j(fn - 1/fn) + jX/(1 + jQX), X = ln fn. */
export function inputImpedance(fn: number, q: number, ln: number): { re: number; im: number } {
  const x = ln * fn;
  const d = 1 + (q * x) ** 2;
  return { re: (q * x * x) / d, im: fn - 1 / fn + x / d };
}

/** Input-impedance phase in rad; > 0 inductive. */
export function inputPhase(fn: number, q: number, ln: number): number {
  const z = inputImpedance(fn, q, ln);
  return Math.atan2(z.im, z.re);
}

/**
 * Normalised frequency of the zero-phase (inductive/capacitive) boundary: the positive root of
 * Q^2 Ln^2 u^2 + (Ln + 1 - Q^2 Ln^2) u - 1 = 0, u = fn^2. Q = 0 gives 1/sqrt(Ln + 1).
 */
export function zeroPhaseFn(q: number, ln: number): number {
  const a = (q * ln) ** 2;
  const b = ln + 1 - a;
  if (a === 0) return Math.sqrt(1 / b);
  const s = Math.sqrt(b * b + 4 * a);
  // Pick the form without cancellation: b >= 0 (light load) would cancel in (-b + s) / (2a).
  const u = b >= 0 ? 2 / (b + s) : (s - b) / (2 * a);
  return Math.sqrt(u);
}

/**
 * Normalised frequency of the global gain maximum: the positive root in (0, 1) of
 * Q^2 Ln^2 u^3 + (2(Ln + 1) - Q^2 Ln^2) u - 2 = 0, u = fn^2. At Q = 0 the gain has a pole at
 * fn = 1/sqrt(Ln + 1), which is returned.
 */
export function peakGainFn(q: number, ln: number): number {
  const a = (q * ln) ** 2;
  const b = 2 * (ln + 1) - a;
  if (a === 0) return Math.sqrt(1 / (ln + 1));
  // f(u) = a u^3 + b u - 2 is convex for u > 0 with f(0) = -2 < 0 and f(1) = 2 Ln > 0, so Newton
  // from u = 1 falls monotonically onto the single root in (0, 1).
  let u = 1;
  for (let i = 0; i < 100; i++) {
    const step = (a * u * u * u + b * u - 2) / (3 * a * u * u + b);
    u -= step;
    if (!(Math.abs(step) > 1e-16 * u)) break;
  }
  return Math.sqrt(u);
}

/**
 * The fn >= fnLow at which M(fn) = target, by bisection on the monotonically falling branch
 * above the zero-phase boundary. Returns null when target > M(fnLow) or the gain is still above
 * target at fnHigh.
 */
export function fnForGain(target: number, q: number, ln: number, fnLow: number, fnHigh: number): number | null {
  if (fhaGain(fnLow, q, ln) < target || fhaGain(fnHigh, q, ln) > target) return null;
  let lo = fnLow;
  let hi = fnHigh;
  for (let i = 0; i < 200; i++) {
    const mid = 0.5 * (lo + hi);
    if (mid === lo || mid === hi) break;
    if (fhaGain(mid, q, ln) > target) lo = mid;
    else hi = mid;
  }
  return 0.5 * (lo + hi);
}
