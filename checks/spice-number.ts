// SPICE number suffixes, read as SPICE reads them: case-insensitive, "M" is milli, "MEG" mega,
// "MIL" a thousandth of an inch; letters after a suffix (the "F" in "10uF") are ignored.
const SUFFIXES: [RegExp, number][] = [
  [/^meg/i, 1e6], [/^mil/i, 25.4e-6], [/^t/i, 1e12], [/^g/i, 1e9], [/^k/i, 1e3], [/^m/i, 1e-3],
  [/^u/i, 1e-6], [/^µ/, 1e-6], [/^n/i, 1e-9], [/^p/i, 1e-12], [/^f/i, 1e-15],
];

/** A SPICE number such as "4.7k", "1MEG", "10uF", "2.2e-9"; null when the text is not one. */
export function readSpiceNumber(text: string): number | null {
  const m = /^([+-]?(?:\d+\.?\d*|\.\d+)(?:e[+-]?\d+)?)([A-Za-zµ]*)$/i.exec(text.trim());
  if (!m) return null;
  const base = Number(m[1]);
  if (!m[2]) return base;
  for (const [re, scale] of SUFFIXES) if (re.test(m[2])) return base * scale;
  return base; // other trailing letters are a unit name SPICE ignores, e.g. "5V"
}
