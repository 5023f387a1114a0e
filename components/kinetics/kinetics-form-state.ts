/**
 * The kinetics editor's form values (what the user typed, with the unit picked for each
 * quantity) and their mapping to the SI kinetics spec the API stores, both ways. Pure.
 */
import { z } from "zod";
import { kineticsModelCreateSchema, kineticsSpecSchema, type KineticsSpec } from "@/lib/schemas/sweeps";
import { fromSI, rateConstantFromSI, rateConstantToSI, toSI, type UnitKind } from "@/lib/units/display";
import { RATE_CONSTANT_UNIT_SEPARATOR, splitRateConstantUnit } from "@/lib/units/typed-units";
import { asNumber, show, storedQuantities } from "./stored-quantities";
import { q, quantityInput, readTypedNumber, type FormIssue, type QuantityInput } from "./form-quantities";

const rateConstantInput = z.object({ value: z.string(), conc: z.string(), time: z.string() });
const row = z.object({ name: z.string(), value: z.string() });

export const kineticsFormValuesSchema = z.object({
  name: z.string(),
  note: z.string(),
  feed: z.object({ flowA: quantityInput, concA: quantityInput, temperature: quantityInput, ratios: z.array(row) }),
  reaction: z.object({
    stoichiometry: z.array(row),
    phase: z.enum(["liquid", "gas"]),
    epsilon: z.string(),
    rate: z.object({
      law: z.enum(["power", "saturation", "expression", "table"]),
      k: rateConstantInput,
      orders: z.array(row),
      reverseOn: z.boolean(),
      reverse: z.object({ k: rateConstantInput, orders: z.array(row), activationEnergy: quantityInput }),
      arrheniusOn: z.boolean(),
      activationEnergy: quantityInput,
      referenceTemperature: quantityInput,
      vmax: quantityInput,
      km: quantityInput,
      kiOn: z.boolean(),
      ki: quantityInput,
      expression: z.string(),
      parameters: z.array(row),
      table: z.object({ rateUnit: z.string(), rows: z.array(z.object({ conversion: z.string(), rate: z.string() })) }),
    }),
    thermal: z.object({
      mode: z.enum(["isothermal", "adiabatic"]),
      adiabaticRise: quantityInput,
      maxTemperature: quantityInput,
      interstageTemperature: quantityInput,
    }),
  }),
});
export type KineticsFormValues = z.infer<typeof kineticsFormValuesSchema>;

/** A new model's starting point: invented first-order liquid kinetics. */
export function defaultKineticsValues(): KineticsFormValues {
  return {
    name: "",
    note: "",
    feed: { flowA: q(0.05, "mol/s"), concA: q(1.5, "mol/L"), temperature: q(330, "K"), ratios: [] },
    reaction: {
      stoichiometry: [{ name: "R", value: "1" }],
      phase: "liquid",
      epsilon: "",
      rate: {
        law: "power",
        k: { value: "0.002", conc: "mol/L", time: "s" },
        orders: [{ name: "A", value: "1" }],
        reverseOn: false,
        reverse: { k: { value: "0.0005", conc: "mol/L", time: "s" }, orders: [{ name: "R", value: "1" }], activationEnergy: q("", "kJ/mol") },
        arrheniusOn: false,
        activationEnergy: q("", "kJ/mol"),
        referenceTemperature: q("", "K"),
        vmax: q("0.5", "mol/(L min)"),
        km: q("0.2", "mol/L"),
        kiOn: false,
        ki: q("", "mol/L"),
        expression: "k*C_A/(1 + K*C_A)",
        parameters: [
          { name: "k", value: "0.002" },
          { name: "K", value: "0.0005" },
        ],
        table: {
          rateUnit: "mol/(m3 s)",
          rows: [
            { conversion: "0", rate: "3" },
            { conversion: "0.5", rate: "1.5" },
            { conversion: "0.95", rate: "0.15" },
          ],
        },
      },
      thermal: { mode: "isothermal", adiabaticRise: q("", "K"), maxTemperature: q("", "K"), interstageTemperature: q("", "K") },
    },
  };
}

const SPECIES = /^[A-Za-z][A-Za-z0-9_]*$/;

