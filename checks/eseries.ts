// Preferred-number series of IEC 60063:2015, one decade each. E3..E24 have two
// significant digits, E48..E192 three. The tables are written out because several
// values differ from the rounded geometric series (E24's 2.7, 3.0 ... 8.2 and E192's 920).
const E24 = [10, 11, 12, 13, 15, 16, 18, 20, 22, 24, 27, 30, 33, 36, 39, 43, 47, 51, 56, 62, 68, 75, 82, 91];
const E192 = [
  100, 101, 102, 104, 105, 106, 107, 109, 110, 111, 113, 114, 115, 117, 118, 120, 121, 123, 124, 126,
  127, 129, 130, 132, 133, 135, 137, 138, 140, 142, 143, 145, 147, 149, 150, 152, 154, 156, 158, 160,
  162, 164, 165, 167, 169, 172, 174, 176, 178, 180, 182, 184, 187, 189, 191, 193, 196, 198, 200, 203,
  205, 208, 210, 213, 215, 218, 221, 223, 226, 229, 232, 234, 237, 240, 243, 246, 249, 252, 255, 258,
  261, 264, 267, 271, 274, 277, 280, 284, 287, 291, 294, 298, 301, 305, 309, 312, 316, 320, 324, 328,
  332, 336, 340, 344, 348, 352, 357, 361, 365, 370, 374, 379, 383, 388, 392, 397, 402, 407, 412, 417,
  422, 427, 432, 437, 442, 448, 453, 459, 464, 470, 475, 481, 487, 493, 499, 505, 511, 517, 523, 530,
  536, 542, 549, 556, 562, 569, 576, 583, 590, 597, 604, 612, 619, 626, 634, 642, 649, 657, 665, 673,
  681, 690, 698, 706, 715, 723, 732, 741, 750, 759, 768, 777, 787, 796, 806, 816, 825, 835, 845, 856,
  866, 876, 887, 898, 909, 920, 931, 942, 953, 965, 976, 988,
];
const E96 = [
  100, 102, 105, 107, 110, 113, 115, 118, 121, 124, 127, 130, 133, 137, 140, 143, 147, 150, 154, 158,
  162, 165, 169, 174, 178, 182, 187, 191, 196, 200, 205, 210, 215, 221, 226, 232, 237, 243, 249, 255,
  261, 267, 274, 280, 287, 294, 301, 309, 316, 324, 332, 340, 348, 357, 365, 374, 383, 392, 402, 412,
  422, 432, 442, 453, 464, 475, 487, 499, 511, 523, 536, 549, 562, 576, 590, 604, 619, 634, 649, 665,
  681, 698, 715, 732, 750, 768, 787, 806, 825, 845, 866, 887, 909, 931, 953, 976,
];
const E48 = [
  100, 105, 110, 115, 121, 127, 133, 140, 147, 154, 162, 169, 178, 187, 196, 205, 215, 226, 237, 249,
  261, 274, 287, 301, 316, 332, 348, 365, 383, 402, 422, 442, 464, 487, 511, 536, 562, 590, 619, 649,
  681, 715, 750, 787, 825, 866, 909, 953,
];

/** Each series as mantissas in [1, 10). */
export const E_SERIES: Record<string, readonly number[]> = {
  E3: [1.0, 2.2, 4.7],
  E6: [1.0, 1.5, 2.2, 3.3, 4.7, 6.8],
  E12: [1.0, 1.2, 1.5, 1.8, 2.2, 2.7, 3.3, 3.9, 4.7, 5.6, 6.8, 8.2],
  E24: E24.map((v) => v / 10),
  E48: E48.map((v) => v / 100),
  E96: E96.map((v) => v / 100),
  E192: E192.map((v) => v / 100),
};

export function seriesValues(series: string): readonly number[] {
  const values = E_SERIES[series.toUpperCase()];
  if (!values) throw new Error(`unknown series "${series}" (use ${Object.keys(E_SERIES).join(", ")})`);
  return values;
}

/**
 * Nearest preferred value to x, nearest on a log scale (by ratio), which is how
 * tolerance bands between neighbours are spaced. Keeps the sign; 0 stays 0.
 */
export function eseries(x: number, series: string): number {
  const values = seriesValues(series);
  if (!Number.isFinite(x)) throw new Error(`eseries() needs a finite number, got ${x}`);
  if (x === 0) return 0;
  const a = Math.abs(x);
  const decade = Math.floor(Math.log10(a));
  let best = NaN;
  let bestDist = Infinity;
  for (const d of [decade - 1, decade, decade + 1])
    for (const m of values) {
      const v = Number((m * 10 ** d).toPrecision(3));
      const dist = Math.abs(Math.log(a / v));
      if (dist < bestDist) [best, bestDist] = [v, dist];
    }
  return Math.sign(x) * best;
}
