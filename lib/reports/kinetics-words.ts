/**
 * The feed, reaction and thermal mode of a frozen spec in words, with their units: what a
 * reader of the design package needs without opening the JSON. Pure; numbers are SI unless
 * the spec holds a quantity string, which is shown as typed.
 */

import { fromSI, SI_UNIT, unitLabel } from "@/lib/units/display";
import type { DisplayUnits } from "@/lib/units/display-preference";
import { formatNumber, RECORD_NUMBERS } from "@/lib/format/numbers";
import { STAGE_TYPES, stageTypeName } from "@/lib/stage-types";

export interface WordLine {
  label: string;
  value: string;
}

type Obj = Record<string, unknown>;
const obj = (v: unknown): Obj => (v && typeof v === "object" && !Array.isArray(v) ? (v as Obj) : {});

/** The units a reader chose for the feed and temperatures; absent, the stored SI units are shown. */
export type WordUnits = Partial<Pick<DisplayUnits, "molarFlow" | "concentration" | "temperature" | "temperatureDifference">>;

/**
 * A stored SI number in the reader's unit, with the SI value beside it for the record
 * ("5 kmol/h (1.389 mol/s)"); in SI alone when the reader's unit is the SI one or not given.
 */
function shown(v: unknown, kind: keyof WordUnits, siLabel: string, units?: WordUnits): string {
  const unit = units?.[kind];
  // Five figures for temperatures, so 333.15 K reads as typed rather than as 333.1 K.
  const digits = kind === "temperature" ? 5 : 4;
  if (typeof v !== "number") return quantity(v, siLabel);
  const si = `${formatNumber(v, digits, RECORD_NUMBERS)} ${siLabel}`;
  if (!unit || unit === SI_UNIT[kind]) return si;
  return `${formatNumber(fromSI(kind, v, unit), digits, RECORD_NUMBERS)} ${unitLabel(kind, unit)} (${si})`;
}

/** A spec value with its SI unit; a quantity string ("2 mol/L") is shown as given. */
export function quantity(v: unknown, unit: string): string {
  if (typeof v === "string") return v;
  if (typeof v !== "number") return "—";
  return unit ? `${formatNumber(v, 4, RECORD_NUMBERS)} ${unit}` : formatNumber(v, 4, RECORD_NUMBERS);
}

const orderText = (orders: unknown) =>
  Object.entries(obj(orders))
    .filter(([, n]) => typeof n === "number" && n !== 0)
    .map(([s, n]) => (n === 1 ? `C_${s}` : `C_${s}^${n}`))
    .join("·") || "1";

const totalOrder = (orders: unknown) => Object.values(obj(orders)).reduce<number>((s, n) => s + (typeof n === "number" ? n : 0), 0);

/** Unit of a power-law rate constant of total order n: (mol/m3)^(1-n)/s. */
export function rateConstantUnit(order: number): string {
  const p = Number((1 - order).toPrecision(6));
  if (p === 0) return "1/s";
  if (p === 1) return "mol/(m³·s)";
  return `(mol/m³)^${p}/s`;
}

/** The rate law: its name, its formula and each parameter with its unit. */
export function describeRate(rate: unknown): { law: string; formula: string; parameters: WordLine[] } {
  const r = obj(rate);
  switch (r.law) {
    case "power": {
      const rev = r.reverse ? obj(r.reverse) : null;
      const formula = `−rA = k·${orderText(r.orders)}` + (rev ? ` − k_rev·${orderText(rev.orders)}` : "");
      const parameters: WordLine[] = [{ label: "k", value: quantity(r.k, rateConstantUnit(totalOrder(r.orders))) }];
      if (r.activationEnergy !== undefined) parameters.push({ label: "Activation energy", value: quantity(r.activationEnergy, "J/mol") });
      if (r.referenceTemperature !== undefined) parameters.push({ label: "Reference temperature", value: quantity(r.referenceTemperature, "K") });
      if (rev) {
        parameters.push({ label: "k_rev", value: quantity(rev.k, rateConstantUnit(totalOrder(rev.orders))) });
        if (rev.activationEnergy !== undefined) parameters.push({ label: "Reverse activation energy", value: quantity(rev.activationEnergy, "J/mol") });
      }
      return { law: rev ? "power law, reversible" : "power law", formula, parameters };
    }
    case "saturation": {
      const parameters: WordLine[] = [
        { label: "vmax", value: quantity(r.vmax, "mol/(m³·s)") },
        { label: "km", value: quantity(r.km, "mol/m³") },
      ];
      if (r.ki !== undefined) parameters.push({ label: "ki", value: quantity(r.ki, "mol/m³") });
      if (r.activationEnergy !== undefined) parameters.push({ label: "Activation energy", value: quantity(r.activationEnergy, "J/mol") });
      return { law: "saturation", formula: `−rA = vmax·C_A/(km + C_A${r.ki !== undefined ? " + C_A²/ki" : ""})`, parameters };
    }
    case "expression":
      return {
        law: "expression",
        formula: `−rA = ${String(r.expression ?? "")}`,
        parameters: Object.entries(obj(r.parameters)).map(([k, v]) => ({ label: k, value: quantity(v, "") })),
      };
    case "table": {
      const xs = Array.isArray(r.conversion) ? (r.conversion as number[]) : [];
      return {
        law: "measured table",
        formula: "−rA interpolated (PCHIP) between measured points, never extrapolated",
        parameters: [
          { label: "Points", value: String(xs.length) },
          { label: "Conversion range", value: xs.length ? `${formatNumber(xs[0], 4, RECORD_NUMBERS)} to ${formatNumber(xs[xs.length - 1], 4, RECORD_NUMBERS)}` : "—" },
        ],
      };
    }
    default:
      return { law: String(r.law ?? "unknown"), formula: "—", parameters: [] };
  }
}

