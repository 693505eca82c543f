// Wilson score interval for a binomial proportion: E. B. Wilson, "Probable
// inference, the law of succession, and statistical inference", J. American
// Statistical Association 22 (1927) 209-212; the same formula is given in the
// NIST/SEMATECH e-Handbook of Statistical Methods, section 7.2.4.1
// (confidence intervals for a proportion):
//   centre = (p + z^2/(2n)) / (1 + z^2/n)
//   half   = z / (1 + z^2/n) * sqrt(p(1-p)/n + z^2/(4n^2))
// z = 1.96 for 95 %. No finite-population correction: the sample is a small
// part of each folder, and leaving it out only widens the interval.
export function wilson(successes: number, n: number, z = 1.96): { low: number; high: number } {
  if (n === 0) return { low: 0, high: 1 };
  const p = successes / n;
  const z2 = z * z;
  const centre = (p + z2 / (2 * n)) / (1 + z2 / n);
  const half = (z / (1 + z2 / n)) * Math.sqrt((p * (1 - p)) / n + z2 / (4 * n * n));
  return { low: Math.max(0, centre - half), high: Math.min(1, centre + half) };
}
