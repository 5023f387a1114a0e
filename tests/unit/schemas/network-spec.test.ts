import { readdirSync, readFileSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { DIM, rateConstantDimension, toSI } from "@/lib/engine/units";
import { findLabel, labelFor } from "@/lib/schemas/field-labels";
import { issueInWords } from "@/lib/schemas/issue-words";
import { expressionNames } from "@/lib/schemas/network-spec-checks";
import { isNetworkSpec, networkSpecSchema, type NetworkSpecInput } from "@/lib/schemas/network-spec";
import { designSpecSchema, ratingSpecSchema } from "@/lib/schemas/sweep-spec";
import contractExample from "../../fixtures/specs/network-three-reactions.json";

/** The contract's example in issue 13, word for word (the command line's fixture). */
const CONTRACT = contractExample as unknown as NetworkSpecInput;

type Change = [path: string, value: unknown];

/** A deep copy of the contract's example with values set at dotted paths (undefined removes the field). */
function variant(...changes: Change[]): unknown {
  const spec: unknown = structuredClone(CONTRACT);
  for (const [path, value] of changes) {
    const keys = path.split(".");
    const node = keys.slice(0, -1).reduce((n, k) => n[k] as Record<string, unknown>, spec as Record<string, unknown>);
    if (value === undefined) delete node[keys.at(-1)!];
    else node[keys.at(-1)!] = value;
  }
  return spec;
}

/** The paths of every issue the schema raises, joined with dots. */
function issuePaths(value: unknown): string[] {
  const parsed = networkSpecSchema.safeParse(value);
  expect(parsed.success, "the spec should have been refused").toBe(false);
  return parsed.error!.issues.map((i) => i.path.join("."));
}

function messageAt(value: unknown, path: string): string {
  const issue = networkSpecSchema.safeParse(value).error?.issues.find((i) => i.path.join(".") === path);
  expect(issue, `an issue at ${path}`).toBeDefined();
  return issue!.message;
}

describe("the contract's example", () => {
  it("parses, with the train and objective in the contract's forms", () => {
    const spec = networkSpecSchema.parse(CONTRACT);
    expect(spec.feed).toEqual({ volumetricFlow: 0.1, concentrations: { A: 580, B: 0, C: 0, D: 0 }, temperature: 300 });
    expect(spec.reactions.map((r) => r.stoichiometry)).toEqual([{ A: -1, B: 1 }, { B: -1, C: 1 }, { A: -2, D: 1 }]);
    expect(spec.train).toEqual({ maxStages: 3, types: ["CSTR", "PFR"] });
    expect(spec.objective).toEqual({ maximise: "yield", product: "B" });
    expect(spec.constraints).toEqual({ minConversion: 0.5, maxTotalVolume: 2 });
  });

  it("fills in the feed temperature the contract gives as default, 298.15 K", () => {
    const spec = networkSpecSchema.parse(variant(["feed.temperature", undefined]));
    expect(spec.feed.temperature).toBe(298.15);
  });

  it("takes the other forms the contract names: listed trains, least volume with a product, a temperature range, an expression law", () => {
    const spec = networkSpecSchema.parse(
      variant(
        ["phase", "gas"],
        ["train", { candidates: [["CSTR", "PFR"], ["PFR"]] }],
        ["objective", { minimise: "volume", product: "B" }],
        ["constraints", { minConversion: "80 %", minYield: "0.3", maxStageVolume: "500 L" }],
        ["thermal", { mode: "stageTemperature", min: 300, max: 810 }],
        ["reactions.1.rate", { law: "expression", expression: "k2 * exp(-E2 / (8.314 * T)) * C_B / (1 + K * C_A)", parameters: { k2: 1, E2: "40 kJ/mol", K: 0.001 } }],
        ["reactions.0.rate.reverse", { k: 0.1, orders: { B: 1 }, activationEnergy: "30 kJ/mol" }],
      ),
    );
    expect(spec.train).toEqual({ candidates: [["CSTR", "PFR"], ["PFR"]] });
    expect(spec.objective).toEqual({ minimise: "volume", product: "B" });
    // 1 % = 0.01 by definition (common practice)
    expect(spec.constraints?.minConversion).toBeCloseTo(0.8, 15);
    expect(spec.constraints?.minYield).toBe(0.3);
    expect(spec.thermal).toEqual({ mode: "stageTemperature", min: 300, max: 810 });
  });

  it("allows a species fed at zero and an inert that no reaction names", () => {
    expect(networkSpecSchema.safeParse(variant(["feed.concentrations.N2", "2 mol/L"])).success).toBe(true);
  });
});

describe("every error of the contract's list, at its path", () => {
  it.each<[string, Change[], string]>([
    ["a species in a stoichiometry missing from the feed", [["reactions.1.stoichiometry.E", 1]], "reactions.1.stoichiometry.E"],
    ["a species in an order missing from the feed", [["reactions.2.rate.orders.E", 1]], "reactions.2.rate.orders.E"],
    ["a species in a reverse order missing from the feed", [["reactions.0.rate.reverse", { k: 1, orders: { E: 1 } }]], "reactions.0.rate.reverse.orders.E"],
    ["a species in an expression missing from the feed", [["reactions.0.rate", { law: "expression", expression: "10 * C_A * C_E" }]], "reactions.0.rate.expression"],
    ["the objective's product missing from the feed", [["objective.product", "E"]], "objective.product"],
    ["a key reactant missing from the feed", [["keyReactant", "E"]], "keyReactant"],
    ["a product no reaction forms", [["reactions", [CONTRACT.reactions[0], CONTRACT.reactions[2]]], ["objective.product", "C"]], "objective.product"],
    ["a product that is the key reactant", [["objective.product", "A"]], "objective.product"],
    ["a product that is only consumed", [["reactions", [CONTRACT.reactions[0], { stoichiometry: { A: -1, C: -1, D: 1 }, rate: { law: "power", k: 1, orders: {} } }]], ["objective.product", "C"]], "objective.product"],
    ["a key reactant no reaction consumes", [["feed.concentrations.D", 10], ["keyReactant", "D"]], "keyReactant"],
    ["a key reactant with zero feed", [["feed.concentrations.A", 0]], "keyReactant"],
    ["a key reactant with zero feed, given with a unit", [["feed.concentrations.A", "0 mol/L"]], "keyReactant"],
    ["a negative rate constant", [["reactions.1.rate.k", -1]], "reactions.1.rate.k"],
    ["a negative rate constant with a unit", [["reactions.2.rate.k", "-0.5 L/(mol*s)"]], "reactions.2.rate.k"],
    ["a negative reverse rate constant", [["reactions.0.rate.reverse", { k: -0.1, orders: { B: 1 } }]], "reactions.0.rate.reverse.k"],
    ["a negative activation energy", [["reactions.0.rate.activationEnergy", "-20 kJ/mol"]], "reactions.0.rate.activationEnergy"],
    ["a negative order", [["reactions.0.rate.orders.A", -1]], "reactions.0.rate.orders.A"],
    ["a negative flow", [["feed.volumetricFlow", -0.1]], "feed.volumetricFlow"],
    ["a zero flow", [["feed.volumetricFlow", "0 L/s"]], "feed.volumetricFlow"],
    ["a negative concentration", [["feed.concentrations.B", "-0.1 mol/L"]], "feed.concentrations.B"],
    ["a negative volume limit", [["constraints.maxTotalVolume", -2]], "constraints.maxTotalVolume"],
    ["a feed temperature at or below 0 K", [["feed.temperature", 0]], "feed.temperature"],
    ["minimise volume without a minimum conversion", [["objective", { minimise: "volume" }], ["constraints", { maxTotalVolume: 2 }]], "constraints.minConversion"],
    ["a minimum yield without a product", [["objective", { minimise: "volume" }], ["constraints", { minConversion: 0.5, minYield: 0.2 }]], "constraints.minYield"],
    ["a minimum conversion above 100 %", [["constraints.minConversion", "120 %"]], "constraints.minConversion"],
    ["a temperature range from high to low", [["thermal", { mode: "stageTemperature", min: "810 K", max: 300 }]], "thermal.max"],
    ["a quantity string with no number", [["feed.concentrations.A", "mol/L"]], "feed.concentrations.A"],
    ["an expression whose brackets do not pair up", [["reactions.0.rate", { law: "expression", expression: "10 * (C_A" }]], "reactions.0.rate.expression"],
    ["an expression naming something it does not define", [["reactions.0.rate", { law: "expression", expression: "k * C_A" }]], "reactions.0.rate.expression"],
    ["an expression parameter named like the temperature", [["reactions.0.rate", { law: "expression", expression: "T * C_A", parameters: { T: 1 } }]], "reactions.0.rate.parameters.T"],
    ["a zero stoichiometric coefficient", [["reactions.0.stoichiometry.B", 0]], "reactions.0.stoichiometry.B"],
    ["a reaction with no species", [["reactions.0.stoichiometry", {}]], "reactions.0.stoichiometry"],
    ["no reaction at all", [["reactions", []]], "reactions"],
    ["more than five stages", [["train.maxStages", 6]], "train.maxStages"],
    ["both train forms at once", [["train.candidates", [["PFR"]]]], "train.candidates"],
    ["a listed train given twice", [["train", { candidates: [["PFR"], ["CSTR"], ["PFR"]] }]], "train.candidates.2"],
    ["a listed train of six stages", [["train", { candidates: [["PFR", "PFR", "PFR", "PFR", "PFR", "PFR"]] }]], "train.candidates.0"],
    ["a maximise objective without a product", [["objective", { maximise: "selectivity" }]], "objective.product"],
    ["an objective that neither maximises nor minimises", [["objective", { product: "B" }]], "objective.maximise"],
    ["a species name a rate expression could not spell", [["feed.concentrations.B-2", 0]], "feed.concentrations.B-2"],
    ["no phase", [["phase", undefined]], "phase"],
    ["an objective that both maximises and minimises", [["objective", { maximise: "yield", minimise: "volume", product: "B" }]], "objective.minimise"],
    ["a zero stage volume limit", [["constraints.maxStageVolume", "0 L"]], "constraints.maxStageVolume"],
    ["a stage type named twice", [["train.types", ["PFR", "PFR"]]], "train.types"],
    ["stage types beside listed trains", [["train", { candidates: [["PFR"]], types: ["CSTR"] }]], "train.types"],
    ["an unknown stage type", [["train.types", ["CSTR", "batch"]]], "train.types.1"],
    ["a reference temperature at or below 0 K", [["reactions.0.rate.referenceTemperature", "-5 K"]], "reactions.0.rate.referenceTemperature"],
  ])("%s", (_what, changes, path) => {
    const paths = issuePaths(variant(...changes));
    expect(paths).toContain(path);
    // one mistake, one problem: the check does not pile up unrelated complaints
    expect(new Set(paths).size).toBeLessThanOrEqual(2);
    // every path a person is sent to has its words (field-labels.ts)
    expect(findLabel(path), `label of ${path}`).not.toBeNull();
  });

  it("refuses more than 12 species and more than 10 reactions", () => {
    const many = Object.fromEntries(Array.from({ length: 13 }, (_, i) => [`S${i}`, 0]));
    expect(issuePaths(variant(["feed.concentrations", { ...CONTRACT.feed.concentrations, ...many }]))).toContain("feed.concentrations");
    expect(issuePaths(variant(["reactions", Array.from({ length: 11 }, () => CONTRACT.reactions[0])]))).toContain("reactions");
  });

  it("speaks the trade's words, not the schema's", () => {
    expect(messageAt(variant(["reactions.1.stoichiometry.E", 1]), "reactions.1.stoichiometry.E")).toBe("E is not one of the feed's species; list it in the feed concentrations (0 if none is fed)");
    expect(messageAt(variant(["feed.concentrations.A", 0]), "keyReactant")).toMatch(/^A has no feed/);
    expect(messageAt(variant(["feed.concentrations.D", 10], ["keyReactant", "D"]), "keyReactant")).toBe("no reaction consumes D; give it a negative coefficient in the reaction that uses it up");
    expect(messageAt(variant(["objective.product", "A"]), "objective.product")).toBe("A is the key reactant; the wanted product must be another species");
    expect(findLabel("reactions.1.stoichiometry.E")).toBe("Reaction 2, coefficient of E");
    expect(findLabel("spec.reactions.0.rate.reverse.orders.B")).toBe("Reaction 1, reverse order in B");
    expect(findLabel("constraints.minConversion")).toBe("Minimum conversion");
  });

  it("reads every problem of a badly broken spec as label and sentence, with no schema key in sight", () => {
    const broken = [
      {},
      { feed: { volumetricFlow: "fast", concentrations: { A: -1 } }, phase: "solid", reactions: [{ stoichiometry: { A: "x" }, rate: { law: "magic" } }], keyReactant: "A", thermal: { mode: "hot" }, train: { maxStages: 2.5, candidates: [] }, objective: { maximise: "profit" }, constraints: { minConversion: "ninety" } },
      variant(["objective", { minimise: "volume" }], ["constraints", { minYield: 0.5 }], ["keyReactant", "D"], ["reactions.0.rate", { law: "expression", expression: "kx * C_Q", parameters: { pi: 3 } }]),
    ];
    const sentences = broken.flatMap((spec) => networkSpecSchema.safeParse(spec).error!.issues.map((i) => `${labelFor(i.path.map(String))}: ${issueInWords(i)}`));
    expect(sentences.length).toBeGreaterThan(20);
    for (const sentence of sentences) {
      expect(sentence, sentence).not.toMatch(/\b[a-z]+[A-Z]\w*\b|\w+\.\d+\.\w+|\bspec\b|undefined|expected/);
    }
    expect(sentences).toContain("Heat mode: required");
    expect(sentences).toContain("Reaction 1, parameter pi: the name pi already stands for a mathematical constant; choose another");
  });
});

describe("quantities with units", () => {
  // The litre is exactly 1e-3 m3 (SI Brochure, 9th ed., table 8; common practice), so each conversion is exact
  // up to floating point; the engine's unit tables (mathjs) do the conversion, the schema keeps the string.
  const spec = networkSpecSchema.parse(
    variant(
      ["feed.volumetricFlow", "100 L/s"],
      ["feed.concentrations.A", "0.58 mol/L"],
      ["reactions.2.rate.k", "0.5 L/(mol*s)"],
      ["constraints.maxTotalVolume", "2000 L"],
    ),
  );

  it("keeps the strings as typed for the engine", () => {
    expect(spec.feed.volumetricFlow).toBe("100 L/s");
    expect(spec.feed.concentrations.A).toBe("0.58 mol/L");
  });

  it.each<[string, () => number, number]>([
    ["0.58 mol/L is 580 mol/m3", () => toSI(spec.feed.concentrations.A!, DIM.concentration, "feed.concentrations.A"), 580],
    ["100 L/s is 0.1 m3/s", () => toSI(spec.feed.volumetricFlow, "m^3/s", "feed.volumetricFlow"), 0.1],
    ["0.5 L/(mol*s) is 5e-4 m3/(mol s)", () => toSI(spec.reactions[2]!.rate.law === "power" ? spec.reactions[2]!.rate.k : 0, rateConstantDimension(2), "reactions.2.rate.k"), 5e-4],
    ["2000 L is 2 m3", () => toSI(spec.constraints!.maxTotalVolume!, DIM.volume, "constraints.maxTotalVolume"), 2],
  ])("%s", (_what, convert, si) => {
    expect(Math.abs(convert() / si - 1)).toBeLessThan(1e-12);
  });

  it("a unit of the wrong kind is the engine's refusal, at the same path", () => {
    const parsed = networkSpecSchema.parse(variant(["feed.volumetricFlow", "2 kg/s"]));
    expect(() => toSI(parsed.feed.volumetricFlow, "m^3/s", "feed.volumetricFlow")).toThrow(/feed\.volumetricFlow/);
  });
});

describe("expression names", () => {
  it("tells variables from function calls and numbers with exponents", () => {
    expect(expressionNames("k*exp(-E/(8.314*T))*C_A^2 + 1e-3*C_B").variables.sort()).toEqual(["C_A", "C_B", "E", "T", "k"]);
    expect(expressionNames("max (C_A, 0)").variables).toEqual(["C_A"]);
    expect(expressionNames("(C_A))(").bracketsPair).toBe(false);
    expect(expressionNames("pi * e * C_A").variables.sort()).toEqual(["C_A", "e", "pi"]);
  });

  it("accepts the constants e and pi and the parameters it is given", () => {
    const ok = variant(["reactions.0.rate", { law: "expression", expression: "k1 * exp(-Ea / (8.314462618 * T)) * C_A * pi / pi", parameters: { k1: "5 1/s", Ea: 1e4 } }]);
    expect(networkSpecSchema.safeParse(ok).success).toBe(true);
  });
});

describe("telling a network spec from today's one-reaction spec", () => {
  const dir = join(process.cwd(), "tests/fixtures/specs");
  // Fixtures of several reactions are named network-*.json; every other one is today's contract.
  const all = readdirSync(dir).filter((f) => f.endsWith(".json"));
  const fixtures = all.filter((f) => !f.startsWith("network-"));
  const networkFixtures = all.filter((f) => f.startsWith("network-"));

  it("finds today's fixtures", () => {
    expect(fixtures.length).toBeGreaterThanOrEqual(10);
  });

  it.each(fixtures)("%s is not a network spec, and today's schema still reads it", (file) => {
    const raw: unknown = JSON.parse(readFileSync(join(dir, file), "utf8"));
    expect(isNetworkSpec(raw)).toBe(false);
    const isRating = typeof raw === "object" && raw !== null && "stages" in raw && !("target" in raw);
    expect((isRating ? ratingSpecSchema : designSpecSchema).safeParse(raw).success).toBe(true);
  });

  it.each(networkFixtures)("%s is a network spec and the network schema reads it", (file) => {
    const raw: unknown = JSON.parse(readFileSync(join(dir, file), "utf8"));
    expect(isNetworkSpec(raw)).toBe(true);
    expect(networkSpecSchema.safeParse(raw).success).toBe(true);
  });

  it("says yes to a spec with reactions, and no to anything else", () => {
    expect(isNetworkSpec(CONTRACT)).toBe(true);
    expect(isNetworkSpec({ ...CONTRACT, reaction: {} })).toBe(false);
    expect(isNetworkSpec(null)).toBe(false);
    expect(isNetworkSpec([CONTRACT])).toBe(false);
    expect(isNetworkSpec("reactions")).toBe(false);
  });

  it("today's schema refuses a network spec and the network schema refuses today's", () => {
    expect(designSpecSchema.safeParse(CONTRACT).success).toBe(false);
    const today: unknown = JSON.parse(readFileSync(join(dir, "first-order-liquid.json"), "utf8"));
    expect(networkSpecSchema.safeParse(today).success).toBe(false);
  });
});

describe("the worked examples of docs/sweep-spec.md", () => {
  const doc = readFileSync(join(process.cwd(), "docs/sweep-spec.md"), "utf8");
  const section = doc.slice(doc.indexOf("## Several reactions"));
  const specs = [...section.matchAll(/```json\n([\s\S]*?)```/g)].map((m) => JSON.parse(m[1]!) as unknown).filter(isNetworkSpec);

  it("has worked examples in its section on several reactions", () => {
    expect(doc).toContain("## Several reactions");
    expect(specs.length).toBeGreaterThanOrEqual(2);
  });

  it("every example reads", () => {
    for (const spec of specs) expect(networkSpecSchema.safeParse(spec).error?.issues ?? []).toEqual([]);
  });
});