class Builder {
  issues: FormIssue[] = [];
  /** The unit picked for each quantity that was read, by spec path: saved so the model reopens as typed. */
  shown: Record<string, string> = {};
  issue(path: string, message: string) {
    this.issues.push({ path, message });
  }
  /** A number typed in a field; blank gives undefined unless required. */
  num(text: string, path: string, required = true): number | undefined {
    return readTypedNumber(text, required, (message) => this.issue(path, message));
  }
  quantity(kind: UnitKind, input: QuantityInput, path: string, required = true): number | undefined {
    const n = this.num(input.value, `${path}.value`, required);
    if (n === undefined) return undefined;
    try {
      const si = toSI(kind, n, input.unit);
      this.shown[path] = input.unit;
      return si;
    } catch {
      this.issue(`${path}.value`, "Pick a unit");
      return undefined;
    }
  }
  rows(rows: { name: string; value: string }[], path: string, what = "species"): Record<string, number> {
    const out: Record<string, number> = {};
    rows.forEach((r, i) => {
      const name = r.name.trim();
      if (!SPECIES.test(name)) this.issue(`${path}.${i}.name`, `Name the ${what} with letters, digits or _`);
      else if (name in out) this.issue(`${path}.${i}.name`, `${name} is listed twice`);
      const v = this.num(r.value, `${path}.${i}.value`);
      if (SPECIES.test(name) && v !== undefined) out[name] = v;
    });
    return out;
  }
}

const sum = (r: Record<string, number>) => Object.values(r).reduce((a, b) => a + b, 0);

