/**
 * Volume units of the charts and result tables, on the shared unit table (lib/units/display.ts,
 * exact definitions: 1 US gal = 3.785411784 L, 1 ft3 = 28.316846592 L).
 */
import { fromSI, UNITS, type VolumeUnit } from "@/lib/units/display";
import { formatNumber, TABLE_NUMBERS } from "@/lib/format/numbers";

export type { VolumeUnit };

export const VOLUME_UNITS: VolumeUnit[] = ["m3", "L", "gal", "ft3"];
export const VOLUME_LABEL = Object.fromEntries(VOLUME_UNITS.map((u) => [u, UNITS.volume[u].label])) as Record<VolumeUnit, string>;

/** A volume in m3 expressed in `unit`. */
export function fromCubicMetres(m3: number, unit: VolumeUnit): number {
  return fromSI("volume", m3, unit);
}

export function isVolumeUnit(v: unknown): v is VolumeUnit {
  return typeof v === "string" && (VOLUME_UNITS as string[]).includes(v);
}

/** A volume in m3 shown in `unit` with its label. */
export function formatVolume(m3: number | null | undefined, unit: VolumeUnit, digits = 3): string {
  if (m3 === null || m3 === undefined || !Number.isFinite(m3)) return "—";
  return `${formatNumber(fromCubicMetres(m3, unit), digits, TABLE_NUMBERS)} ${VOLUME_LABEL[unit]}`;
}
