import { sanitizeNetlist } from "./sanitize";
import { SpiceError } from "./types";

const INCLUDE = /^\s*\.inc(lude)?\s+["']?[A-Za-z0-9][A-Za-z0-9_.-]*["']?\s*$/i;

/**
 * What the sanitiser refuses in a circuit, judged before any model file is at hand: a well-formed `.include`
 * is left to the run (its file is checked where it is stored, and may be added later); every other refusal
 * (`.control`, `shell`, analysis or output cards, code models…) stands. Null when nothing is refused.
 */
export function circuitRefusal(circuit: string): SpiceError | null {
  const lines = circuit.replace(/\r\n?/g, "\n").split("\n");
  for (;;) {
    try {
      sanitizeNetlist(lines.join("\n"));
      return null;
    } catch (e) {
      if (!(e instanceof SpiceError)) throw e;
      const at = e.line ? e.line - 1 : -1;
      if (at < 0 || !INCLUDE.test(lines[at] ?? "")) return e;
      lines[at] = "*"; // same line count, so later errors keep their line numbers
    }
  }
}
