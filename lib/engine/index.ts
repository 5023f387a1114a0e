/**
 * Seriatim's computational engine: kinetics, ideal stages and globally optimal reactor trains.
 * Pure functions only; this file is the engine's only public entry.
 */
export { designTrains, type DesignOptions } from "./design";
export { rateTrain } from "./rate-train";
export { stagePlots } from "./stage-plots";
export { designNetwork } from "./network/design";
export type * from "./network/design-types";
// Views of a network (paths, train profiles, fixed trains) for the screens and the report.
export { networkPaths } from "./network/views/paths";
export { networkTrainProfiles } from "./network/views/profiles";
export { rateNetworkTrain } from "./network/views/fixed-train";
export type * from "./network/views/types";
export { EngineError, type EngineErrorCode } from "./errors";
export { GAS_CONSTANT } from "./arrhenius";
export { MAX_STAGES } from "./sequences";
export type * from "./types";
export { toSI, DIM } from "./units";
export { normaliseKinetics, normaliseRatingSpec } from "./normalise-spec";
export { rateTrainOutlet } from "./outlet-rating";
export { EMPTY_STAGE_STEP } from "./design";
export { RECYCLE_RATIO_MAX } from "./recycle";
export { MAX_RATED_VESSEL, VOLUME_LIMITS } from "./magnitude";
export { CAUTIONS, MODEL_ASSUMPTIONS, thermalWarnings } from "./cautions";
