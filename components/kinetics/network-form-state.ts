/**
 * The editor of a model of several reactions: its form values (what the engineer typed, each quantity
 * with the unit picked for it) and their mapping to the chemistry a kinetics version stores
 * (`NetworkKineticsSpec`, SI numbers plus `shownUnits`), both ways. Pure.
 *
 * Species carry a stable id ("s1", "s2"…) besides their name: a reaction's coefficients and orders are
 * keyed by that id, so renaming a species keeps every number typed against it, and removing one drops
 * exactly its entries.
 */
import { z } from "zod";
import { kineticsModelCreateSchema } from "@/lib/schemas/sweeps";
import { MAX_NETWORK_REACTIONS, MAX_NETWORK_SPECIES, networkKineticsSpecSchema, SPECIES_NAME, type NetworkKineticsSpec } from "@/lib/schemas/network-spec";
import { isUnit, rateConstantFromSI, rateConstantToSI, toSI, type UnitKind } from "@/lib/units/display";
import { RATE_CONSTANT_UNIT_SEPARATOR, splitRateConstantUnit } from "@/lib/units/typed-units";
import { asNumber, show, storedQuantities } from "./stored-quantities";
import { q, quantityInput, readTypedNumber, type FormIssue, type QuantityInput } from "./form-quantities";

const rateConstantInput = z.object({ value: z.string(), conc: z.string(), time: z.string() });
const row = z.object({ name: z.string(), value: z.string() });
/** Species id → the text typed for it (blank: not involved). */
const bySpecies = z.record(z.string(), z.string());

const reactionInput = z.object({
  coefficients: bySpecies,
  law: z.enum(["power", "expression"]),
  k: rateConstantInput,
  orders: bySpecies,
  reverseOn: z.boolean(),
  reverse: z.object({ k: rateConstantInput, orders: bySpecies, activationEnergy: quantityInput }),
  arrheniusOn: z.boolean(),
  activationEnergy: quantityInput,
  referenceTemperature: quantityInput,
  expression: z.string(),
  parameters: z.array(row),
});

export const networkFormValuesSchema = z.object({
  name: z.string(),
  note: z.string(),
  feed: z.object({ volumetricFlow: quantityInput, temperature: quantityInput }),
  species: z.array(z.object({ key: z.string(), name: z.string(), conc: quantityInput })),
  phase: z.enum(["liquid", "gas"]),
  /** Species ids; "" when none is chosen. */
  keyReactant: z.string(),
  product: z.string(),
  reactions: z.array(reactionInput),
});
export type NetworkFormValues = z.infer<typeof networkFormValuesSchema>;
export type NetworkReactionValues = z.infer<typeof reactionInput>;

/** A reaction with nothing typed in yet: a first-order power law. */
export function blankReaction(): NetworkReactionValues {
  return {
    coefficients: {},
    law: "power",
    k: { value: "", conc: "mol/L", time: "s" },
    orders: {},
    reverseOn: false,
    reverse: { k: { value: "", conc: "mol/L", time: "s" }, orders: {}, activationEnergy: q("", "kJ/mol") },
    arrheniusOn: false,
    activationEnergy: q("", "kJ/mol"),
    referenceTemperature: q("", "K"),
    expression: "",
    parameters: [],
  };
}

/** A new model's starting point: invented series chemistry, A → B wanted, B → C over-reaction. */
export function defaultNetworkValues(): NetworkFormValues {
  const r1 = blankReaction();
  r1.coefficients = { s1: "-1", s2: "1" };
  r1.orders = { s1: "1" };
  r1.k.value = "0.02";
  const r2 = blankReaction();
  r2.coefficients = { s2: "-1", s3: "1" };
  r2.orders = { s2: "1" };
  r2.k.value = "0.005";
  return {
    name: "",
    note: "",
    feed: { volumetricFlow: q("2", "L/s"), temperature: q("320", "K") },
    species: [
      { key: "s1", name: "A", conc: q("1", "mol/L") },
      { key: "s2", name: "B", conc: q("0", "mol/L") },
      { key: "s3", name: "C", conc: q("0", "mol/L") },
    ],
    phase: "liquid",
    keyReactant: "s1",
    product: "s2",
    reactions: [r1, r2],
  };
}