/** The SI kinetics spec of the form, or the issues that keep it from being one. */
export function formToSpec(v: KineticsFormValues): { spec: KineticsSpec | null; issues: FormIssue[] } {
  const b = new Builder();
  const flowA = b.quantity("molarFlow", v.feed.flowA, "feed.flowA");
  const concA = b.quantity("concentration", v.feed.concA, "feed.concA");
  const temperature = b.quantity("temperature", v.feed.temperature, "feed.temperature");
  const ratios = b.rows(v.feed.ratios, "feed.ratios");
  if ("A" in ratios) b.issue("feed.ratios", "A is the key reactant; list only the other species");
  const stoich = b.rows(v.reaction.stoichiometry, "reaction.stoichiometry");
  if ("A" in stoich) b.issue("reaction.stoichiometry", "A is fixed at −1; list only the other species");

  const r = v.reaction.rate;
  let rate: KineticsSpec["reaction"]["rate"] | undefined;
  const arrhenius = () => {
    if (!r.arrheniusOn) return {};
    const activationEnergy = b.quantity("energyPerMol", r.activationEnergy, "reaction.rate.activationEnergy");
    const referenceTemperature = b.quantity("temperature", r.referenceTemperature, "reaction.rate.referenceTemperature", false);
    return { ...(activationEnergy !== undefined ? { activationEnergy } : {}), ...(referenceTemperature !== undefined ? { referenceTemperature } : {}) };
  };
  if (r.law === "power") {
    const orders = b.rows(r.orders, "reaction.rate.orders");
    if (Object.keys(orders).length === 0) b.issue("reaction.rate.orders", "Give the order of at least one species");
    const kv = b.num(r.k.value, "reaction.rate.k.value");
    const k = kv === undefined ? undefined : rateConstantToSI(kv, sum(orders), r.k.conc, r.k.time);
    if (k !== undefined) b.shown["reaction.rate.k"] = `${r.k.conc}${RATE_CONSTANT_UNIT_SEPARATOR}${r.k.time}`;
    let reverse: Extract<KineticsSpec["reaction"]["rate"], { law: "power" }>["reverse"];
    if (r.reverseOn) {
      const rOrders = b.rows(r.reverse.orders, "reaction.rate.reverse.orders");
      const rkv = b.num(r.reverse.k.value, "reaction.rate.reverse.k.value");
      const rEa = r.arrheniusOn ? b.quantity("energyPerMol", r.reverse.activationEnergy, "reaction.rate.reverse.activationEnergy", false) : undefined;
      if (rkv !== undefined) {
        b.shown["reaction.rate.reverse.k"] = `${r.reverse.k.conc}${RATE_CONSTANT_UNIT_SEPARATOR}${r.reverse.k.time}`;
        reverse = { k: rateConstantToSI(rkv, sum(rOrders), r.reverse.k.conc, r.reverse.k.time), orders: rOrders, ...(rEa !== undefined ? { activationEnergy: rEa } : {}) };
      }
    }
    const arr = arrhenius();
    if (k !== undefined) rate = { law: "power", k, orders, ...(reverse ? { reverse } : {}), ...arr };
  } else if (r.law === "saturation") {
    const vmax = b.quantity("rate", r.vmax, "reaction.rate.vmax");
    const km = b.quantity("concentration", r.km, "reaction.rate.km");
    const ki = r.kiOn ? b.quantity("concentration", r.ki, "reaction.rate.ki") : undefined;
    const arr = arrhenius();
    if (vmax !== undefined && km !== undefined) rate = { law: "saturation", vmax, km, ...(ki !== undefined ? { ki } : {}), ...arr };
  } else if (r.law === "expression") {
    if (!r.expression.trim()) b.issue("reaction.rate.expression", "Write the rate expression");
    const parameters = b.rows(r.parameters, "reaction.rate.parameters", "parameter");
    rate = { law: "expression", expression: r.expression.trim(), ...(Object.keys(parameters).length ? { parameters } : {}) };
  } else {
    const conversion: number[] = [];
    const rates: number[] = [];
    r.table.rows.forEach((row, i) => {
      const x = b.num(row.conversion, `reaction.rate.table.rows.${i}.conversion`);
      const y = b.num(row.rate, `reaction.rate.table.rows.${i}.rate`);
      if (x !== undefined && y !== undefined) {
        conversion.push(x);
        rates.push(toSI("rate", y, r.table.rateUnit));
      }
    });
    if (r.table.rows.length < 2) b.issue("reaction.rate.table", "Give at least two points");
    b.shown["reaction.rate.rate"] = r.table.rateUnit;
    rate = { law: "table", conversion, rate: rates };
  }

  const t = v.reaction.thermal;
  let thermal: KineticsSpec["reaction"]["thermal"] = { mode: "isothermal" };
  if (t.mode === "adiabatic") {
    const adiabaticRise = b.quantity("temperatureDifference", t.adiabaticRise, "reaction.thermal.adiabaticRise");
    const maxTemperature = b.quantity("temperature", t.maxTemperature, "reaction.thermal.maxTemperature", false);
    const interstageTemperature = b.quantity("temperature", t.interstageTemperature, "reaction.thermal.interstageTemperature", false);
    if (adiabaticRise !== undefined) {
      thermal = {
        mode: "adiabatic",
        adiabaticRise,
        ...(maxTemperature !== undefined ? { maxTemperature } : {}),
        ...(interstageTemperature !== undefined ? { interstageTemperature } : {}),
      };
    }
  }
  const epsilon = v.reaction.phase === "gas" ? b.num(v.reaction.epsilon, "reaction.epsilon", false) : undefined;

  if (b.issues.length || flowA === undefined || concA === undefined || !rate) return { spec: null, issues: b.issues };
  const spec: KineticsSpec = {
    feed: { flowA, concA, ...(temperature !== undefined ? { temperature } : {}), ...(Object.keys(ratios).length ? { ratios } : {}) },
    reaction: {
      ...(Object.keys(stoich).length ? { stoichiometry: { A: -1, ...stoich } } : {}),
      phase: v.reaction.phase,
      ...(epsilon !== undefined ? { epsilon } : {}),
      rate,
      thermal,
    },
    shownUnits: b.shown,
  };
  const parsed = kineticsSpecSchema.safeParse(spec);
  if (!parsed.success) return { spec: null, issues: parsed.error.issues.map((i) => ({ path: formPathOf(i.path.join(".")), message: i.message })) };
  return { spec: parsed.data, issues: [] };
}

