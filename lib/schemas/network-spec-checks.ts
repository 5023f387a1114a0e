import type { z } from "zod";

/**
 * The cross-field checks of a network spec (several reactions), run once its shape has parsed. Each
 * problem is reported at the field a person would correct, with a sentence that follows the field's
 * label (`lib/schemas/field-labels.ts`), so the form, the API and the command line point at the same place.
 */

type Quantity = number | string;

/** The parsed spec as these checks read it (the schema's output; see network-spec.ts). */
export interface CheckedNetwork {
  feed: { concentrations: Record<string, Quantity> };
  reactions: readonly {
    stoichiometry: Record<string, number>;
    rate:
      | { law: "power"; orders: Record<string, number>; reverse?: { orders: Record<string, number> } }
      | { law: "expression"; expression: string; parameters?: Record<string, Quantity> };
  }[];
  keyReactant: string;
  thermal: { mode: "isothermal" } | { mode: "stageTemperature"; min: Quantity; max: Quantity };
  objective: { maximise: "yield" | "selectivity"; product: string } | { minimise: "volume"; product?: string };
  constraints?: { minConversion?: number; minYield?: number };
}

const LEADING = /^\s*([-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?)\s*(.*?)\s*$/;

/**
 * The number a quantity starts with and the unit text after it ("0.58 mol/L" → 0.58, "mol/L"). For a
 * unit that only scales (every unit here but a temperature in degC or degF) the sign of that number is
 * the sign of the SI value, so signs and zeros can be checked here without converting; the conversion
 * itself is the engine's. Null for a string that does not start with a number.
 */
export function leadingNumber(value: Quantity): { value: number; unit: string } | null {
  if (typeof value === "number") return { value, unit: "" };
  const m = LEADING.exec(value);
  if (!m) return null;
  const n = Number(m[1]);
  return Number.isFinite(n) ? { value: n, unit: m[2]! } : null;
}

/** Species names a rate expression can spell as C_<name>. */
export const SPECIES_NAME = /^[A-Za-z][A-Za-z0-9_]*$/;

/** Constants the engine's expressions know (lib/engine/math-instance.ts); they are not variables. */
const EXPRESSION_CONSTANTS = new Set(["e", "pi"]);

const TOKEN = /\s+|(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?|[A-Za-z_][A-Za-z0-9_]*|./g;

/**
 * The names an expression uses as variables (identifiers not followed by "(", which are function calls),
 * and whether its round brackets pair up. A simple tokenizer, not a parser: the engine parses the
 * expression itself and is the authority on what it accepts; this is the early check that names the
 * field before any computation starts.
 */
export function expressionNames(expression: string): { variables: string[]; bracketsPair: boolean } {
  const tokens = expression.match(TOKEN) ?? [];
  const variables = new Set<string>();
  let depth = 0;
  let bracketsPair = true;
  tokens.forEach((token, i) => {
    if (token === "(") depth++;
    if (token === ")" && --depth < 0) bracketsPair = false;
    if (!/^[A-Za-z_]/.test(token)) return;
    const next = tokens.slice(i + 1).find((t) => !/^\s+$/.test(t));
    if (next !== "(") variables.add(token);
  });
  return { variables: [...variables], bracketsPair: bracketsPair && depth === 0 };
}

type Path = (string | number)[];

function speciesOf(spec: CheckedNetwork): Set<string> {
  return new Set(Object.keys(spec.feed.concentrations));
}

function checkSpeciesNames(spec: CheckedNetwork, say: (path: Path, message: string) => void): void {
  for (const name of Object.keys(spec.feed.concentrations)) {
    if (!SPECIES_NAME.test(name)) {
      say(["feed", "concentrations", name], `"${name}" cannot name a species: start with a letter and use letters, digits and _ only, so a rate expression can call its concentration C_${name.replace(/\W/g, "_")}`);
    }
  }
}

const NOT_IN_FEED = (name: string) => `${name} is not one of the feed's species; list it in the feed concentrations (0 if none is fed)`;

function checkNamedSpecies(spec: CheckedNetwork, say: (path: Path, message: string) => void): void {
  const species = speciesOf(spec);
  spec.reactions.forEach((reaction, j) => {
    for (const name of Object.keys(reaction.stoichiometry)) {
      if (!species.has(name)) say(["reactions", j, "stoichiometry", name], NOT_IN_FEED(name));
    }
    const rate = reaction.rate;
    if (rate.law === "power") {
      for (const name of Object.keys(rate.orders)) if (!species.has(name)) say(["reactions", j, "rate", "orders", name], NOT_IN_FEED(name));
      for (const name of Object.keys(rate.reverse?.orders ?? {})) if (!species.has(name)) say(["reactions", j, "rate", "reverse", "orders", name], NOT_IN_FEED(name));
    } else checkExpression(rate, j, species, say);
  });
}

function checkExpression(rate: { expression: string; parameters?: Record<string, Quantity> }, j: number, species: Set<string>, say: (path: Path, message: string) => void): void {
  const parameters = Object.keys(rate.parameters ?? {});
  for (const name of parameters) {
    const taken = name === "T" ? "the temperature" : EXPRESSION_CONSTANTS.has(name) ? "a mathematical constant" : name.startsWith("C_") && species.has(name.slice(2)) ? `the concentration of ${name.slice(2)}` : null;
    if (taken) say(["reactions", j, "rate", "parameters", name], `the name ${name} already stands for ${taken}; choose another`);
  }
  const path = ["reactions", j, "rate", "expression"];
  const { variables, bracketsPair } = expressionNames(rate.expression);
  if (!bracketsPair) say(path, "the brackets do not pair up");
  const known = new Set(["T", ...parameters, ...EXPRESSION_CONSTANTS]);
  for (const name of variables) {
    if (known.has(name)) continue;
    if (name.startsWith("C_")) {
      if (!species.has(name.slice(2))) say(path, `${name} names ${name.slice(2)}, which is not one of the feed's species; list it in the feed concentrations (0 if none is fed)`);
      continue;
    }
    say(path, `uses ${name}, which is neither a concentration C_<species>, the temperature T nor one of its parameters`);
  }
}

function isZero(value: Quantity | undefined): boolean {
  const lead = value === undefined ? null : leadingNumber(value);
  return lead !== null && lead.value === 0;
}

function checkKeyAndProduct(spec: CheckedNetwork, say: (path: Path, message: string) => void): void {
  const species = speciesOf(spec);
  const key = spec.keyReactant;
  const coefficients = (name: string) => spec.reactions.map((r) => r.stoichiometry[name] ?? 0);
  if (!species.has(key)) say(["keyReactant"], NOT_IN_FEED(key));
  else {
    if (isZero(spec.feed.concentrations[key])) say(["keyReactant"], `${key} has no feed; conversion is measured against the key reactant's feed, so choose a species that is fed`);
    if (!coefficients(key).some((c) => c < 0)) say(["keyReactant"], `no reaction consumes ${key}; give it a negative coefficient in the reaction that uses it up`);
  }
  const product = spec.objective.product;
  if (product === undefined) return;
  if (!species.has(product)) say(["objective", "product"], NOT_IN_FEED(product));
  else if (product === key) say(["objective", "product"], `${product} is the key reactant; the wanted product must be another species`);
  else if (!coefficients(product).some((c) => c > 0)) say(["objective", "product"], `no reaction forms ${product}; give it a positive coefficient in the reaction that makes it`);
}

function checkObjectiveAndLimits(spec: CheckedNetwork, say: (path: Path, message: string) => void): void {
  if ("minimise" in spec.objective && spec.constraints?.minConversion === undefined) {
    say(["constraints", "minConversion"], "required when ranking by least volume: the smallest train is sized to reach it");
  }
  if (spec.constraints?.minYield !== undefined && spec.objective.product === undefined) {
    say(["constraints", "minYield"], "name the wanted product, so the yield has a species to count");
  }
  if (spec.thermal.mode === "stageTemperature") {
    const low = leadingNumber(spec.thermal.min);
    const high = leadingNumber(spec.thermal.max);
    // Only values in one and the same unit (or both in K) are compared here; the engine compares the rest in K.
    const sameUnit = low && high && (low.unit === high.unit || [low.unit, high.unit].every((u) => u === "" || u === "K"));
    if (sameUnit && low.value > high.value) say(["thermal", "max"], "is below the lowest stage temperature; give a range from the lower to the higher");
  }
}

/**
 * Adds one issue per problem found; the schema calls it from its superRefine. Zod runs it even when a
 * field has a problem that leaves the shape intact (a negative number, too many reactions), so a form
 * shows every problem at once; with no reaction at all there is nothing to say about key or product.
 */
export function checkNetwork(spec: CheckedNetwork, ctx: z.RefinementCtx): void {
  const say = (path: Path, message: string) => ctx.addIssue({ code: "custom", path, message });
  checkSpeciesNames(spec, say);
  checkNamedSpecies(spec, say);
  if (spec.reactions.length > 0) checkKeyAndProduct(spec, say);
  checkObjectiveAndLimits(spec, say);
}

/** The chemistry a kinetics model of several reactions keeps: feed, reactions, key reactant and its wanted product. */
export type CheckedNetworkKinetics = Pick<CheckedNetwork, "feed" | "reactions" | "keyReactant"> & { product?: string };

/**
 * The same checks for the chemistry alone (a kinetics model of several reactions): the wanted product,
 * when named, is checked where the model keeps it (`product`) rather than in an objective.
 */
export function checkNetworkKinetics(spec: CheckedNetworkKinetics, ctx: z.RefinementCtx): void {
  const say = (path: Path, message: string) => ctx.addIssue({ code: "custom", path: path[0] === "objective" ? ["product"] : path, message });
  const asSpec: CheckedNetwork = { ...spec, thermal: { mode: "isothermal" }, objective: spec.product === undefined ? { minimise: "volume" } : { maximise: "yield", product: spec.product } };
  checkSpeciesNames(asSpec, say);
  checkNamedSpecies(asSpec, say);
  if (spec.reactions.length > 0) checkKeyAndProduct(asSpec, say);
}