/** An id no species of the form has yet. */
export function nextSpeciesId(species: { key: string }[]): string {
  const used = species.map((s) => Number(/^s(\d+)$/.exec(s.key)?.[1] ?? 0));
  return `s${Math.max(0, ...used) + 1}`;
}

const sum = (r: Record<string, number>) => Object.values(r).reduce((a, b) => a + b, 0);
/** Our schemas' sentences follow a label ("must be above zero"); beside the field they start a sentence. */
const sentence = (m: string) => m.charAt(0).toUpperCase() + m.slice(1);

class Builder {
  issues: FormIssue[] = [];
  /** The unit picked for each quantity read, by its place in the stored chemistry: the model reopens as typed. */
  shown: Record<string, string> = {};
  issue(path: string, message: string) {
    this.issues.push({ path, message });
  }
  num(text: string | undefined, path: string, required = true): number | undefined {
    return readTypedNumber(text, required, (message) => this.issue(path, message));
  }
  quantity(kind: UnitKind, input: QuantityInput, formPath: string, shownAt: string, required = true): number | undefined {
    const n = this.num(input.value, `${formPath}.value`, required);
    if (n === undefined) return undefined;
    if (!isUnit(kind, input.unit)) {
      this.issue(`${formPath}.value`, "Pick a unit");
      return undefined;
    }
    this.shown[shownAt] = input.unit;
    return toSI(kind, n, input.unit);
  }
  /** Numbers typed per species (blank left out), keyed by species name. */
  bySpecies(values: Record<string, string> | undefined, names: Map<string, string>, formPath: string): Record<string, number> {
    const out: Record<string, number> = {};
    for (const [id, name] of names) {
      const text = values?.[id];
      if (text === undefined || text.trim() === "") continue;
      const n = this.num(text, `${formPath}.${id}`);
      if (n !== undefined) out[name] = n;
    }
    return out;
  }
  rateConstant(input: { value: string; conc: string; time: string }, order: number, formPath: string, shownAt: string): number | undefined {
    const n = this.num(input.value, `${formPath}.value`);
    if (n === undefined) return undefined;
    if (!isUnit("concentration", input.conc) || !isUnit("time", input.time)) {
      this.issue(`${formPath}.value`, "Pick a unit");
      return undefined;
    }
    this.shown[shownAt] = `${input.conc}${RATE_CONSTANT_UNIT_SEPARATOR}${input.time}`;
    return rateConstantToSI(n, order, input.conc, input.time);
  }
}

type Rate = NetworkKineticsSpec["reactions"][number]["rate"];

function buildRate(b: Builder, r: NetworkReactionValues, j: number, names: Map<string, string>): Rate | undefined {
  const at = `reactions.${j}`;
  if (r.law === "expression") {
    if (!r.expression.trim()) b.issue(`${at}.expression`, "Write the rate expression");
    const parameters: Record<string, number> = {};
    r.parameters.forEach((p, i) => {
      const name = p.name.trim();
      if (!SPECIES_NAME.test(name)) b.issue(`${at}.parameters.${i}.name`, "Name the parameter with letters, digits or _, starting with a letter");
      else if (name in parameters) b.issue(`${at}.parameters.${i}.name`, `${name} is listed twice`);
      const v = b.num(p.value, `${at}.parameters.${i}.value`);
      if (SPECIES_NAME.test(name) && v !== undefined) parameters[name] = v;
    });
    return { law: "expression", expression: r.expression.trim(), ...(Object.keys(parameters).length ? { parameters } : {}) };
  }
  const orders = b.bySpecies(r.orders, names, `${at}.orders`);
  const k = b.rateConstant(r.k, sum(orders), `${at}.k`, `${at}.rate.k`);
  const activationEnergy = r.arrheniusOn ? b.quantity("energyPerMol", r.activationEnergy, `${at}.activationEnergy`, `${at}.rate.activationEnergy`) : undefined;
  const referenceTemperature = r.arrheniusOn ? b.quantity("temperature", r.referenceTemperature, `${at}.referenceTemperature`, `${at}.rate.referenceTemperature`, false) : undefined;
  let reverse: Extract<Rate, { law: "power" }>["reverse"];
  if (r.reverseOn) {
    const rOrders = b.bySpecies(r.reverse.orders, names, `${at}.reverse.orders`);
    const rk = b.rateConstant(r.reverse.k, sum(rOrders), `${at}.reverse.k`, `${at}.rate.reverse.k`);
    const rEa = r.arrheniusOn ? b.quantity("energyPerMol", r.reverse.activationEnergy, `${at}.reverse.activationEnergy`, `${at}.rate.reverse.activationEnergy`, false) : undefined;
    if (rk !== undefined) reverse = { k: rk, orders: rOrders, ...(rEa !== undefined ? { activationEnergy: rEa } : {}) };
  }
  if (k === undefined) return undefined;
  return {
    law: "power",
    k,
    orders,
    ...(reverse ? { reverse } : {}),
    ...(activationEnergy !== undefined ? { activationEnergy } : {}),
    ...(referenceTemperature !== undefined ? { referenceTemperature } : {}),
  };
}