/** Spec paths (as the engine and the API name them) → the form field that shows their errors. */
const FIELD_OF_SPEC_PATH: [string, string][] = [
  ["feed.flowA", "feed.flowA.value"],
  ["feed.concA", "feed.concA.value"],
  ["feed.temperature", "feed.temperature.value"],
  ["feed.ratios", "feed.ratios"],
  ["reaction.stoichiometry", "reaction.stoichiometry"],
  ["reaction.phase", "reaction.phase"],
  ["reaction.epsilon", "reaction.epsilon"],
  ["reaction.rate.reverse.k", "reaction.rate.reverse.k.value"],
  ["reaction.rate.reverse.orders", "reaction.rate.reverse.orders"],
  ["reaction.rate.reverse.activationEnergy", "reaction.rate.reverse.activationEnergy.value"],
  ["reaction.rate.reverse", "reaction.rate.reverse.k.value"],
  ["reaction.rate.k", "reaction.rate.k.value"],
  ["reaction.rate.orders", "reaction.rate.orders"],
  ["reaction.rate.activationEnergy", "reaction.rate.activationEnergy.value"],
  ["reaction.rate.referenceTemperature", "reaction.rate.referenceTemperature.value"],
  ["reaction.rate.vmax", "reaction.rate.vmax.value"],
  ["reaction.rate.km", "reaction.rate.km.value"],
  ["reaction.rate.ki", "reaction.rate.ki.value"],
  ["reaction.rate.expression", "reaction.rate.expression"],
  ["reaction.rate.parameters", "reaction.rate.parameters"],
  ["reaction.rate.conversion", "reaction.rate.table"],
  ["reaction.rate.rate", "reaction.rate.table"],
  ["reaction.rate", "reaction.rate.law"],
  ["reaction.thermal.adiabaticRise", "reaction.thermal.adiabaticRise.value"],
  ["reaction.thermal.maxTemperature", "reaction.thermal.maxTemperature.value"],
  ["reaction.thermal.interstageTemperature", "reaction.thermal.interstageTemperature.value"],
  ["reaction.thermal", "reaction.thermal.mode"],
  ["targetConversion", "previewTarget"],
  ["target.conversion", "previewTarget"],
  ["target", "previewTarget"],
];

/** The form field for a spec path ("spec." prefix allowed); "" when none fits. */
export function formPathOf(specPath: string): string {
  const p = specPath.replace(/^spec\./, "");
  for (const [prefix, field] of FIELD_OF_SPEC_PATH) if (p === prefix || p.startsWith(`${prefix}.`)) return field;
  return "";
}

/** Field errors of an API 400 (keys "spec.<path>") by form field; messages with no field go to `rest`. */
export function mapServerFields(fields: Record<string, string[]>): { byField: Record<string, string>; rest: string[] } {
  const byField: Record<string, string> = {};
  const rest: string[] = [];
  for (const [key, messages] of Object.entries(fields)) {
    const field = formPathOf(key);
    if (field) byField[field] = [byField[field], ...messages].filter(Boolean).join(" ");
    else rest.push(...messages);
  }
  return { byField, rest };
}

const rowsOf = (r: Record<string, number> | undefined, skip?: string) =>
  Object.entries(r ?? {})
    .filter(([k]) => k !== skip)
    .map(([name, value]) => ({ name, value: String(value) }));

