/**
 * The cost basis screen's flat form (one text per API field path) and its mapping to the PUT body.
 * Numbers the user typed that are not numbers are sent as text, so the server names the field.
 */
import type { CostBasis } from "@/lib/schemas/costs";
import type { StageType } from "@/lib/engine";

export type CostForm = Record<string, string>;

export const NUMBER_FIELDS = ["vessels.CSTR.a", "vessels.CSTR.b", "vessels.CSTR.n", "vessels.PFR.a", "vessels.PFR.b", "vessels.PFR.n", "basisYear", "installationFactor.value"] as const;

export function basisToForm(b: CostBasis): CostForm {
  return {
    "vessels.CSTR.a": String(b.vessels.CSTR.a),
    "vessels.CSTR.b": String(b.vessels.CSTR.b),
    "vessels.CSTR.n": String(b.vessels.CSTR.n),
    "vessels.CSTR.source": b.vessels.CSTR.source,
    "vessels.PFR.a": String(b.vessels.PFR.a),
    "vessels.PFR.b": String(b.vessels.PFR.b),
    "vessels.PFR.n": String(b.vessels.PFR.n),
    "vessels.PFR.source": b.vessels.PFR.source,
    currency: b.currency,
    basisYear: String(b.basisYear),
    "sizes.mode": b.sizes.mode,
    "sizes.min": b.sizes.mode === "r10" ? String(b.sizes.min) : "0.5",
    "sizes.max": b.sizes.mode === "r10" ? String(b.sizes.max) : "100",
    "sizes.values": b.sizes.mode === "custom" ? b.sizes.values.join(", ") : "",
    maxVesselVolume: b.maxVesselVolume === null ? "" : String(b.maxVesselVolume),
    "installationFactor.value": String(b.installationFactor.value),
    "installationFactor.source": b.installationFactor.source,
  };
}

const num = (s: string): number | string => (s.trim() !== "" && Number.isFinite(Number(s)) ? Number(s) : s);

export function formToBody(f: CostForm): unknown {
  const mode = f["sizes.mode"];
  const sizes =
    mode === "r10"
      ? { mode, min: num(f["sizes.min"]), max: num(f["sizes.max"]) }
      : mode === "custom"
        ? { mode, values: f["sizes.values"].split(/[,;\s]+/).filter(Boolean).map(num) }
        : { mode };
  const vessel = (t: StageType) => ({ a: num(f[`vessels.${t}.a`]), b: num(f[`vessels.${t}.b`]), n: num(f[`vessels.${t}.n`]), source: f[`vessels.${t}.source`] });
  return {
    vessels: { CSTR: vessel("CSTR"), PFR: vessel("PFR") },
    currency: f.currency.trim().toUpperCase(),
    basisYear: num(f.basisYear),
    sizes,
    maxVesselVolume: f.maxVesselVolume.trim() === "" ? null : num(f.maxVesselVolume),
    installationFactor: { value: num(f["installationFactor.value"]), source: f["installationFactor.source"] },
  };
}

/** A server field path → the form field that shows it (sizes.values.3 → sizes.values). */
export function formFieldOf(path: string): string {
  return path.replace(/^(sizes\.values)\.\d+$/, "$1");
}
