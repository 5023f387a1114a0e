/**
 * The one mapping from a field's path in a request body (or an engine spec) to the label the form
 * shows. API answers keep paths as `fields` keys (clients need them); every sentence a person reads
 * goes through `labelFor`, so a schema key never reaches the screen, a report or a PDF.
 *
 * Patterns: `#` matches an array index (shown 1-based as {n}, a second one as {m}); `*` matches a
 * key of a record (a species or parameter name, shown as {key}). A leading "spec." or "baseSpec."
 * (where a body nests the engine's input) is looked through.
 */
const LABELS: Record<string, string> = {
  // feed
  feed: "Feed",
  "feed.flowA": "Feed rate of A",
  "feed.concA": "Feed concentration of A",
  "feed.temperature": "Feed temperature",
  "feed.ratios": "Feed ratios",
  "feed.ratios.*": "Feed ratio of {key}",
  feedConcA: "Feed concentration of A",
  // reaction
  reaction: "Reaction",
  "reaction.stoichiometry": "Stoichiometry",
  "reaction.stoichiometry.*": "Stoichiometric coefficient of {key}",
  "reaction.phase": "Phase",
  "reaction.epsilon": "Expansion factor ε",
  "reaction.rate": "Rate law",
  "reaction.rate.law": "Rate law",
  "reaction.rate.k": "Rate constant k",
  "reaction.rate.orders": "Reaction orders",
  "reaction.rate.orders.*": "Order in {key}",
  "reaction.rate.reverse": "Reverse reaction",
  "reaction.rate.reverse.k": "Reverse rate constant",
  "reaction.rate.reverse.orders": "Reverse reaction orders",
  "reaction.rate.reverse.orders.*": "Reverse order in {key}",
  "reaction.rate.reverse.activationEnergy": "Reverse activation energy",
  "reaction.rate.activationEnergy": "Activation energy",
  "reaction.rate.referenceTemperature": "Reference temperature",
  "reaction.rate.vmax": "Maximum rate vmax",
  "reaction.rate.km": "Saturation constant Km",
  "reaction.rate.ki": "Inhibition constant Ki",
  "reaction.rate.expression": "Rate expression",
  "reaction.rate.parameters": "Expression parameters",
  "reaction.rate.parameters.*": "Parameter {key}",
  "reaction.rate.conversion": "Rate table conversions",
  "reaction.rate.conversion.#": "Rate table conversion, row {n}",
  "reaction.rate.rate": "Rate table rates",
  "reaction.rate.rate.#": "Rate table rate, row {n}",
  "reaction.thermal": "Heat mode",
  "reaction.thermal.mode": "Heat mode",
  "reaction.thermal.adiabaticRise": "Adiabatic temperature rise",
  "reaction.thermal.maxTemperature": "Highest allowed temperature",
  "reaction.thermal.interstageTemperature": "Temperature after interstage cooling",
  "reaction.thermal.interstageTemperature.min": "Lowest interstage temperature",
  "reaction.thermal.interstageTemperature.max": "Highest interstage temperature",
  "reaction.thermal.feedTemperature": "First stage inlet temperature range",
  "reaction.thermal.feedTemperature.min": "Lowest first stage inlet temperature",
  "reaction.thermal.feedTemperature.max": "Highest first stage inlet temperature",
  "reaction.thermal.min": "Lowest stage temperature",
  "reaction.thermal.max": "Highest stage temperature",
  stoichiometry: "Stoichiometry",
  "stoichiometry.*": "Stoichiometric coefficient of {key}",
  phase: "Phase",
  // several reactions (network spec)
  "feed.volumetricFlow": "Feed volumetric flow",
  "feed.concentrations": "Feed concentrations",
  "feed.concentrations.*": "Feed concentration of {key}",
  reactions: "Reactions",
  "reactions.#": "Reaction {n}",
  "reactions.#.stoichiometry": "Reaction {n}, stoichiometry",
  "reactions.#.stoichiometry.*": "Reaction {n}, coefficient of {key}",
  "reactions.#.rate": "Reaction {n}, rate law",
  "reactions.#.rate.law": "Reaction {n}, rate law",
  "reactions.#.rate.k": "Reaction {n}, rate constant k",
  "reactions.#.rate.orders": "Reaction {n}, orders",
  "reactions.#.rate.orders.*": "Reaction {n}, order in {key}",
  "reactions.#.rate.activationEnergy": "Reaction {n}, activation energy",
  "reactions.#.rate.referenceTemperature": "Reaction {n}, reference temperature",
  "reactions.#.rate.reverse": "Reaction {n}, reverse reaction",
  "reactions.#.rate.reverse.k": "Reaction {n}, reverse rate constant",
  "reactions.#.rate.reverse.orders": "Reaction {n}, reverse orders",
  "reactions.#.rate.reverse.orders.*": "Reaction {n}, reverse order in {key}",
  "reactions.#.rate.reverse.activationEnergy": "Reaction {n}, reverse activation energy",
  "reactions.#.rate.reverse.referenceTemperature": "Reaction {n}, reverse reference temperature",
  "reactions.#.rate.expression": "Reaction {n}, rate expression",
  "reactions.#.rate.parameters": "Reaction {n}, expression parameters",
  "reactions.#.rate.parameters.*": "Reaction {n}, parameter {key}",
  keyReactant: "Key reactant",
  product: "Wanted product",
  thermal: "Heat mode",
  "thermal.mode": "Heat mode",
  "thermal.min": "Lowest stage temperature",
  "thermal.max": "Highest stage temperature",
  "objective.maximise": "Rank by",
  "objective.product": "Wanted product",
  constraints: "Limits",
  "constraints.minConversion": "Minimum conversion",
  "constraints.minYield": "Minimum yield",
  "constraints.maxTotalVolume": "Largest total volume",
  "constraints.maxStageVolume": "Largest stage volume",
  // target and train
  target: "Target conversion",
  "target.conversion": "Target conversion",
  targetConversion: "Conversion drawn to",
  train: "Trains to try",
  "train.maxStages": "Largest number of stages",
  "train.types": "Stage types",
  "train.types.#": "Stage type {n}",
  "train.equalVolume": "Equal stage volumes",
  "train.recycleRatio": "Recycle ratio",
  "train.candidates": "Trains to try",
  "train.candidates.#": "Train {n}",
  "train.candidates.#.#": "Train {n}, stage {m}",
  "train.multiset": "Stage counts",
  "train.multiset.CSTR": "Number of CSTRs",
  "train.multiset.PFR": "Number of PFRs",
  // objective
  objective: "Rank by",
  "objective.minimise": "Rank by",
  "objective.vessels": "Vessel cost correlations",
  "objective.vessels.CSTR": "CSTR cost correlation",
  "objective.vessels.CSTR.a": "CSTR cost: fixed part a",
  "objective.vessels.CSTR.b": "CSTR cost: size coefficient b",
  "objective.vessels.CSTR.n": "CSTR cost: size exponent n",
  "objective.vessels.PFR": "PFR cost correlation",
  "objective.vessels.PFR.a": "PFR cost: fixed part a",
  "objective.vessels.PFR.b": "PFR cost: size coefficient b",
  "objective.vessels.PFR.n": "PFR cost: size exponent n",
  "objective.standardSizes": "Standard sizes",
  "objective.standardSizes.#": "Standard size {n}",
  "objective.maxVesselVolume": "Largest vessel volume",
  // cost basis
  vessels: "Vessel cost correlations",
  "vessels.CSTR": "CSTR cost correlation",
  "vessels.CSTR.a": "CSTR cost: fixed part a",
  "vessels.CSTR.b": "CSTR cost: size coefficient b",
  "vessels.CSTR.n": "CSTR cost: size exponent n",
  "vessels.CSTR.source": "CSTR cost: source",
  "vessels.PFR": "PFR cost correlation",
  "vessels.PFR.a": "PFR cost: fixed part a",
  "vessels.PFR.b": "PFR cost: size coefficient b",
  "vessels.PFR.n": "PFR cost: size exponent n",
  "vessels.PFR.source": "PFR cost: source",
  currency: "Currency",
  basisYear: "Cost basis year",
  sizes: "Vessel sizes on offer",
  "sizes.mode": "Vessel sizes on offer",
  "sizes.min": "Smallest size",
  "sizes.max": "Largest size",
  "sizes.values": "Sizes on offer",
  "sizes.values.#": "Size {n}",
  maxVesselVolume: "Largest vessel volume",
  installationFactor: "Installation factor",
  "installationFactor.value": "Installation factor",
  "installationFactor.source": "Installation factor: source",
  costing: "Costing",
  "costing.installationFactor": "Installation factor",
  "costing.currency": "Currency",
  "costing.reuseInventory": "Reuse idle vessels",
  // rating and inventory
  stages: "Stages",
  "stages.#": "Stage {n}",
  "stages.#.type": "Stage {n} type",
  "stages.#.volume": "Stage {n} volume",
  "stages.#.recycleRatio": "Stage {n} recycle ratio",
  "stages.#.inventoryVesselId": "Stage {n} vessel from inventory",
  tag: "Tag",
  type: "Vessel type",
  volume: "Volume",
  available: "Available",
  reuseCost: "Cost to reuse",
  location: "Location",
  // sweeps
  kineticsVersionId: "Kinetics version",
  grid: "Varied inputs",
  "grid.#": "Varied input {n}",
  "grid.#.field": "Varied input {n}",
  "grid.#.values": "Varied input {n}: values",
  "grid.#.values.#": "Varied input {n}: value {m}",
  "grid.#.from": "Varied input {n}: from",
  "grid.#.to": "Varied input {n}: to",
  "grid.#.steps": "Varied input {n}: steps",
  "grid.#.scale": "Varied input {n}: spacing",
  // robustness (a sweep nests the same under "robustness")
  robustness: "Robustness check",
  uncertain: "Uncertain inputs",
  "uncertain.#": "Uncertain input {n}",
  "uncertain.#.field": "Uncertain input {n}",
  "uncertain.#.kind": "Uncertain input {n}: spread",
  "uncertain.#.low": "Uncertain input {n}: low",
  "uncertain.#.high": "Uncertain input {n}: high",
  "uncertain.#.mean": "Uncertain input {n}: mean",
  "uncertain.#.sd": "Uncertain input {n}: standard deviation",
  "uncertain.#.fraction": "Uncertain input {n}: ± %",
  samples: "Samples",
  seed: "Random seed",
  // kinetics models, fits, data sets
  spec: "Kinetics",
  shownUnits: "Units as typed",
  displayUnits: "Show results in",
  "shownUnits.*": "Unit shown for {key}",
  name: "Name",
  modelName: "Model name",
  modelId: "Model",
  note: "Note",
  law: "Rate law",
  laws: "Rate laws to fit",
  "laws.#": "Rate law {n}",
  mapping: "Column roles",
  "mapping.columns": "Column roles",
  "mapping.columns.*": "Role of column {key}",
  "mapping.units": "Column units",
  "mapping.units.conversion": "Unit of conversion",
  "mapping.units.concA": "Unit of the concentration of A",
  "mapping.units.concR": "Unit of the concentration of R",
  "mapping.units.rate": "Unit of the rate",
  "mapping.units.temperature": "Unit of temperature",
  accept: "Import the good rows",
  // projects, people, review
  description: "Purpose",
  archived: "Archived",
  email: "E-mail",
  password: "Password",
  role: "Role",
  token: "Invitation",
  decision: "Decision",
  comment: "Comment",
  // query strings
  sort: "Sort by",
  dir: "Sort order",
  feasible: "Feasible only",
  contains: "Contains the stage sequence",
  page: "Page",
  pageSize: "Rows per page",
  include: "Include",
  format: "File format",
  ids: "Trains to compare",
  entityType: "Kind of record",
  entityId: "Record",
  "(body)": "The request",
  "(query)": "The address",
  teamId: "Team",
};

