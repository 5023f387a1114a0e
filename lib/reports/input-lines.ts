/**
 * The inputs a pinned design was computed from, as labelled lines for the report's appendix: each
 * stored number with the label its form shows and its SI unit, so a reviewer can check what the
 * calculation read without reading a data format. Pure.
 */
import { labelFor } from "@/lib/schemas/field-labels";
import { formatNumber, RECORD_NUMBERS } from "@/lib/format/numbers";

export interface InputLine {
  label: string;
  value: string;
}

/** SI units of the stored quantities, by the last key of their path. */
const SI_UNITS: Record<string, string> = {
  flowA: "mol/s",
  concA: "mol/m³",
  temperature: "K",
  referenceTemperature: "K",
  maxTemperature: "K",
  interstageTemperature: "K",
  adiabaticRise: "K",
  activationEnergy: "J/mol",
  volume: "m³",
  maxVesselVolume: "m³",
  vmax: "mol/(m³·s)",
  km: "mol/m³",
  ki: "mol/m³",
  volumetricFlow: "m³/s",
  maxTotalVolume: "m³",
  maxStageVolume: "m³",
};

/** A number under a record of concentrations ("feed.concentrations.A") is one, whatever the species' name. */
const unitOf = (path: (string | number)[]) => SI_UNITS[String(path[path.length - 1])] ?? (path[path.length - 2] === "concentrations" ? "mol/m³" : undefined);

const skip = new Set(["shownUnits"]);

function valueText(unit: string | undefined, v: unknown): string {
  if (typeof v === "number") return unit ? `${formatNumber(v, 6, RECORD_NUMBERS)} ${unit}` : formatNumber(v, 6, RECORD_NUMBERS);
  if (typeof v === "boolean") return v ? "yes" : "no";
  return String(v);
}

/** Every leaf of the stored inputs, in order, e.g. { label: "Feed rate of A", value: "1.389 mol/s" }. */
export function inputLines(spec: Record<string, unknown>): InputLine[] {
  const out: InputLine[] = [];
  const walk = (v: unknown, path: (string | number)[]) => {
    const key = String(path[path.length - 1] ?? "");
    if (skip.has(key)) return;
    if (Array.isArray(v)) {
      if (v.every((x) => typeof x !== "object" || x === null)) out.push({ label: labelFor(path), value: v.map((x) => valueText(unitOf(path), x)).join(", ") });
      else v.forEach((x, i) => walk(x, [...path, i]));
    } else if (v && typeof v === "object") {
      for (const [k, x] of Object.entries(v as Record<string, unknown>)) walk(x, [...path, k]);
    } else if (v !== undefined && v !== null && v !== "") {
      out.push({ label: labelFor(path), value: valueText(unitOf(path), v) });
    }
  };
  walk(spec, []);
  return out;
}
