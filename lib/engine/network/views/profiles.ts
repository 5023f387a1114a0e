import { cstrSteadyStates } from "../cstr";
import { pfrOutlet } from "../pfr";
import type { NetworkSpec } from "../types";
import { checkedStage, concentrationRecord, kineticsFor } from "./common";
import type { NetworkTrainProfiles, NetworkTrainProfilesOptions, TrainProfileStage, ViewStage } from "./types";

/**
 * Concentrations of every species along a given train against cumulative residence time (volumes over
 * the feed's v0, as the designer measures them): a chart of the train's profile.
 *
 * A tube: its inlet, pointsPerStage points evenly spaced in volume, its outlet, from one integration.
 * A tank: the stream entering it, then its contents (uniform, equal to its outlet) from its start to its
 * end: a step at the start, flat after. A tank with several steady states continues from the lowest
 * conversion, as the designer does. Each stage at its own temperature when given, else the feed's.
 * @throws EngineError naming the chemistry's field at fault, or `stages.<s>.volume` / `.temperature`.
 */
export function networkTrainProfiles(chemistry: NetworkSpec, stages: readonly ViewStage[], options: NetworkTrainProfilesOptions = {}): NetworkTrainProfiles {
  const kin = kineticsFor(chemistry);
  const net = kin.net;
  const inside = options.pointsPerStage ?? 30;
  const checked = stages.map((s, i) => checkedStage(kin, s, i));
  let F: Float64Array = net.F0;
  let inletT = net.T0;
  let start = 0;
  const out: TrainProfileStage[] = checked.map(({ type, volume, temperature: T }, s) => {
    const tau = volume / net.v0;
    const end = start + tau;
    const at = (t: number, flows: ArrayLike<number>, temperature = T) => ({ residenceTime: t, concentrations: concentrationRecord(kin, flows, temperature) });
    let points: TrainProfileStage["points"];
    if (type === "PFR") {
      if (volume === 0) points = [at(start, F), at(end, F)];
      else {
        const volumes = Array.from({ length: inside + 2 }, (_, k) => (k === inside + 1 ? volume : (volume * k) / (inside + 1)));
        const tube = pfrOutlet(kin, F, T, volume, { outputVolumes: volumes, path: `stages.${s}` });
        // Times from the start plus the volume along over v0, the last one exactly the stage's end.
        points = tube.profile.map((q, k) => at(k === inside + 1 ? end : start + q.volume / net.v0, q.flows));
        F = tube.flows;
      }
    } else {
      const inlet = at(start, F, inletT);
      if (volume > 0) F = cstrSteadyStates(kin, F, T, volume, { path: `stages.${s}` })[0].flows;
      points = volume > 0 ? [inlet, at(start, F), at(end, F)] : [inlet, at(end, F)];
    }
    const stage: TrainProfileStage = { type, startResidenceTime: start, endResidenceTime: end, points };
    start = end;
    inletT = T;
    return stage;
  });
  return { species: [...net.species], stages: out };
}
