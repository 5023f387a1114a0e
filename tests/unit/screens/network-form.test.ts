import { describe, expect, it } from "vitest";
import {
  blankReaction,
  defaultNetworkValues,
  equationText,
  formToNetworkSpec,
  mapNetworkServerFields,
  networkFormPathOf,
  networkFormSchema,
  networkSpecToForm,
  nextSpeciesId,
  reactionText,
  type NetworkFormValues,
} from "@/components/kinetics/network-form-state";

describe("form of several reactions → stored chemistry", () => {
  it("the default draft is A → B → C in SI, with the units as typed", () => {
    const { spec, issues } = formToNetworkSpec(defaultNetworkValues());
    expect(issues).toEqual([]);
    expect(spec).toEqual({
      feed: { volumetricFlow: 0.002, concentrations: { A: 1000, B: 0, C: 0 }, temperature: 320 },
      phase: "liquid",
      reactions: [
        { stoichiometry: { A: -1, B: 1 }, rate: { law: "power", k: 0.02, orders: { A: 1 } } },
        { stoichiometry: { B: -1, C: 1 }, rate: { law: "power", k: 0.005, orders: { B: 1 } } },
      ],
      keyReactant: "A",
      product: "B",
      shownUnits: {
        "feed.volumetricFlow": "L/s",
        "feed.temperature": "K",
        "feed.concentrations.A": "mol/L",
        "feed.concentrations.B": "mol/L",
        "feed.concentrations.C": "mol/L",
        "reactions.0.rate.k": "mol/L|s",
        "reactions.1.rate.k": "mol/L|s",
      },
    });
  });

  it("converts customary units to SI (exact definitions)", () => {
    const v = defaultNetworkValues();
    v.feed.volumetricFlow = { value: "3.6", unit: "m3/h" }; // 3.6 m³/h = 0.001 m³/s
    v.feed.temperature = { value: "57", unit: "degC" };
    v.species[0]!.conc = { value: "0.5", unit: "kmol/m3" };
    // 2 A → D, second order: 6 L/(mol·min) = 6e-3 m³/mol / 60 s = 1e-4 m³/(mol·s)
    const r3 = blankReaction();
    v.species.push({ key: "s4", name: "D", conc: { value: "0", unit: "mol/L" } });
    r3.coefficients = { s1: "-2", s4: "1" };
    r3.orders = { s1: "2" };
    r3.k = { value: "6", conc: "mol/L", time: "min" };
    r3.arrheniusOn = true;
    r3.activationEnergy = { value: "12", unit: "kcal/mol" };
    v.reactions.push(r3);
    const { spec, issues } = formToNetworkSpec(v);
    expect(issues).toEqual([]);
    expect(spec!.feed.volumetricFlow).toBeCloseTo(0.001, 15);
    expect(spec!.feed.temperature).toBeCloseTo(330.15, 12);
    expect(spec!.feed.concentrations.A).toBeCloseTo(500, 12);
    const rate = spec!.reactions[2]!.rate as { k: number; activationEnergy: number };
    expect(rate.k).toBeCloseTo(1e-4, 15);
    expect(rate.activationEnergy).toBeCloseTo(12 * 4184, 9); // thermochemical calorie, 4.184 J (exact by definition)
    expect(spec!.shownUnits!["reactions.2.rate.k"]).toBe("mol/L|min");
    expect(spec!.shownUnits!["reactions.2.rate.activationEnergy"]).toBe("kcal/mol");
  });

  it("reopens as typed: values → chemistry → values keeps every number and unit", () => {
    const v = defaultNetworkValues();
    v.name = "";
    v.feed.volumetricFlow = { value: "7.5", unit: "L/min" };
    v.feed.temperature = { value: "60", unit: "degC" };
    v.species[0]!.conc = { value: "0.58", unit: "mol/L" };
    v.species.push({ key: "s4", name: "N2", conc: { value: "40", unit: "mol/m3" } });
    v.phase = "gas";
    const r1 = v.reactions[0]!;
    r1.k = { value: "1.5", conc: "mol/L", time: "h" };
    r1.reverseOn = true;
    r1.reverse = { k: { value: "0.25", conc: "mol/L", time: "h" }, orders: { s2: "1" }, activationEnergy: { value: "80", unit: "kJ/mol" } };
    r1.arrheniusOn = true;
    r1.activationEnergy = { value: "65", unit: "kJ/mol" };
    r1.referenceTemperature = { value: "350", unit: "K" };
    const r2 = v.reactions[1]!;
    r2.law = "expression";
    r2.expression = "k2*C_B/(1 + K*C_A)";
    r2.parameters = [
      { name: "k2", value: "0.004" },
      { name: "K", value: "0.001" },
    ];
    const { spec, issues } = formToNetworkSpec(v);
    expect(issues).toEqual([]);
    const back = networkSpecToForm(spec!, { note: "" });
    // An expression reaction keeps no power-law fields; compare what the engineer typed.
    const expected: NetworkFormValues = structuredClone(v);
    expected.reactions[1] = { ...blankReaction(), coefficients: r2.coefficients, law: "expression", expression: r2.expression, parameters: r2.parameters };
    expect(back).toEqual(expected);
  });

  it("species keep their numbers through a rename (coefficients are keyed by a stable id)", () => {
    const v = defaultNetworkValues();
    v.species[1]!.name = "Mono";
    const { spec } = formToNetworkSpec(v);
    expect(spec!.reactions[0]!.stoichiometry).toEqual({ A: -1, Mono: 1 });
    expect(spec!.reactions[1]!.rate).toMatchObject({ orders: { Mono: 1 } });
    expect(spec!.product).toBe("Mono");
    expect(nextSpeciesId(v.species)).toBe("s4");
  });

  it("reports unreadable numbers and names at their own fields", () => {
    const v = defaultNetworkValues();
    v.feed.volumetricFlow.value = "abc";
    v.species[2]!.name = "2C";
    v.reactions[1]!.k.value = "";
    v.reactions[0]!.coefficients.s2 = "one";
    const { spec, issues } = formToNetworkSpec(v);
    expect(spec).toBeNull();
    expect(issues).toContainEqual({ path: "feed.volumetricFlow.value", message: "Enter a number" });
    expect(issues).toContainEqual({ path: "reactions.1.k.value", message: "Required" });
    expect(issues).toContainEqual({ path: "reactions.0.coefficients.s2", message: "Enter a number" });
    expect(issues.map((i) => i.path)).toContain("species.2.name");
  });

  it("the chemistry's own checks land at the field a person corrects", () => {
    const v = defaultNetworkValues();
    v.reactions[0]!.coefficients.s2 = "0"; // a zero coefficient
    v.reactions[1]!.k.value = "-1"; // a negative rate constant
    v.species[0]!.conc.value = "0"; // the key reactant not fed
    const { spec, issues } = formToNetworkSpec(v);
    expect(spec).toBeNull();
    const at = (path: string) => issues.filter((i) => i.path === path).map((i) => i.message);
    expect(at("reactions.0.coefficients.s2")[0]).toMatch(/^Must not be zero/);
    expect(at("reactions.1.k.value")[0]).toBe("Must not be negative");
    expect(at("keyReactant")[0]).toMatch(/has no feed/);
  });

  it("asks for a key reactant, and for the wanted product to be formed by some reaction", () => {
    const v = defaultNetworkValues();
    v.keyReactant = "";
    expect(formToNetworkSpec(v).issues).toContainEqual({ path: "keyReactant", message: "Choose the key reactant, the species whose conversion is measured" });
    const w = defaultNetworkValues();
    w.product = "s1";
    expect(formToNetworkSpec(w).issues.find((i) => i.path === "product")?.message).toMatch(/is the key reactant/);
  });

  it("the form schema gives the create body and needs a model name", () => {
    const create = networkFormSchema("create").safeParse(defaultNetworkValues());
    expect(create.success).toBe(false);
    expect(create.error!.issues.map((i) => i.path.join("."))).toEqual(["name"]);
    const named = networkFormSchema("create").safeParse({ ...defaultNetworkValues(), name: "Series, bench fit" });
    expect(named.success).toBe(true);
    expect(named.data!.name).toBe("Series, bench fit");
    expect(named.data!.spec.keyReactant).toBe("A");
  });
});

