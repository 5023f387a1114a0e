/**
 * The chemistry of a design of several reactions in words: the feed species by species, each reaction
 * as an equation with its rate law and constants, the heat mode, the objective and the limits. Numbers
 * are shown in the units the engineer typed (the model's `shownUnits`), with the stored value beside
 * them when that differs; a quantity kept as a string ("0.5 L/(mol*s)") is shown as written. Pure.
 */
import { formatNumber, RECORD_NUMBERS } from "@/lib/format/numbers";
import { fromSI, isUnit, rateConstantFromSI, rateConstantLabel, unitLabel, type UnitKind } from "@/lib/units/display";
import { splitRateConstantUnit } from "@/lib/units/typed-units";
import { quantity, rateConstantUnit, type WordLine } from "./kinetics-words";

type Obj = Record<string, unknown>;
const obj = (v: unknown): Obj => (v && typeof v === "object" && !Array.isArray(v) ? (v as Obj) : {});
const fmt = (v: number, digits = 4) => formatNumber(v, digits, RECORD_NUMBERS);

export interface ReactionWords {
  /** 1-based, as the kinetics screen numbers them. */
  index: number;
  /** e.g. "2 A → D". */
  equation: string;
  law: string;
  /** e.g. "r = k·C_A² − k_rev·C_B". */
  formula: string;
  constants: WordLine[];
}

/** A stored number of `kind` in the unit the engineer picked for `field`, the stored SI value beside it. */
function typed(v: unknown, kind: UnitKind, siLabel: string, shown: Record<string, string>, field: string, digits = 4): string {
  if (typeof v !== "number") return quantity(v, siLabel);
  const unit = shown[field];
  const si = `${fmt(v, digits)} ${siLabel}`;
  if (!unit || !isUnit(kind, unit) || unitLabel(kind, unit) === siLabel) return si;
  return `${fmt(fromSI(kind, v, unit), digits)} ${unitLabel(kind, unit)} (${si})`;
}

const totalOrder = (orders: unknown) => Object.values(obj(orders)).reduce<number>((s, n) => s + (typeof n === "number" ? n : 0), 0);

/** A power-law constant of total order n in the basis typed for it ("mol/L|h"), or in SI. */
function rateConstant(v: unknown, orders: unknown, shown: Record<string, string>, field: string): string {
  const n = totalOrder(orders);
  if (typeof v !== "number") return quantity(v, rateConstantUnit(n));
  const si = `${fmt(v)} ${rateConstantUnit(n)}`;
  const basis = splitRateConstantUnit(shown[field]);
  if (!basis || (basis.conc === "mol/m3" && basis.time === "s")) return si;
  return `${fmt(rateConstantFromSI(v, n, basis.conc, basis.time))} ${rateConstantLabel(n, basis.conc, basis.time)} (${si})`;
}

const coefficientText = (n: number) => (Math.abs(n) === 1 ? "" : `${fmt(Math.abs(n))} `);

/** Stoichiometry as an equation: consumed species on the left, formed on the right ("A + B → 2 C"). */
export function reactionEquation(stoichiometry: unknown): string {
  const entries = Object.entries(obj(stoichiometry)).filter((e): e is [string, number] => typeof e[1] === "number" && e[1] !== 0);
  const side = (list: [string, number][]) => list.map(([s, n]) => `${coefficientText(n)}${s}`).join(" + ") || "nothing";
  return `${side(entries.filter(([, n]) => n < 0))} → ${side(entries.filter(([, n]) => n > 0))}`;
}

const concentrationTerm = (orders: unknown) =>
  Object.entries(obj(orders))
    .filter(([, n]) => typeof n === "number" && n !== 0)
    .map(([s, n]) => (n === 1 ? `C_${s}` : `C_${s}^${fmt(n as number)}`))
    .join("·");

