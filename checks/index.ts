// The check engine's public API: block file text in, plain JSON-able objects out.
// Everything outside checks/ imports from here only.

export { ENGINE_VERSION, modelLibraryHash } from "./version";
export { ngspiceVersion } from "./spice/version";
export { parseBlock } from "./block/parse";
export { withParams } from "./block/with-params";
export { unitChanges } from "./block/unit-changes";
export { eseries } from "./eseries";
export { spiceDeck } from "./spice-deck";
export { circuitRefusal } from "./spice/refusal";
export { scriptRefusal } from "./engine/script-refusal";
export { SpiceError } from "./spice/types";
export { importNetlist } from "./import-netlist";
export { MODEL_FILE, sanitizeModelFile, type ModelTexts } from "./spice/sanitize";
export { includedNames, modelDefinitions, type InlineModel, type ModelDefinition } from "./spice/model-file";
export { sharedModelFile, sharedModelNames } from "./spice/shared-models";
export { defaultModelsDir } from "./spice/paths";
export { formatQuantity, readQuantity } from "./units";
export { SLUG_RULE } from "./block/types";
export type { BlockError, ParamSpec, ParsedBlock } from "./block/types";
export type { CheckReport, Method, Quantity, Report, Waveform } from "./engine/types";
export type { RunProgress, SimExecutor, SimOutcome, SimRequest } from "./engine/executor";
export { DEFAULT_RUN_CAP, runCapFromEnv, type RunCap } from "./engine/plan";
export { localExecutor, defaultConcurrency, type LocalExecutorOptions } from "./spice/local-executor";
export { cacheIdentity, holdsCached, readCached, seesCache, writeCached, type CacheIdentity } from "./spice/cache";
export { defaultCacheDir } from "./spice/paths";
export { previewBlock, retune, verifyBlock, warmEngine, type VerifyOptions } from "./sandbox/api";
export { draftLane } from "./sandbox/client";