/** Feed lines: FA0, CA0, T0 and the other species' ratios. */
export function describeFeed(feed: unknown, units?: WordUnits): WordLine[] {
  const f = obj(feed);
  const lines: WordLine[] = [
    { label: "Feed rate of A (FA0)", value: shown(f.flowA, "molarFlow", "mol/s", units) },
    { label: "Feed concentration of A (CA0)", value: shown(f.concA, "concentration", "mol/m³", units) },
    { label: "Feed temperature (T0)", value: shown(f.temperature ?? 298.15, "temperature", "K", units) + (f.temperature === undefined ? " (default)" : "") },
  ];
  const ratios = Object.entries(obj(f.ratios));
  if (ratios.length) lines.push({ label: "Other species (C_i0/C_A0)", value: ratios.map(([s, v]) => `${s} ${formatNumber(v, 4, RECORD_NUMBERS)}`).join(", ") });
  return lines;
}

/** Phase, stoichiometry and thermal mode. */
export function describeReaction(reaction: unknown, units?: WordUnits): WordLine[] {
  const r = obj(reaction);
  const t = obj(r.thermal);
  const stoich = Object.entries(obj(r.stoichiometry));
  const lines: WordLine[] = [
    { label: "Phase", value: r.phase === "gas" ? "gas (isobaric, ideal)" : "liquid (constant density)" },
    { label: "Stoichiometry", value: stoich.length ? stoich.map(([s, n]) => `${s} ${formatNumber(n, 4, RECORD_NUMBERS)}`).join(", ") : "A −1" },
  ];
  if (t.mode === "adiabatic") {
    lines.push({ label: "Thermal mode", value: "adiabatic" });
    lines.push({ label: "Adiabatic rise (full conversion)", value: shown(t.adiabaticRise, "temperatureDifference", "K", units) });
    if (t.maxTemperature !== undefined) lines.push({ label: "Highest temperature allowed", value: shown(t.maxTemperature, "temperature", "K", units) });
    if (t.interstageTemperature !== undefined) lines.push({ label: "Interstage inlet temperature", value: shown(t.interstageTemperature, "temperature", "K", units) });
  } else lines.push({ label: "Thermal mode", value: "isothermal at the feed temperature" });
  return lines;
}

/** The search and objective of the spec. */
export function describeObjective(spec: unknown): WordLine[] {
  const s = obj(spec);
  const o = obj(s.objective);
  const train = obj(s.train);
  const lines: WordLine[] = [{ label: "Objective", value: o.minimise === "cost" ? "least vessel cost" : "least total volume" }];
  if (typeof train.maxStages === "number") lines.push({ label: "Trains searched", value: `up to ${train.maxStages} stages of ${(Array.isArray(train.types) ? train.types : STAGE_TYPES).map(stageTypeName).join(", ")}` });
  if (Array.isArray(train.candidates)) lines.push({ label: "Trains searched", value: `${train.candidates.length} listed sequences` });
  if (train.multiset) lines.push({ label: "Trains searched", value: `orderings of ${Object.entries(obj(train.multiset)).map(([k, n]) => `${n} × ${k}`).join(" + ")}` });
  if (train.equalVolume) lines.push({ label: "Stage volumes", value: "all equal" });
  if (train.recycleRatio !== undefined) lines.push({ label: "Recycle ratio", value: `${train.recycleRatio}, fixed for every tube with recycle` });
  else if (JSON.stringify(train.types ?? train.candidates ?? []).includes("PFR-recycle")) lines.push({ label: "Recycle ratio", value: "chosen for the least volume, for each tube with recycle" });
  if (Array.isArray(o.standardSizes)) lines.push({ label: "Standard sizes", value: o.standardSizes.map((v) => quantity(v, "m³")).join(", ") });
  if (o.maxVesselVolume !== undefined) lines.push({ label: "Largest single vessel", value: quantity(o.maxVesselVolume, "m³") });
  return lines;
}
