/**
 * One-sample Kolmogorov-Smirnov statistic D = sup |F_n(x) - F(x)| of a sample against a
 * continuous distribution function F (A. N. Kolmogorov 1933; N. Smirnov 1948; as tabulated by
 * F. J. Massey Jr., "The Kolmogorov-Smirnov test for goodness of fit", Journal of the American
 * Statistical Association 46, 1951). The supremum is reached at a sample point, just before or
 * at the step, so D = max_i max(i/n - F(x_i), F(x_i) - (i-1)/n) over the sorted sample.
 */
export function ksStatistic(sample: readonly number[], cdf: (x: number) => number): number {
  if (sample.length === 0) throw new RangeError('ksStatistic needs at least one value');
  const xs = [...sample].sort((a, b) => a - b);
  const n = xs.length;
  let d = 0;
  xs.forEach((x, i) => {
    const f = cdf(x);
    d = Math.max(d, (i + 1) / n - f, f - i / n);
  });
  return d;
}

/**
 * Asymptotic critical value of D at significance 0.05 for large n: 1.36 / sqrt(n) (Massey 1951,
 * Table 1, "over 35"; the constant is the 0.95 quantile of Kolmogorov's distribution, 1.3581).
 */
export function ksCritical05(n: number): number {
  return 1.3581 / Math.sqrt(n);
}
