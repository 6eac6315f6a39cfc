// The one door every simulation of a verification goes through (nominal, sensitivity pass,
// worst corners, Monte Carlo samples, sweep members). A request is self-contained and plain
// data, so another process or machine can run it; the engine only awaits the outcomes.
import type { Analysis } from "../script/builtins";

export type SimRequest = {
  /** Content hash (sha256 hex) of deck + ngspice version + engine version: the cache key. */
  key: string;
  /** The complete ngspice deck: title, .param lines, the sanitised circuit, the analysis card, .end. */
  deck: string;
  analysis: Analysis;
  /** Deck lines before the circuit's first line, and the circuit text: map ngspice errors to lines. */
  circuitOffset: number;
  circuit: string;
  /** Simulated time this request asks for (tran stop; 0 for ac, op, dc …), for the per-run cap. */
  simSeconds: number;
};

/** Either the binary raw file ngspice wrote, or why there is none (line counted in the circuit). */
export type SimOutcome =
  | { key: string; ok: true; raw: Uint8Array; ms: number; cached: boolean }
  | { key: string; ok: false; error: string; line?: number; ms: number };

export type SimExecutor = {
  /**
   * Run every request (in any order, in parallel as the executor sees fit) and resolve with one
   * outcome per request, in the order given. A failed simulation is an outcome with ok: false,
   * never a rejection; reject only when the executor itself cannot go on (the run is then an error).
   * `progress(done, total)` may be called as outcomes arrive (total = reqs.length).
   */
  runMany(reqs: SimRequest[], progress?: (done: number, total: number) => void): Promise<SimOutcome[]>;
};

/** Progress of a whole verification: simulations finished of those it needs (total may grow as the plan firms up). */
export type RunProgress = (done: number, total: number) => void;