/** The stored chemistry of the form (SI, with the units typed), or the issues that keep it from being one. */
export function formToNetworkSpec(v: NetworkFormValues): { spec: NetworkKineticsSpec | null; issues: FormIssue[] } {
  const b = new Builder();
  const volumetricFlow = b.quantity("volumetricFlow", v.feed.volumetricFlow, "feed.volumetricFlow", "feed.volumetricFlow");
  const temperature = b.quantity("temperature", v.feed.temperature, "feed.temperature", "feed.temperature");

  // Species: valid, distinct names; their ids → names for the reactions' per-species fields.
  const names = new Map<string, string>();
  const concentrations: Record<string, number> = {};
  if (v.species.length === 0) b.issue("species", "List at least one species");
  if (v.species.length > MAX_NETWORK_SPECIES) b.issue("species", `List at most ${MAX_NETWORK_SPECIES} species`);
  const seen = new Set<string>();
  v.species.forEach((s, i) => {
    const name = s.name.trim();
    if (!SPECIES_NAME.test(name)) b.issue(`species.${i}.name`, "Name the species with letters, digits or _, starting with a letter (a rate expression calls it C_name)");
    else if (seen.has(name)) b.issue(`species.${i}.name`, `${name} is listed twice`);
    else {
      seen.add(name);
      names.set(s.key, name);
    }
    const c = b.quantity("concentration", s.conc, `species.${i}.conc`, `feed.concentrations.${name}`);
    if (c !== undefined && names.get(s.key) === name) concentrations[name] = c;
  });

  if (v.reactions.length === 0) b.issue("reactions", "Give at least one reaction");
  if (v.reactions.length > MAX_NETWORK_REACTIONS) b.issue("reactions", `Give at most ${MAX_NETWORK_REACTIONS} reactions`);
  const reactions: NetworkKineticsSpec["reactions"] = [];
  v.reactions.forEach((r, j) => {
    const stoichiometry = b.bySpecies(r.coefficients, names, `reactions.${j}.coefficients`);
    const rate = buildRate(b, r, j, names);
    if (rate) reactions.push({ stoichiometry, rate });
  });

  const keyReactant = names.get(v.keyReactant);
  if (!keyReactant) b.issue("keyReactant", "Choose the key reactant, the species whose conversion is measured");
  const product = v.product ? names.get(v.product) : undefined;
  if (v.product && !product) b.issue("product", "Choose the wanted product again");

  if (b.issues.length || volumetricFlow === undefined || !keyReactant) return { spec: null, issues: b.issues };
  const spec = {
    feed: { volumetricFlow, concentrations, ...(temperature !== undefined ? { temperature } : {}) },
    phase: v.phase,
    reactions,
    keyReactant,
    ...(product ? { product } : {}),
    shownUnits: b.shown,
  };
  const parsed = networkKineticsSpecSchema.safeParse(spec);
  if (!parsed.success) {
    return { spec: null, issues: parsed.error.issues.map((i) => ({ path: networkFormPathOf(i.path.join("."), v) || "reactions", message: sentence(i.message) })) };
  }
  return { spec: parsed.data, issues: [] };
}

