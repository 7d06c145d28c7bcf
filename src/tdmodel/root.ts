/**
 * Root of f on [a, b] with f(a) and f(b) of opposite sign (Brent's method: inverse quadratic
 * interpolation or secant with bisection safeguards). Non-finite values (a failed evaluation)
 * are treated as having the sign of their end of the bracket and force bisection.
 * Stops when the bracket is below xtol or f is exactly zero.
 */
export function brent(f: (x: number) => number, a: number, b: number, fa: number, fb: number, xtol: number, maxIter = 100): number {
  if (fa === 0) return a;
  if (fb === 0) return b;
  if (Math.sign(fa) === Math.sign(fb)) throw new Error('brent: root not bracketed');
  let c = a;
  let fc = fa;
  let d = b - a;
  let e = d;
  for (let it = 0; it < maxIter; it++) {
    if (Math.sign(fb) === Math.sign(fc)) {
      c = a; fc = fa; d = b - a; e = d;
    }
    if (Math.abs(fc) < Math.abs(fb) && Number.isFinite(fc)) {
      a = b; b = c; c = a;
      fa = fb; fb = fc; fc = fa;
    }
    const tol = 2 * Number.EPSILON * Math.abs(b) + 0.5 * xtol;
    const m = 0.5 * (c - b);
    if (Math.abs(m) <= tol || fb === 0) return b;
    const finite = Number.isFinite(fa) && Number.isFinite(fb) && Number.isFinite(fc);
    if (finite && Math.abs(e) >= tol && Math.abs(fa) > Math.abs(fb)) {
      let p: number;
      let q: number;
      const s = fb / fa;
      if (a === c) {
        p = 2 * m * s;
        q = 1 - s;
      } else {
        const qa = fa / fc;
        const r = fb / fc;
        p = s * (2 * m * qa * (qa - r) - (b - a) * (r - 1));
        q = (qa - 1) * (r - 1) * (s - 1);
      }
      if (p > 0) q = -q;
      else p = -p;
      if (2 * p < Math.min(3 * m * q - Math.abs(tol * q), Math.abs(e * q))) {
        e = d;
        d = p / q;
      } else {
        d = m; e = m;
      }
    } else {
      d = m; e = m;
    }
    a = b;
    fa = fb;
    b += Math.abs(d) > tol ? d : m > 0 ? tol : -tol;
    fb = f(b);
    if (Number.isNaN(fb)) throw new Error('brent: function returned NaN');
  }
  return b;
}
