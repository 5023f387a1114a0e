/**
 * Volume units of the charts and result tables, on the shared unit table (lib/units/display.ts,
 * exact definitions: 1 US gal = 3.785411784 L, 1 ft3 = 28.316846592 L).
 */
import { fromSI, UNITS, type VolumeUnit } from "@/lib/units/display";

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

/** A number to `digits` significant figures, without exponent for everyday sizes. */
export function formatNumber(v: number | null | undefined, digits = 3): string {
  if (v === null || v === undefined || !Number.isFinite(v)) return "—";
  if (v === 0) return "0";
  const a = Math.abs(v);
  if (a >= 1e6 || a < 1e-3) return v.toExponential(digits - 1);
  return Number(v.toPrecision(digits)).toLocaleString("en-US", { maximumFractionDigits: 6 });
}

/** A volume in m3 shown in `unit` with its label. */
export function formatVolume(m3: number | null | undefined, unit: VolumeUnit, digits = 3): string {
  if (m3 === null || m3 === undefined || !Number.isFinite(m3)) return "—";
  return `${formatNumber(fromCubicMetres(m3, unit), digits)} ${VOLUME_LABEL[unit]}`;
}
