import type { SimRequest } from "../engine/executor";
import { ENGINE_VERSION } from "../version";
import { cacheKey } from "./cache";
import { circuitOffset, writeDeck } from "./deck";
import { defaultModelsDir } from "./paths";
import type { SimRequest as SimInput } from "./types";
import { SPICE_RUNNER_VERSION, ngspiceVersion } from "./version";

/**
 * The self-contained request for one simulation: the deck as ngspice will read it and its
 * content hash. Throws SpiceError (naming the circuit line) for a refused netlist or analysis.
 */
export function simRequest(input: SimInput, modelsDir = defaultModelsDir(), engineVersion = ENGINE_VERSION): SimRequest {
  const deck = writeDeck(input, modelsDir);
  return {
    key: cacheKey(deck, ngspiceVersion(), `${engineVersion}/${SPICE_RUNNER_VERSION}`),
    deck,
    analysis: input.analysis,
    circuitOffset: circuitOffset(input),
    circuit: input.circuit,
    simSeconds: input.analysis.kind === "tran" ? input.analysis.stop : 0,
  };
}
