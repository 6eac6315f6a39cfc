import { cacheKey, readCached, writeCached } from "./cache";
import { circuitOffset, writeDeck as deckFor } from "./deck";
import { defaultCacheDir, defaultModelsDir } from "./paths";
import { parseRawFile, type RawPlot } from "./raw-file";
import { runNgspice } from "./run-ngspice";
import { sweepScale } from "./cards";
import type { Includes } from "./sanitize";
import { SpiceError, type Analysis, type ComplexVector, type SimOptions, type SimRequest, type SimResult } from "./types";
import { SPICE_RUNNER_VERSION, ngspiceVersion } from "./version";
import { ENGINE_VERSION } from "../version";

export { SpiceError, ngspiceVersion, parseRawFile, defaultCacheDir, defaultModelsDir };
export { MODEL_FILE, sanitizeModelFile, sanitizeNetlist, type Includes, type ModelTexts } from "./sanitize";
export { MAX_AC_POINTS, MAX_TRAN_POINTS } from "./deck";
export type { Analysis, ComplexVector, SimOptions, SimRequest, SimResult } from "./types";
export type { RawPlot, RawVariable } from "./raw-file";

/** The full ngspice deck for a request (sanitised; throws SpiceError naming the circuit line). */
export function writeDeck(req: SimRequest, where?: string | Includes): string {
  return deckFor(req, where ?? defaultModelsDir());
}

/**
 * Run one analysis synchronously (mathjs script functions are sync): one ngspice process,
 * or none when the content-addressed cache already holds the raw file.
 */
export function simulate(req: SimRequest, opts: SimOptions = {}): SimResult {
  const dir = opts.cacheDir ?? defaultCacheDir();
  const deck = writeDeck(req, opts.modelsDir); // refusals come before anything runs
  const version = ngspiceVersion(); // once per process, outside the timed part
  const t0 = performance.now();
  const key = cacheKey(deck, version, `${opts.engineVersion ?? ENGINE_VERSION}/${SPICE_RUNNER_VERSION}`);
  const hit = opts.noCache ? null : readCached(dir, key);
  const raw = hit ?? runNgspice(deck, { timeoutMs: opts.timeoutMs, circuitOffset: circuitOffset(req), circuit: req.circuit }).raw;
  const result = toResult(req.analysis, parseRawFile(raw));
  if (!hit && !opts.noCache) writeCached(dir, key, raw);
  return { ...result, ms: Math.round((performance.now() - t0) * 10) / 10, cached: hit !== null };
}

/** A raw file ngspice wrote for this analysis, as the measures read it. */
export function resultFromRaw(analysis: Analysis, raw: Uint8Array, ms: number, cached: boolean): SimResult {
  const buf = Buffer.isBuffer(raw) ? raw : Buffer.from(raw.buffer, raw.byteOffset, raw.byteLength);
  return { ...toResult(analysis, parseRawFile(buf)), ms, cached };
}

/** One analysis's plots of a raw file (a deck with several analyses writes plots for each), as the measures read them. */
export function resultFromPlots(analysis: Analysis, plots: RawPlot[]): SimResult {
  return { ...toResult(analysis, plots), ms: 0, cached: false };
}

const PLOT_NAME = {
  tran: /transient/i, ac: /^ac/i, op: /operating point/i, dc: /^dc transfer/i, noise: /noise spectral density/i, tf: /transfer function/i,
} as const;

function toResult(analysis: Analysis, plots: RawPlot[]): Omit<SimResult, "ms" | "cached"> {
  const kind = analysis.kind;
  const plot = plots.find((p) => PLOT_NAME[kind].test(p.plotname));
  if (!plot) throw new SpiceError(`ngspice wrote no ${kind} result (plots: ${plots.map((p) => p.plotname).join(", ")})`);
  const hasScale = kind !== "op" && kind !== "tf";
  const vectors: Record<string, Float64Array> = {};
  const complex: Record<string, ComplexVector> = {};
  plot.variables.forEach((v, i) => {
    if (hasScale && i === 0) return;
    const re = plot.real[i];
    const im = plot.imag?.[i];
    const values = im ? magnitude(re, im) : re;
    for (const name of namesOf(v.name)) {
      vectors[name] = values;
      if (im) complex[name] = { re, im };
    }
  });
  // .noise writes the band's integrated rms noise as a second plot of one point.
  const integrated = kind === "noise" ? plots.find((p) => /integrated noise/i.test(p.plotname)) : undefined;
  const totals = integrated && Object.fromEntries(integrated.variables.map((v, i) => [namesOf(v.name).at(-1)!, integrated.real[i][0]]));
  return {
    analysis: kind,
    scale: hasScale ? sweepScale(analysis, plot.real[0]) : new Float64Array(0),
    vectors,
    ...(plot.complex ? { complex } : {}),
    ...(totals ? { totals } : {}),
    ...(analysis.kind === "dc" ? { sweep: analysis.source } : {}),
    points: plot.points,
  };
}

// ngspice writes "v(out)", "i(v1)", sometimes "v1#branch"; measures also look nodes up as "out".
function namesOf(rawName: string): string[] {
  const name = rawName.toLowerCase();
  const branch = /^(.*)#branch$/.exec(name);
  if (branch) return [`i(${branch[1]})`];
  const node = /^v\((.*)\)$/.exec(name);
  if (node) return [name, node[1]];
  if (/^i\(.*\)$/.test(name)) return [name];
  return [name, `v(${name})`];
}

function magnitude(re: Float64Array, im: Float64Array): Float64Array {
  const out = new Float64Array(re.length);
  for (let k = 0; k < re.length; k++) out[k] = Math.hypot(re[k], im[k]);
  return out;
}
