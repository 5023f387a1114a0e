/**
 * The curves a report of several reactions draws, computed from the chemistry and the frozen train:
 * the profile along the train (each stage's segment of the concentration path) and the single tube
 * and single stirred tanks from the same feed. Recomputed when the report is read rather than
 * stored with the pin; a chemistry the engine refuses leaves the chart out with the reason in words.
 */
import { EngineError, networkPaths, networkTrainProfiles, type NetworkSpec } from "@/lib/engine";
import type { PinnedNetworkCandidate } from "@/lib/sweeps/stored-json";
import type { NetworkCurves } from "./network-report";

/** Points along each tube stage of the train: enough for a smooth segment in print. */
const POINTS_PER_STAGE = 40;

export function networkCurves(spec: Record<string, unknown>, candidate: Pick<PinnedNetworkCandidate, "stages">, product: string | null): NetworkCurves {
  const chemistry = { feed: spec.feed, phase: spec.phase, reactions: spec.reactions, keyReactant: spec.keyReactant, thermal: spec.thermal } as NetworkSpec;
  const stages = candidate.stages.map((s) => ({ type: s.type, volume: s.volume, temperature: s.temperature }));
  try {
    const profiles = networkTrainProfiles(chemistry, stages, { pointsPerStage: POINTS_PER_STAGE });
    const paths = networkPaths(chemistry, product ?? undefined);
    return { profiles, paths, note: null };
  } catch (err) {
    if (!(err instanceof EngineError)) throw err;
    return { profiles: null, paths: null, note: `The concentration path could not be computed: ${err.message}.` };
  }
}
