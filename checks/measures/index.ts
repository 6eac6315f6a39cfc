// Measurements on simulation results (DESIGN.md "Check scripts"). Inputs and outputs are SI
// numbers; the script evaluator converts mathjs units at the boundary.
import { dcAt } from "./dc";
import { at as tranAt } from "./tran";
import type { SimResult } from "../spice/types";

export { avg, freq, peak, pp, rms, startup, trough } from "./tran";
export { thd, THD_HARMONICS } from "./thd";
export { f3db, gain_db, phase, HALF_POWER_DB } from "./ac";
export { cross_freq, max_gain_db, min_gain_db, peak_freq, peak_gain_db, phase_margin } from "./ac-band";
export { overshoot, rise_time, settling_time, slew_rate } from "./step";
export { crossing, slope } from "./dc";
export { noise_density, noise_rms } from "./noise";
export { tf_gain, tf_rin, tf_rout } from "./tf";
export { i, v } from "./op";
export { waveformFor, MAX_PLOT_POINTS, type PlotWindow, type Waveform } from "./waveform";
export { MeasureError, NothingToMeasure } from "./signal";

/** at(res, node, x): the value at a time on a transient, at a swept value on a DC sweep. */
export const at = (res: SimResult, node: string, x: number) => (res?.analysis === "dc" ? dcAt(res, node, x) : tranAt(res, node, x));
