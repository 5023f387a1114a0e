"use client";

import { useDisplayPreference, useDisplayUnits } from "@/components/layout/display-units-context";
import type { UnitKind } from "@/lib/units/display";

/**
 * The concentration and time units a network result speaks. "As typed" shows the units the model was
 * typed in, and mol/m³ and seconds where it kept none (the engine's own, so nothing is rounded into a
 * unit the engineer never chose); the other display choices follow their own set.
 */
export function useNetworkUnits(typed?: Partial<Record<UnitKind, string>>): { concentration: string; time: string } {
  const preference = useDisplayPreference();
  const shown = useDisplayUnits(null, typed);
  if (preference === "as-typed") return { concentration: typed?.concentration ?? "mol/m3", time: typed?.time ?? "s" };
  return { concentration: shown.concentration, time: shown.time };
}
