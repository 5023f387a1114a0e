import { describe, expect, it } from "vitest";
import { designTrains } from "../../../lib/engine/index";
import { powerSpec, rel, repeat } from "./helpers";

const TOL = 1e-8;

describe("liquid closed forms", () => {
  const cases = [
    { k: 0.3, x: 0.9 },
    { k: 2.5e-3, x: 0.5 },
    { k: 1.7, x: 0.99 },
  ];
  for (const { k, x } of cases) {
    it(`first order, k=${k}, X=${x}`, () => {
      const fa0 = 0.7;
      const ca0 = 350;
      const v0 = fa0 / ca0;
      const r = designTrains(powerSpec({ k, order: 1, target: x, fa0, ca0 }));
      // closed form, Levenspiel, Chemical Reaction Engineering 3rd ed., ch. 5: k tau = X/(1-X) for a CSTR
      expect(rel(r.reference.singleCSTR as number, (v0 * x) / (k * (1 - x)))).toBeLessThan(TOL);
      // closed form, Levenspiel, Chemical Reaction Engineering 3rd ed., ch. 5: k tau = -ln(1-X) for a PFR
      expect(rel(r.reference.singlePFR as number, (-v0 * Math.log(1 - x)) / k)).toBeLessThan(TOL);
    });
    it(`second order, k=${k}, X=${x}`, () => {
      const fa0 = 0.7;
      const ca0 = 3.5;
      const v0 = fa0 / ca0;
      const r = designTrains(powerSpec({ k, order: 2, target: x, fa0, ca0 }));
      // closed form, Levenspiel, Chemical Reaction Engineering 3rd ed., ch. 5: k tau CA0 = X/(1-X)^2 for a CSTR
      expect(rel(r.reference.singleCSTR as number, (v0 * x) / (k * ca0 * (1 - x) ** 2))).toBeLessThan(TOL);
      // closed form, Levenspiel, Chemical Reaction Engineering 3rd ed., ch. 5: k tau CA0 = X/(1-X) for a PFR
      expect(rel(r.reference.singlePFR as number, (v0 * x) / (k * ca0 * (1 - x)))).toBeLessThan(TOL);
    });
  }

  for (const n of [2, 3, 5, 8]) {
    it(`${n} equal CSTRs in series, first order`, () => {
      const k = 0.04;
      const x = 0.95;
      const r = designTrains(powerSpec({ k, order: 1, target: x, candidates: [repeat("CSTR", n)], equalVolume: true }));
      // closed form, Levenspiel, Chemical Reaction Engineering 3rd ed., ch. 6: k tau_N = N((1-X)^(-1/N) - 1)
      const expected = (n * ((1 - x) ** (-1 / n) - 1)) / k;
      expect(rel(r.candidates[0].totalVolume as number, expected)).toBeLessThan(TOL);
      for (const s of r.candidates[0].stages) expect(rel(s.volume, expected / n)).toBeLessThan(1e-8);
    });
  }

  it("first order, X = 0.96: k tau is 24 for one CSTR, 4 + 4 for two equal CSTRs, ln 25 for a PFR", () => {
    const k = 1;
    const r = designTrains(powerSpec({ k, order: 1, target: 0.96, candidates: [["CSTR"], ["PFR"], ["CSTR", "CSTR"]] }));
    const byName = new Map(r.candidates.map((c) => [c.sequence.join("-"), c]));
    // follows from the closed forms, Levenspiel, Chemical Reaction Engineering 3rd ed., ch. 5 and 6
    expect(rel(byName.get("CSTR")?.totalVolume as number, 24)).toBeLessThan(TOL);
    expect(rel(byName.get("PFR")?.totalVolume as number, Math.log(25))).toBeLessThan(TOL);
    const two = byName.get("CSTR-CSTR");
    expect(rel(two?.totalVolume as number, 8)).toBeLessThan(TOL);
    for (const s of two?.stages ?? []) expect(rel(s.volume, 4)).toBeLessThan(1e-7);
    expect(rel(two?.stages[0].conversionOut as number, 0.8)).toBeLessThan(1e-8);
  });

  it("residence time is volume / v0 with v0 = FA0/CA0", () => {
    const r = designTrains(powerSpec({ k: 0.1, order: 1, target: 0.8, fa0: 2, ca0: 500 }));
    const s = r.candidates[0].stages[0];
    expect(rel(s.residenceTime, s.volume / (2 / 500))).toBeLessThan(1e-14);
    // closed form, Levenspiel, ch. 5: tau = -ln(1-X)/k for the PFR, which ranks first for first order
    expect(rel(s.residenceTime, -Math.log(0.2) / 0.1)).toBeLessThan(TOL);
  });
});

describe("gas phase with expansion (isothermal, isobaric)", () => {
  // A -> 2R with an equal molar feed of inert: eps = (2 - 1)/(1 + 1) = 0.5 (Levenspiel, ch. 3, definition of eps_A)
  const gas = (order: number, candidates: ("CSTR" | "PFR")[][], epsilon?: number) =>
    designTrains({
      feed: { flowA: 0.3, concA: 40, temperature: 600, ratios: { I: 1 } },
      reaction: {
        stoichiometry: { A: -1, R: 2, I: 0 },
        phase: "gas",
        ...(epsilon !== undefined ? { epsilon } : {}),
        rate: { law: "power", k: order === 1 ? 0.05 : 0.002, orders: { A: order } },
      },
      target: { conversion: 0.8 },
      train: { candidates },
    });
  const v0 = 0.3 / 40;
  const x = 0.8;

  it("first order PFR and CSTR", () => {
    const r = gas(1, [["PFR"], ["CSTR"]]);
    const eps = 0.5;
    const k = 0.05;
    // closed form, Levenspiel, Chemical Reaction Engineering 3rd ed., eq. 5.22: k tau = -(1+eps) ln(1-X) - eps X
    expect(rel(r.reference.singlePFR as number, (v0 * (-(1 + eps) * Math.log(1 - x) - eps * x)) / k)).toBeLessThan(TOL);
    // closed form, Levenspiel, Chemical Reaction Engineering 3rd ed., eq. 5.14 with -rA = k CA0 (1-X)/(1+eps X)
    expect(rel(r.reference.singleCSTR as number, (v0 * x * (1 + eps * x)) / (k * (1 - x)))).toBeLessThan(TOL);
  });

  it("second order PFR and CSTR with a given epsilon", () => {
    const eps = 0.8;
    const r = gas(2, [["PFR"], ["CSTR"]], eps);
    const k = 0.002;
    const ca0 = 40;
    // closed form, Levenspiel, Chemical Reaction Engineering 3rd ed., eq. 5.25
    const pfr = 2 * eps * (1 + eps) * Math.log(1 - x) + eps * eps * x + ((eps + 1) ** 2 * x) / (1 - x);
    expect(rel(r.reference.singlePFR as number, (v0 * pfr) / (k * ca0))).toBeLessThan(TOL);
    // closed form, Levenspiel, ch. 5: k tau CA0 = X (1+eps X)^2/(1-X)^2 for a CSTR
    expect(rel(r.reference.singleCSTR as number, (v0 * x * (1 + eps * x) ** 2) / (k * ca0 * (1 - x) ** 2))).toBeLessThan(TOL);
  });
});