/** The form for an SI spec (quantities as numbers), each field in the unit it was typed in (else the default). */
export function specToForm(spec: KineticsSpec, extra: { name?: string; note?: string } = {}): KineticsFormValues {
  const shown = spec.shownUnits ?? {};
  const { unitAt, qAt } = storedQuantities(shown);
  const d = defaultKineticsValues();
  const v: KineticsFormValues = structuredClone(d);
  v.name = extra.name ?? "";
  v.note = extra.note ?? "";
  const f = spec.feed;
  v.feed = {
    flowA: qAt("molarFlow", "feed.flowA", f.flowA, d.feed.flowA.unit),
    concA: qAt("concentration", "feed.concA", f.concA, d.feed.concA.unit),
    temperature: qAt("temperature", "feed.temperature", f.temperature ?? 298.15, d.feed.temperature.unit),
    ratios: rowsOf(f.ratios),
  };
  const re = spec.reaction;
  v.reaction.stoichiometry = rowsOf(re.stoichiometry, "A");
  v.reaction.phase = re.phase ?? "liquid";
  v.reaction.epsilon = re.epsilon === undefined ? "" : String(re.epsilon);
  const r = re.rate;
  const vr = v.reaction.rate;
  vr.law = r.law;
  if (r.law === "power" || r.law === "saturation") {
    vr.arrheniusOn = r.activationEnergy !== undefined;
    vr.activationEnergy = qAt("energyPerMol", "reaction.rate.activationEnergy", r.activationEnergy, "kJ/mol");
    vr.referenceTemperature = qAt("temperature", "reaction.rate.referenceTemperature", r.referenceTemperature, "K");
  }
  if (r.law === "power") {
    vr.orders = rowsOf(r.orders);
    const kUnit = splitRateConstantUnit(shown["reaction.rate.k"]) ?? { conc: d.reaction.rate.k.conc, time: d.reaction.rate.k.time };
    vr.k = { ...kUnit, value: show(rateConstantFromSI(asNumber(r.k), sum(r.orders), kUnit.conc, kUnit.time)) };
    vr.reverseOn = !!r.reverse;
    if (r.reverse) {
      const rk = splitRateConstantUnit(shown["reaction.rate.reverse.k"]) ?? d.reaction.rate.reverse.k;
      vr.reverse = {
        k: { conc: rk.conc, time: rk.time, value: show(rateConstantFromSI(asNumber(r.reverse.k), sum(r.reverse.orders), rk.conc, rk.time)) },
        orders: rowsOf(r.reverse.orders),
        activationEnergy: qAt("energyPerMol", "reaction.rate.reverse.activationEnergy", r.reverse.activationEnergy, "kJ/mol"),
      };
      if (r.reverse.activationEnergy !== undefined) vr.arrheniusOn = true;
    }
  } else if (r.law === "saturation") {
    vr.vmax = qAt("rate", "reaction.rate.vmax", r.vmax, d.reaction.rate.vmax.unit);
    vr.km = qAt("concentration", "reaction.rate.km", r.km, d.reaction.rate.km.unit);
    vr.kiOn = r.ki !== undefined;
    vr.ki = qAt("concentration", "reaction.rate.ki", r.ki, "mol/L");
  } else if (r.law === "expression") {
    vr.expression = r.expression;
    vr.parameters = Object.entries(r.parameters ?? {}).map(([name, value]) => ({ name, value: String(value) }));
  } else {
    const rateUnit = unitAt("rate", "reaction.rate.rate", "mol/(m3 s)");
    vr.table = { rateUnit, rows: r.conversion.map((x, i) => ({ conversion: String(x), rate: r.rate[i] === undefined ? "" : show(fromSI("rate", r.rate[i], rateUnit)) })) };
  }
  const t = re.thermal;
  if (t?.mode === "adiabatic") {
    v.reaction.thermal = {
      mode: "adiabatic",
      adiabaticRise: qAt("temperatureDifference", "reaction.thermal.adiabaticRise", t.adiabaticRise, "K"),
      maxTemperature: qAt("temperature", "reaction.thermal.maxTemperature", t.maxTemperature, "K"),
      interstageTemperature: qAt("temperature", "reaction.thermal.interstageTemperature", t.interstageTemperature, "K"),
    };
  }
  return v;
}

/** The form schema: what the user typed in, the API's create body out (with issues at form paths). */
export function kineticsFormSchema(mode: "create" | "version") {
  return kineticsFormValuesSchema.transform((v, ctx) => {
    const { spec, issues } = formToSpec(v);
    for (const i of issues) ctx.addIssue({ code: "custom", path: i.path.split("."), message: i.message });
    const name = kineticsModelCreateSchema.shape.name.safeParse(v.name);
    if (mode === "create" && !name.success) ctx.addIssue({ code: "custom", path: ["name"], message: name.error.issues[0].message });
    const note = kineticsModelCreateSchema.shape.note.safeParse(v.note);
    if (!note.success) ctx.addIssue({ code: "custom", path: ["note"], message: note.error.issues[0].message });
    if (!spec || (mode === "create" && !name.success) || !note.success) return z.NEVER;
    return { name: name.success ? name.data : "", note: note.data, spec };
  });
}