/** One reaction's rate law and constants; `j` is its 0-based place in the list. */
export function describeNetworkReaction(reaction: unknown, j: number, shown: Record<string, string>): ReactionWords {
  const r = obj(reaction);
  const rate = obj(r.rate);
  const at = (key: string) => `reactions.${j}.rate.${key}`;
  const base = { index: j + 1, equation: reactionEquation(r.stoichiometry) };
  if (rate.law === "expression") {
    return {
      ...base,
      law: "expression",
      formula: `r = ${String(rate.expression ?? "")}`,
      constants: Object.entries(obj(rate.parameters)).map(([k, v]) => ({ label: k, value: quantity(v, "") })),
    };
  }
  const rev = rate.reverse ? obj(rate.reverse) : null;
  const term = (orders: unknown) => concentrationTerm(orders);
  const forward = term(rate.orders);
  const formula = `r = k${forward ? `·${forward}` : ""}${rev ? ` − k_rev${term(rev.orders) ? `·${term(rev.orders)}` : ""}` : ""}`;
  const constants: WordLine[] = [{ label: "k", value: rateConstant(rate.k, rate.orders, shown, at("k")) }];
  if (rate.activationEnergy !== undefined) constants.push({ label: "Activation energy", value: typed(rate.activationEnergy, "energyPerMol", "J/mol", shown, at("activationEnergy")) });
  if (rate.referenceTemperature !== undefined) constants.push({ label: "Reference temperature", value: typed(rate.referenceTemperature, "temperature", "K", shown, at("referenceTemperature"), 5) });
  if (rev) {
    constants.push({ label: "k_rev", value: rateConstant(rev.k, rev.orders, shown, at("reverse.k")) });
    if (rev.activationEnergy !== undefined) constants.push({ label: "Reverse activation energy", value: typed(rev.activationEnergy, "energyPerMol", "J/mol", shown, at("reverse.activationEnergy")) });
    if (rev.referenceTemperature !== undefined) constants.push({ label: "Reverse reference temperature", value: typed(rev.referenceTemperature, "temperature", "K", shown, at("reverse.referenceTemperature"), 5) });
  }
  const arrhenius = rate.activationEnergy !== undefined || rev?.activationEnergy !== undefined;
  return { ...base, law: `power law${rev ? ", reversible" : ""}${arrhenius ? ", Arrhenius" : ""}`, formula, constants };
}

/** Phase, feed flow and temperature, then each species' feed concentration. */
export function describeNetworkFeed(chemistry: unknown, shown: Record<string, string>): WordLine[] {
  const c = obj(chemistry);
  const feed = obj(c.feed);
  const lines: WordLine[] = [
    { label: "Phase", value: c.phase === "gas" ? "gas (isobaric, ideal)" : "liquid (constant density)" },
    { label: "Feed volumetric flow", value: quantity(feed.volumetricFlow, "m³/s") },
    { label: "Feed temperature", value: typed(feed.temperature ?? 298.15, "temperature", "K", shown, "feed.temperature", 5) + (feed.temperature === undefined ? " (default)" : "") },
  ];
  for (const [species, v] of Object.entries(obj(feed.concentrations))) {
    // The editor may keep one unit for all concentrations or one per species.
    const field = shown[`feed.concentrations.${species}`] ? `feed.concentrations.${species}` : "feed.concentrations";
    lines.push({ label: `Feed concentration of ${species}`, value: typed(v, "concentration", "mol/m³", shown, field) });
  }
  return lines;
}

/** The heat mode in the words of the sweep form. */
export function describeHeat(thermal: unknown, shown: Record<string, string> = {}): string {
  const t = obj(thermal);
  if (t.mode === "stageTemperature") {
    return `Each stage at its own temperature, chosen between ${typed(t.min, "temperature", "K", shown, "thermal.min", 5)} and ${typed(t.max, "temperature", "K", shown, "thermal.max", 5)}`;
  }
  return "Isothermal at the feed temperature";
}

/** The objective's words on screen: "Highest yield of B", "Highest selectivity to B", "Least total volume". */
export function objectiveWords(objective: unknown): string {
  const o = obj(objective);
  if (o.maximise === "yield") return `Highest yield of ${String(o.product)}`;
  if (o.maximise === "selectivity") return `Highest selectivity to ${String(o.product)}`;
  return "Least total volume";
}

/** Objective, limits and the trains searched. */
export function describeNetworkObjective(spec: unknown): WordLine[] {
  const s = obj(spec);
  const c = obj(s.constraints);
  const train = obj(s.train);
  const lines: WordLine[] = [{ label: "Objective", value: objectiveWords(s.objective) }];
  const pct = (v: unknown) => (typeof v === "number" ? `${fmt(v * 100)} %` : "—");
  if (c.minConversion !== undefined) lines.push({ label: "Minimum conversion", value: pct(c.minConversion) });
  if (c.minYield !== undefined) lines.push({ label: "Minimum yield", value: pct(c.minYield) });
  if (c.maxTotalVolume !== undefined) lines.push({ label: "Largest total volume", value: quantity(c.maxTotalVolume, "m³") });
  if (c.maxStageVolume !== undefined) lines.push({ label: "Largest stage volume", value: quantity(c.maxStageVolume, "m³") });
  if (lines.length === 1) lines.push({ label: "Limits", value: "none" });
  if (typeof train.maxStages === "number") lines.push({ label: "Trains searched", value: `every sequence of up to ${train.maxStages} stages of ${(Array.isArray(train.types) ? train.types : ["CSTR", "PFR"]).join(", ")}` });
  if (Array.isArray(train.candidates)) lines.push({ label: "Trains searched", value: `${train.candidates.length} listed sequences` });
  return lines;
}
