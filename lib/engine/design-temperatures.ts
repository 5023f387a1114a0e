import { bestTemperaturePath, pathTemperatures, reversibleExothermic } from "./best-temperature-path";
import { ensure } from "./errors";
import type { SizingBasis } from "./sizing-basis";
import type { BestTemperaturePath, DesignSpec } from "./types";

/** The caution every design with chosen stage temperatures carries. */
export const TEMPERATURE_CAUTION =
  "Chosen stage temperatures assume the heating or cooling before each stage (and inside each stage held at its own temperature) can be supplied; the exchangers and their duty are not sized.";

/** Refuses what chosen stage temperatures do not support yet: both rate full vessels at given temperatures. */
export function checkChosenTemperatures(spec: DesignSpec, basis: SizingBasis): void {
  if (!basis.choice) return;
  ensure(!spec.train.equalVolume, "equal volumes are not available with stage temperatures to choose; give the temperatures as single values", "train.equalVolume");
  ensure(
    !(spec.objective?.minimise === "cost" && spec.objective.standardSizes),
    "standard sizes are not available with stage temperatures to choose; give the temperatures as single values or drop the standard sizes",
    "objective.standardSizes",
  );
}

/** The best temperature path for a reversible exothermic power law, when the train has a highest temperature. */
export function bestPathReference(spec: DesignSpec, basis: SizingBasis, target: number): BestTemperaturePath | null {
  if (!basis.reversible || !reversibleExothermic(spec.reaction)) return null;
  const range = pathTemperatures(basis);
  return range ? bestTemperaturePath(basis, target, range.lowest, range.highest) : null;
}
