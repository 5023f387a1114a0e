"use client";

import { createContext, useContext, useMemo } from "react";
import type { UnitKind } from "@/lib/units/display";
import { DEFAULT_DISPLAY_PREFERENCE, resolveDisplayUnits, type DisplayPreference, type DisplayUnits } from "@/lib/units/display-preference";

const DisplayPreferenceContext = createContext<DisplayPreference>(DEFAULT_DISPLAY_PREFERENCE);

/** The signed-in user's display-unit choice, read once by the signed-in layout. */
export function DisplayUnitsProvider({ preference, children }: { preference: DisplayPreference; children: React.ReactNode }) {
  return <DisplayPreferenceContext.Provider value={preference}>{children}</DisplayPreferenceContext.Provider>;
}

export function useDisplayPreference(): DisplayPreference {
  return useContext(DisplayPreferenceContext);
}

/** The units this screen shows its numbers in (see lib/units/display-preference.ts). */
export function useDisplayUnits(largestVolume?: number | null, typed?: Partial<Record<UnitKind, string>>): DisplayUnits {
  const preference = useDisplayPreference();
  const typedKey = typed ? JSON.stringify(typed) : "";
  // eslint-disable-next-line react-hooks/exhaustive-deps -- typedKey stands for typed
  return useMemo(() => resolveDisplayUnits(preference, typed, { largestVolume }), [preference, largestVolume, typedKey]);
}