/**
 * The form field that shows a problem reported at a path of the stored chemistry (as the schema, the
 * engine and the API name it; a leading "spec." is looked through); "" when no field fits.
 */
export function networkFormPathOf(specPath: string, v: NetworkFormValues): string {
  const p = specPath.replace(/^spec\./, "").split(".");
  const idOf = (name: string | undefined) => v.species.find((s) => s.name.trim() === name)?.key;
  const [head, a, b, c, d] = p;
  if (head === "name" || head === "note" || head === "phase" || head === "keyReactant" || head === "product") return p.length === 1 ? head : "";
  if (head === "feed") {
    if (a === "volumetricFlow" || a === "temperature") return `feed.${a}.value`;
    if (a === "concentrations") {
      const i = v.species.findIndex((s) => s.name.trim() === b);
      return i >= 0 ? `species.${i}.conc.value` : "species";
    }
    return "";
  }
  if (head !== "reactions") return "";
  if (a === undefined || !/^\d+$/.test(a)) return "reactions";
  const at = `reactions.${a}`;
  if (b === undefined || b === "stoichiometry") {
    const id = idOf(c);
    return id ? `${at}.coefficients.${id}` : `${at}.coefficients`;
  }
  if (b !== "rate") return `${at}.coefficients`;
  const perSpecies = (field: string, name: string | undefined) => {
    const id = idOf(name);
    return id ? `${field}.${id}` : field;
  };
  switch (c) {
    case "k":
      return `${at}.k.value`;
    case "orders":
      return perSpecies(`${at}.orders`, d);
    case "activationEnergy":
    case "referenceTemperature":
      return `${at}.${c}.value`;
    case "expression":
      return `${at}.expression`;
    case "parameters": {
      const i = v.reactions[Number(a)]?.parameters.findIndex((x) => x.name.trim() === d) ?? -1;
      return i >= 0 ? `${at}.parameters.${i}.value` : `${at}.parameters`;
    }
    case "reverse":
      if (d === "orders") return perSpecies(`${at}.reverse.orders`, p[5]);
      if (d === "activationEnergy") return `${at}.reverse.activationEnergy.value`;
      if (d === "referenceTemperature") return `${at}.referenceTemperature.value`;
      return `${at}.reverse.k.value`;
    default:
      return `${at}.law`;
  }
}

/** Field errors of an API 400 (keys "spec.<path>") by form field; messages with no field go to `rest`. */
export function mapNetworkServerFields(fields: Record<string, string[]>, v: NetworkFormValues): { byField: Record<string, string>; rest: string[] } {
  const byField: Record<string, string> = {};
  const rest: string[] = [];
  for (const [key, messages] of Object.entries(fields)) {
    const field = networkFormPathOf(key, v);
    const text = messages.map(sentence);
    if (field) byField[field] = [byField[field], ...text].filter(Boolean).join(" ");
    else rest.push(...text);
  }
  return { byField, rest };
}

/** A coefficient as written in an equation: 1 left out, otherwise at most 4 significant digits. */
const coefficientText = (n: number) => (Math.abs(n) === 1 ? "" : `${Number(Math.abs(n).toPrecision(4))} `);

/** A reaction as a chemist writes it, "2 A + B → C"; "…" stands for a side with no listed species. */
export function equationText(stoichiometry: Record<string, number>): string {
  const side = (sign: 1 | -1) =>
    Object.entries(stoichiometry)
      .filter(([, n]) => Number.isFinite(n) && n * sign > 0)
      .map(([name, n]) => `${coefficientText(n)}${name}`)
      .join(" + ") || "…";
  return `${side(-1)} → ${side(1)}`;
}

/** Reaction j of the form as an equation, from whatever is readable so far (unreadable entries left out). */
export function reactionText(v: NetworkFormValues, j: number): string {
  const r = v.reactions[j];
  const stoichiometry: Record<string, number> = {};
  for (const s of v.species) {
    const text = r?.coefficients?.[s.key]?.trim();
    const n = text ? Number(text) : NaN;
    if (s.name.trim() && Number.isFinite(n) && n !== 0) stoichiometry[s.name.trim()] = n;
  }
  return equationText(stoichiometry);
}


