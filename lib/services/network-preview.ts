import { CAUTIONS, EngineError, networkPaths, type NetworkPaths } from "@/lib/engine";
import type { NetworkPreviewRequest } from "@/lib/schemas/network-preview";
import { toBadRequest } from "./engine-errors";

/**
 * Residence times drawn: finer than the engine's default so the readout of the best concentration sits
 * within about 1e-4 of the true maximum; the cost is the same (the tube is one integration either way).
 */
const PREVIEW_POINTS = 200;

export interface NetworkPreview {
  kind: "network";
  /** The single tube and the single stirred tanks of every size from the feed (engine `networkPaths`). */
  paths: NetworkPaths;
  cautions: string[];
}

/**
 * The live charts of a draft model of several reactions: the concentration path of a single tube and of
 * single stirred tanks from the feed, with the instantaneous selectivity along the tube. Nothing is
 * stored. The engine's refusal of the chemistry (a bad unit, an expression it cannot read) comes back
 * as a 400 at the field, keyed by its place in the request ("spec.reactions.1.rate.k").
 */
export function previewNetwork({ spec, product }: NetworkPreviewRequest): NetworkPreview {
  // The model's own fields that are not chemistry stay out of the engine's input.
  const { product: wanted, shownUnits: _shown, ...chemistry } = spec;
  try {
    return { kind: "network", paths: networkPaths(chemistry, product ?? wanted, { points: PREVIEW_POINTS }), cautions: [...CAUTIONS] };
  } catch (err) {
    if (err instanceof EngineError) throw toBadRequest(err, "spec");
    throw err;
  }
}
