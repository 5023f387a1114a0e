import { describe, expect, it } from "vitest";
import { designNetwork } from "../../../../lib/engine/network/design";
import { CA0, only, seriesDesign, tanks, V0 } from "./design-helpers";
import { firstOrder, liquid, rel } from "./helpers";

describe("network designer against closed forms", { timeout: 120000 }, () => {
  // Levenspiel, Chemical Reaction Engineering, 3rd ed., ch. 8: A -> B -> C, first order.
  it.each([
    { k1: 0.8, k2: 0.3 },
    { k1: 0.05, k2: 0.4 },
  ])("best single tube and tank for the intermediate, and the tube ranks first (k1 $k1, k2 $k2)", ({ k1, k2 }) => {
    const r = designNetwork(seriesDesign(k1, k2, { maxStages: 1 }));
    const tube = (k1 / k2) ** (k2 / (k2 - k1));
    const tank = 1 / (Math.sqrt(k2 / k1) + 1) ** 2;
    expect(r.candidates.map((c) => c.sequence.join())).toEqual(["PFR", "CSTR"]);
    expect(rel(r.candidates[0].objective!, tube)).toBeLessThan(1e-8);
    expect(rel(r.candidates[1].objective!, tank)).toBeLessThan(1e-8);
    // at tau = ln(k2/k1)/(k2-k1) and 1/sqrt(k1 k2); the optimum is flat there, so the time is checked to 1e-3
    expect(rel(r.candidates[0].totalResidenceTime!, Math.log(k2 / k1) / (k2 - k1))).toBeLessThan(1e-3);
    expect(rel(r.candidates[1].totalResidenceTime!, 1 / Math.sqrt(k1 * k2))).toBeLessThan(1e-3);
    expect(rel(r.reference.singlePFR!.objective, tube)).toBeLessThan(1e-8);
    expect(rel(r.reference.singleCSTR!.objective, tank)).toBeLessThan(1e-8);
    expect(r.candidates[0].outlet!.B / CA0).toBeCloseTo(tube, 8);
  });

  // The same closed form when the best time lies far out on the chemistry's time scale (k2 << k1: about
  // 11.5 lifetimes of A), at a small and a large feed flow: the scan's reach must not depend on the flow.
  it.each([1e-4, 10])("a best tube far out in residence time is found whatever the feed flow (v0 %s m3/s)", (v0) => {
    const k1 = 1;
    const k2 = 1e-5;
    const spec = seriesDesign(k1, k2, { candidates: [["PFR"]] });
    const r = designNetwork({ ...spec, feed: { ...spec.feed, volumetricFlow: v0 } });
    expect(rel(r.candidates[0].objective!, (k1 / k2) ** (k2 / (k2 - k1)))).toBeLessThan(1e-8);
    expect(rel(r.candidates[0].totalResidenceTime!, Math.log(k2 / k1) / (k2 - k1))).toBeLessThan(1e-3);
  });

  it("more stirred tanks in series approach the tube (common practice)", () => {
    const r = designNetwork(seriesDesign(0.8, 0.3, only(["PFR"], ...[1, 2, 3, 4, 5].map(tanks))));
    const best = (n: number) => r.candidates.find((c) => c.sequence.length === n && c.sequence[0] === "CSTR")!.objective!;
    const tube = r.candidates.find((c) => c.sequence.join() === "PFR")!.objective!;
    const yields = [1, 2, 3, 4, 5].map(best);
    for (let n = 1; n < 5; n++) expect(yields[n]).toBeGreaterThan(yields[n - 1] + 1e-6);
    for (const y of yields) expect(y).toBeLessThan(tube);
    expect(tube - yields[4]).toBeLessThan((tube - yields[0]) / 3);
  });

  it("least volume at a conversion: first order, tube V = v0 ln(1/(1-X))/k, tank V = v0 X/(k(1-X)) (Levenspiel, ch. 5)", () => {
    const spec = { ...liquid({ A: CA0, B: 0 }, [firstOrder("A", "B", 0.02)], "A", V0), train: { maxStages: 1 }, objective: { minimise: "volume" as const }, constraints: { minConversion: 0.9 } };
    const r = designNetwork(spec);
    expect(r.candidates[0].sequence).toEqual(["PFR"]);
    expect(rel(r.candidates[0].totalVolume!, (V0 * Math.log(10)) / 0.02)).toBeLessThan(1e-8);
    expect(rel(r.candidates[1].totalVolume!, (V0 * 9) / 0.02)).toBeLessThan(1e-8);
    expect(r.candidates[0].conversion!).toBeGreaterThanOrEqual(0.9 - 1e-12);
  });

  it("selectivity at a minimum conversion: the tube stops exactly at it (Levenspiel, ch. 8, series closed form)", () => {
    const [k1, k2] = [0.8, 0.3];
    const r = designNetwork(seriesDesign(k1, k2, { maxStages: 2 }, { minConversion: 0.5 }, { maximise: "selectivity", product: "B" }));
    // C_B/C_A0 = k1/(k2 - k1) (e^(-k1 tau) - e^(-k2 tau)) at e^(-k1 tau) = 0.5; S = Y/X
    const tau = Math.log(2) / k1;
    const tube = ((k1 / (k2 - k1)) * (Math.exp(-k1 * tau) - Math.exp(-k2 * tau))) / 0.5;
    const best = r.candidates[0];
    expect(best.stages.filter((s) => s.volume > 0).map((s) => s.type)).toEqual(["PFR"]);
    expect(rel(best.objective!, tube)).toBeLessThan(1e-7);
    expect(rel(best.conversion!, 0.5)).toBeLessThan(1e-7);
    expect(rel(r.reference.singlePFR!.volume, tau * V0)).toBeLessThan(1e-6);
  });

  it("least volume of an expanding gas: A -> 2B with half inerts (Levenspiel, ch. 5, closed forms with eps_A = 0.5)", () => {
    const r = designNetwork({
      feed: { volumetricFlow: "100 L/s", concentrations: { A: 20, B: 0, N: 20 }, temperature: 600 },
      phase: "gas",
      reactions: [{ stoichiometry: { A: -1, B: 2 }, rate: { law: "power", k: 0.5, orders: { A: 1 } } }],
      keyReactant: "A",
      train: { maxStages: 1 },
      objective: { minimise: "volume" },
      constraints: { minConversion: 0.9 },
    });
    const [k, X, eps, v0] = [0.5, 0.9, 0.5, 0.1];
    // tube: k tau = (1 + eps) ln(1/(1-X)) - eps X; tank: k tau = X (1 + eps X)/(1 - X)
    expect(rel(r.reference.singlePFR!.volume, (v0 * ((1 + eps) * Math.log(1 / (1 - X)) - eps * X)) / k)).toBeLessThan(1e-8);
    expect(rel(r.reference.singleCSTR!.volume, (v0 * X * (1 + eps * X)) / (1 - X) / k)).toBeLessThan(1e-8);
  });
});