/**
 * The form for stored chemistry with SI numbers (the model page converts any quantity stored as text
 * with a unit first), each field in the unit it was typed in, else a sensible default.
 */
export function networkSpecToForm(spec: NetworkKineticsSpec, extra: { name?: string; note?: string } = {}): NetworkFormValues {
  const shown = spec.shownUnits ?? {};
  const { qAt } = storedQuantities(shown);
  const kAt = (path: string, si: unknown, order: number) => {
    const unit = splitRateConstantUnit(shown[path]) ?? { conc: "mol/L", time: "s" };
    return { ...unit, value: show(rateConstantFromSI(asNumber(si), order, unit.conc, unit.time)) };
  };
  const names = Object.keys(spec.feed.concentrations);
  const idOf = new Map(names.map((n, i) => [n, `s${i + 1}`]));
  const perSpecies = (r: Record<string, number> | undefined) => Object.fromEntries(Object.entries(r ?? {}).map(([name, n]) => [idOf.get(name) ?? name, String(n)]));

  const reactions = spec.reactions.map((reaction, j): NetworkReactionValues => {
    const at = `reactions.${j}.rate`;
    const out = blankReaction();
    out.coefficients = perSpecies(reaction.stoichiometry);
    const r = reaction.rate;
    if (r.law === "expression") {
      out.law = "expression";
      out.expression = r.expression;
      out.parameters = Object.entries(r.parameters ?? {}).map(([name, value]) => ({ name, value: String(value) }));
      return out;
    }
    out.orders = perSpecies(r.orders);
    out.k = kAt(`${at}.k`, r.k, sum(r.orders));
    out.arrheniusOn = r.activationEnergy !== undefined || r.referenceTemperature !== undefined || r.reverse?.activationEnergy !== undefined;
    out.activationEnergy = qAt("energyPerMol", `${at}.activationEnergy`, r.activationEnergy, "kJ/mol");
    out.referenceTemperature = qAt("temperature", `${at}.referenceTemperature`, r.referenceTemperature, "K");
    if (r.reverse) {
      out.reverseOn = true;
      out.reverse = {
        k: kAt(`${at}.reverse.k`, r.reverse.k, sum(r.reverse.orders)),
        orders: perSpecies(r.reverse.orders),
        activationEnergy: qAt("energyPerMol", `${at}.reverse.activationEnergy`, r.reverse.activationEnergy, "kJ/mol"),
      };
    }
    return out;
  });

  return {
    name: extra.name ?? "",
    note: extra.note ?? "",
    feed: {
      volumetricFlow: qAt("volumetricFlow", "feed.volumetricFlow", spec.feed.volumetricFlow, "L/s"),
      temperature: qAt("temperature", "feed.temperature", spec.feed.temperature, "K"),
    },
    species: names.map((name) => ({ key: idOf.get(name)!, name, conc: qAt("concentration", `feed.concentrations.${name}`, spec.feed.concentrations[name], "mol/L") })),
    phase: spec.phase,
    keyReactant: idOf.get(spec.keyReactant) ?? "",
    product: spec.product ? (idOf.get(spec.product) ?? "") : "",
    reactions,
  };
}

/** The form schema: what the engineer typed in, the API's create body out (issues at form paths). */
export function networkFormSchema(mode: "create" | "version") {
  return networkFormValuesSchema.transform((v, ctx) => {
    const { spec, issues } = formToNetworkSpec(v);
    for (const i of issues) ctx.addIssue({ code: "custom", path: i.path.split("."), message: i.message });
    const name = kineticsModelCreateSchema.shape.name.safeParse(v.name);
    if (mode === "create" && !name.success) ctx.addIssue({ code: "custom", path: ["name"], message: name.error.issues[0].message });
    const note = kineticsModelCreateSchema.shape.note.safeParse(v.note);
    if (!note.success) ctx.addIssue({ code: "custom", path: ["note"], message: note.error.issues[0].message });
    if (!spec || (mode === "create" && !name.success) || !note.success) return z.NEVER;
    return { name: name.success ? name.data : "", note: note.data, spec };
  });
}
