"use client";

import { createContext, useContext, useMemo, useState } from "react";
import type { UnitKind } from "@/lib/units/display";
import { DEFAULT_DISPLAY_PREFERENCE, resolveDisplayUnits, type DisplayPreference, type DisplayUnits } from "@/lib/units/display-preference";

const DisplayPreferenceContext = createContext<{ preference: DisplayPreference; setPreference: (p: DisplayPreference) => void }>({
  preference: DEFAULT_DISPLAY_PREFERENCE,
  setPreference: () => {},
});

/**
 * The signed-in user's display-unit choice, read by the signed-in layout. The settings form sets
 * it here after saving, so client screens follow at once without refreshing the layout.
 */
export function DisplayUnitsProvider({ preference: initial, children }: { preference: DisplayPreference; children: React.ReactNode }) {
  const [preference, setPreference] = useState(initial);
  const value = useMemo(() => ({ preference, setPreference }), [preference]);
  return <DisplayPreferenceContext.Provider value={value}>{children}</DisplayPreferenceContext.Provider>;
}

export function useDisplayPreference(): DisplayPreference {
  return useContext(DisplayPreferenceContext).preference;
}

export function useSetDisplayPreference(): (p: DisplayPreference) => void {
  return useContext(DisplayPreferenceContext).setPreference;
}

const TypedUnitsContext = createContext<Partial<Record<UnitKind, string>> | undefined>(undefined);

/** The units the kinetics behind this screen was typed in, for the "as typed" choice. */
export function TypedUnitsProvider({ units, children }: { units: Partial<Record<UnitKind, string>>; children: React.ReactNode }) {
  return <TypedUnitsContext.Provider value={units}>{children}</TypedUnitsContext.Provider>;
}

/** The units this screen shows its numbers in (see lib/units/display-preference.ts). */
export function useDisplayUnits(largestVolume?: number | null, typedHere?: Partial<Record<UnitKind, string>>): DisplayUnits {
  const preference = useDisplayPreference();
  const fromPage = useContext(TypedUnitsContext);
  const typed = typedHere ?? fromPage;
  const typedKey = typed ? JSON.stringify(typed) : "";
  // eslint-disable-next-line react-hooks/exhaustive-deps -- typedKey stands for typed
  return useMemo(() => resolveDisplayUnits(preference, typed, { largestVolume }), [preference, largestVolume, typedKey]);
}