describe("engine and server errors at their field", () => {
  const v = defaultNetworkValues();
  it("maps the engine's paths (spec.-prefixed) to form fields", () => {
    expect(networkFormPathOf("spec.reactions.1.rate.k", v)).toBe("reactions.1.k.value");
    expect(networkFormPathOf("reactions.0.rate.orders.A", v)).toBe("reactions.0.orders.s1");
    expect(networkFormPathOf("spec.reactions.0.stoichiometry.B", v)).toBe("reactions.0.coefficients.s2");
    expect(networkFormPathOf("spec.reactions.0.rate.reverse.k", v)).toBe("reactions.0.reverse.k.value");
    expect(networkFormPathOf("spec.feed.concentrations.C", v)).toBe("species.2.conc.value");
    expect(networkFormPathOf("spec.feed.volumetricFlow", v)).toBe("feed.volumetricFlow.value");
    expect(networkFormPathOf("spec.keyReactant", v)).toBe("keyReactant");
    expect(networkFormPathOf("spec.shownUnits.feed.temperature", v)).toBe("");
  });
  it("sorts an API answer's fields into fields and the rest", () => {
    const { byField, rest } = mapNetworkServerFields({ "spec.reactions.1.rate.expression": ["the brackets do not pair up"], "(body)": ["Malformed JSON"] }, v);
    expect(byField).toEqual({ "reactions.1.expression": "The brackets do not pair up" });
    expect(rest).toEqual(["Malformed JSON"]);
  });
});

describe("reactions as readable text", () => {
  it("writes equations as a chemist does", () => {
    expect(equationText({ A: -1, B: 1 })).toBe("A → B");
    expect(equationText({ A: -2, D: 1 })).toBe("2 A → D");
    expect(equationText({ A: -1, B: -1, C: 1, D: 2 })).toBe("A + B → C + 2 D");
    expect(equationText({ A: -0.5, O2: 1 })).toBe("0.5 A → O2");
    expect(equationText({ A: -1 })).toBe("A → …");
  });
  it("reads the form's reaction, leaving out what is not yet a number", () => {
    const v = defaultNetworkValues();
    expect(reactionText(v, 0)).toBe("A → B");
    expect(reactionText(v, 1)).toBe("B → C");
    v.reactions[1]!.coefficients.s3 = "x";
    expect(reactionText(v, 1)).toBe("B → …");
  });
});
