/** A share with its confidence interval, each a fraction 0..1. */
export interface Proportion {
  value: number;
  low: number;
  high: number;
}

/** Two-sided standard normal quantile for 95 % confidence (z at 0.975), common practice to 4 digits more. */
export const Z95 = 1.959963984540054;

/**
 * Wilson score interval for a binomial proportion (E. B. Wilson, "Probable inference, the law of
 * succession, and statistical inference", Journal of the American Statistical Association 22,
 * 1927, pp. 209-212). Unlike the textbook Wald interval it stays inside [0, 1] and keeps a useful
 * width at 0 and at n successes, where a yield study often sits.
 * successes, n: counts (n > 0); z: normal quantile of the two-sided level. @default z = Z95 (95 %)
 */
export function wilsonInterval(successes: number, n: number, z = Z95): Proportion {
  if (!(Number.isInteger(n) && n > 0) || !(Number.isInteger(successes) && successes >= 0 && successes <= n)) {
    throw new RangeError(`wilsonInterval needs whole counts 0 <= successes <= n, n > 0; got ${successes} of ${n}`);
  }
  const p = successes / n;
  const z2 = z * z;
  const centre = (p + z2 / (2 * n)) / (1 + z2 / n);
  const half = (z / (1 + z2 / n)) * Math.sqrt((p * (1 - p)) / n + z2 / (4 * n * n));
  // the exact ends at 0 and n (rounding would otherwise leave 1e-17 off them)
  return { value: p, low: successes === 0 ? 0 : Math.max(0, centre - half), high: successes === n ? 1 : Math.min(1, centre + half) };
}

/** P(X <= k) for X ~ Binomial(n, p), summed in the log domain (no underflow of (1-p)^n at large n). */
export function binomialCdf(k: number, n: number, p: number): number {
  if (k < 0) return 0;
  if (k >= n) return 1;
  if (p <= 0) return 1;
  if (p >= 1) return 0;
  const lp = Math.log(p);
  const lq = Math.log1p(-p);
  let logTerm = n * lq; // log P(X = 0)
  let logSum = logTerm;
  for (let i = 0; i < k; i++) {
    logTerm += Math.log((n - i) / (i + 1)) + lp - lq;
    const hi = Math.max(logSum, logTerm);
    logSum = hi + Math.log(Math.exp(logSum - hi) + Math.exp(logTerm - hi));
  }
  return Math.min(1, Math.exp(logSum));
}

/** Root of a decreasing function on [0, 1] by bisection to 1e-12 (the tail sums are monotonic in p). */
function bisectDecreasing(f: (p: number) => number): number {
  let lo = 0;
  let hi = 1;
  while (hi - lo > 1e-12) {
    const mid = (lo + hi) / 2;
    if (f(mid) > 0) lo = mid; else hi = mid;
  }
  return (lo + hi) / 2;
}

/**
 * Clopper-Pearson ("exact") interval for a binomial proportion (C. J. Clopper and E. S. Pearson,
 * "The use of confidence or fiducial limits illustrated in the case of the binomial",
 * Biometrika 26, 1934, pp. 404-413): the p at which observing this many successes or more
 * (low end), or this many or fewer (high end), has probability (1 - level) / 2 each. Its coverage
 * is at least the level for every p, so it is wider than Wilson's; a yield reported with it does
 * not overstate what the samples show. level: two-sided confidence. @default 0.95
 */
export function clopperPearson(successes: number, n: number, level = 0.95): Proportion {
  if (!(Number.isInteger(n) && n > 0) || !(Number.isInteger(successes) && successes >= 0 && successes <= n)) {
    throw new RangeError(`clopperPearson needs whole counts 0 <= successes <= n, n > 0; got ${successes} of ${n}`);
  }
  const tail = (1 - level) / 2;
  // P(X >= s; p) rises with p: the low end is where it equals the tail
  const low = successes === 0 ? 0 : bisectDecreasing((p) => binomialCdf(successes - 1, n, p) - (1 - tail));
  // P(X <= s; p) falls with p: the high end is where it equals the tail
  const high = successes === n ? 1 : bisectDecreasing((p) => binomialCdf(successes, n, p) - tail);
  return { value: successes / n, low, high };
}
