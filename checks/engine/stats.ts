// Yield statistics for Monte Carlo checks.

const Z95 = 1.959963984540054; // two-sided 95 % point of the standard normal

/**
 * Wilson score interval for a binomial proportion (E. B. Wilson, "Probable inference, the law
 * of succession, and statistical inference", JASA 22 (1927) 209–212): unlike p ± z√(p(1−p)/n)
 * it stays inside [0, 1] and does not collapse to a point when every sample passes.
 */
export function wilson(passed: number, n: number, z = Z95): { lo: number; hi: number } {
  if (n === 0) return { lo: 0, hi: 1 };
  const p = passed / n;
  const z2 = z * z;
  const centre = (p + z2 / (2 * n)) / (1 + z2 / n);
  const half = (z / (1 + z2 / n)) * Math.sqrt((p * (1 - p)) / n + z2 / (4 * n * n));
  return { lo: Math.max(0, centre - half), hi: Math.min(1, centre + half) };
}

export const YIELD_INTERVAL = "Wilson score, 95 %";
