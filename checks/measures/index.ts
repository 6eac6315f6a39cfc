// Measurements on simulation results (DESIGN.md "Check scripts"). Inputs and outputs are SI
// numbers; the script evaluator converts mathjs units at the boundary.
export { avg, at, freq, peak, pp, rms, startup, trough } from "./tran";
export { thd, THD_HARMONICS } from "./thd";
export { f3db, gain_db, phase, HALF_POWER_DB } from "./ac";
export { i, v } from "./op";
export { waveformFor, MAX_PLOT_POINTS, type PlotWindow, type Waveform } from "./waveform";
export { MeasureError, NothingToMeasure } from "./signal";
