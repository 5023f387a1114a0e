import { cstrSteadyStates } from "../cstr";
import { streamMeasures } from "../measures";
import { pfrOutlet } from "../pfr";
import type { NetworkSpec } from "../types";
import { checkedStage, kineticsFor, productIndex } from "./common";
import type { FixedTrainRating, FixedTrainStageRating, ViewStage } from "./types";

/**
 * What a train of given volumes (and temperatures) achieves when fed with this chemistry, computed as the
 * designer reports its own designs: tubes at the engine's normal tolerance, tanks by the full
 * steady-state search with every state listed when there are several and the train continuing from the
 * lowest conversion; the measures at the last outlet (conversion, and yield and selectivity of the
 * wanted product when one is named). Each stage at its own temperature when given, else the feed's.
 * @throws EngineError naming the chemistry's field, "product", or `stages.<s>...` for a stage at fault.
 */
export function rateNetworkTrain(chemistry: NetworkSpec, stages: readonly ViewStage[], product?: string): FixedTrainRating {
  const kin = kineticsFor(chemistry);
  const net = kin.net;
  productIndex(kin, product);
  const checked = stages.map((s, i) => checkedStage(kin, s, i));
  let F: Float64Array = net.F0;
  const rated: FixedTrainStageRating[] = checked.map(({ type, volume: V, temperature: T }, s) => {
    const stage: FixedTrainStageRating = { outlet: {} };
    if (V > 0 && type === "PFR") F = pfrOutlet(kin, F, T, V, { path: `stages.${s}` }).flows;
    else if (V > 0) {
      const states = cstrSteadyStates(kin, F, T, V, { path: `stages.${s}` });
      if (states.length > 1) stage.steadyStates = states.map((q) => ({ conversion: q.conversion, outlet: streamMeasures(kin, q.flows, T).outlet }));
      F = states[0].flows;
    }
    stage.outlet = streamMeasures(kin, F, T).outlet;
    return stage;
  });
  // A gas's outlet concentrations are at the last stage's temperature (as the designer reports them).
  const lastT = checked.length > 0 ? checked[checked.length - 1].temperature : net.T0;
  const m = streamMeasures(kin, F, lastT, product);
  return { conversion: m.conversion, yield: m.yield, selectivity: m.selectivity, outlet: m.outlet, stages: rated };
}