/** Every pattern the mapping knows, for the coverage test. */
export const LABELLED_PATTERNS: readonly string[] = Object.keys(LABELS);

function match(pattern: string[], path: string[]): string | null {
  if (pattern.length !== path.length) return null;
  const indices: number[] = [];
  let key = "";
  for (let i = 0; i < pattern.length; i++) {
    const p = pattern[i]!;
    const s = path[i]!;
    if (p === "#") {
      if (!/^\d+$/.test(s)) return null;
      indices.push(Number(s) + 1);
    } else if (p === "*") key = s;
    else if (p !== s) return null;
  }
  return LABELS[pattern.join(".")]!
    .replace("{n}", String(indices[0] ?? ""))
    .replace("{m}", String(indices[1] ?? ""))
    .replace("{key}", key);
}

const SPLIT = Object.keys(LABELS).map((k) => k.split("."));
const NESTS = ["spec", "baseSpec", "robustness"];

/** The label of a field path, or null when the mapping has none. Exact keys win over patterns. */
export function findLabel(path: string | readonly (string | number)[]): string | null {
  const parts = (typeof path === "string" ? path.split(".") : path.map(String)).filter((p) => p !== "");
  if (parts.length === 0) return null;
  const exact = LABELS[parts.join(".")];
  if (exact && !exact.includes("{")) return exact;
  for (const pattern of SPLIT) {
    const found = match(pattern, parts);
    if (found) return found;
  }
  if (NESTS.includes(parts[0]!) && parts.length > 1) return findLabel(parts.slice(1));
  return null;
}

/**
 * The label of a field path; an unknown path still reads as words (its last named part, split at
 * capitals), never as a dotted path, so a gap in the mapping cannot leak a schema key.
 */
export function labelFor(path: string | readonly (string | number)[]): string {
  // "kineticsVersionId (feed.flowA)": a field of the record another field points at
  const nested = typeof path === "string" ? /^(\S+) \((.+)\)$/.exec(path) : null;
  if (nested) return `${labelFor(nested[1]!)} (${labelFor(nested[2]!)})`;
  const found = findLabel(path);
  if (found) return found;
  const parts = (typeof path === "string" ? path.split(".") : path.map(String)).filter((p) => p !== "" && !/^\d+$/.test(p));
  const last = parts.at(-1) ?? "This field";
  const words = last.replace(/([a-z])([A-Z])/g, "$1 $2").toLowerCase();
  return words.charAt(0).toUpperCase() + words.slice(1);
}

/** "Stage 1 volume: enter a number", the form a person reads a field's problem in. */
export function labelled(path: string | readonly (string | number)[], message: string): string {
  return `${labelFor(path)}: ${message}`;
}
