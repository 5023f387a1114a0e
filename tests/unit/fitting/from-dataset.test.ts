import { describe, expect, it } from "vitest";
import { designTrains, type DesignSpec, type RateLawSpec } from "@/lib/engine";
import { akaike, preparePoints, toEngineLaw, tryFit, type DatasetRow } from "@/lib/fitting/from-dataset";
import type { RateModelKind } from "@/lib/fitting";

const R = 8.314462618; // J/(mol K), CODATA 2018 exact

// Demo bench data (invented): liquid feed C_A0 = 1000 mol/m3, FA0 = 0.5 mol/s, design conversion 0.7.
const CA0 = 1000;
const FA0 = 0.5;
const X = 0.7;
const concs = Array.from({ length: 20 }, (_, i) => 60 + i * 45);

/** The fitted parameters by name. */
function fitted(kind: RateModelKind, rows: DatasetRow[], c0: number | null = null) {
  const r = tryFit(kind, preparePoints(rows, c0));
  if (!r.ok) throw new Error(r.error);
  return { fit: r.fit, p: Object.fromEntries(r.fit.parameters.map((q) => [q.name, q.value])) };
}

/** One CSTR sized by the engine for the mapped law. */
function engineCstrVolume(rate: RateLawSpec, extra: Partial<DesignSpec["reaction"]> = {}, feedT = 340): number {
  const result = designTrains({
    feed: { flowA: FA0, concA: CA0, temperature: feedT },
    reaction: { phase: "liquid", ...extra, rate },
    target: { conversion: X },
    train: { candidates: [["CSTR"]] },
  });
  return result.candidates[0].totalVolume!;
}

// The CSTR design equation V = FA0·X / (−rA at the outlet), liquid phase C_A = C_A0(1 − X)
// (common practice), evaluated by hand from the fitted parameters and compared with the engine.
describe("a fitted law maps to the engine's rate law with the same meaning", () => {
  const cA = CA0 * (1 - X);

  it("power law → power with order n in A", () => {
    const { fit, p } = fitted("power", concs.map((c) => ({ concA: c, rate: 2e-5 * c ** 1.4 })));
    const law = toEngineLaw(fit);
    expect(law).toEqual({ law: "power", k: p.k, orders: { A: p.n } });
    const byHand = (FA0 * X) / (p.k * cA ** p.n);
    expect(engineCstrVolume(law)).toBeCloseTo(byHand, 8);
  });

  it("reversible → power with a reverse term in R; C_R = C_A0·X with one R per A and none fed", () => {
    const rows = concs.map((c) => ({ conversion: 1 - c / 1100, rate: 4e-3 * c - 1e-3 * (1100 - c) }));
    const { fit, p } = fitted("reversible", rows, 1100);
    const law = toEngineLaw(fit);
    expect(law).toEqual({ law: "power", k: p.kf, orders: { A: 1 }, reverse: { k: p.kr, orders: { R: 1 } } });
    const cR = CA0 * X;
    const byHand = (FA0 * X) / (p.kf * cA - p.kr * cR);
    expect(engineCstrVolume(law, { stoichiometry: { A: -1, R: 1 } })).toBeCloseTo(byHand, 8);
  });

  it("saturation → saturation (vmax, km)", () => {
    const { fit, p } = fitted("saturation", concs.map((c) => ({ concA: c, rate: (1.5 * c) / (250 + c) })));
    const law = toEngineLaw(fit);
    expect(law).toEqual({ law: "saturation", vmax: p.vmax, km: p.km });
    expect(engineCstrVolume(law)).toBeCloseTo((FA0 * X) / ((p.vmax * cA) / (p.km + cA)), 8);
  });

  it("saturation with inhibition → saturation with ki", () => {
    const { fit, p } = fitted("saturation-inhibition", concs.map((c) => ({ concA: c, rate: (1.5 * c) / (250 + c + (c * c) / 900) })));
    const law = toEngineLaw(fit);
    expect(law).toEqual({ law: "saturation", vmax: p.vmax, km: p.km, ki: p.ki });
    expect(engineCstrVolume(law)).toBeCloseTo((FA0 * X) / ((p.vmax * cA) / (p.km + cA + (cA * cA) / p.ki)), 8);
  });

  it("power with Arrhenius → power with activation energy at the fitted reference temperature", () => {
    const rows = [320, 335, 350, 365].flatMap((T) => concs.slice(0, 8).map((c) => ({ concA: c, temperature: T, rate: 1e-4 * Math.exp((-60000 / R) * (1 / T - 1 / 340)) * c ** 1.2 })));
    const { fit, p } = fitted("power-arrhenius", rows);
    const law = toEngineLaw(fit);
    expect(law).toEqual({ law: "power", k: p.k_ref, orders: { A: p.n }, activationEnergy: p.Ea, referenceTemperature: fit.referenceTemperature });
    // Isothermal CSTR at 355 K: k(355) = k_ref exp(−Ea/R (1/355 − 1/T_ref)) (Arrhenius, common practice).
    const k355 = p.k_ref * Math.exp((-p.Ea / R) * (1 / 355 - 1 / fit.referenceTemperature!));
    expect(engineCstrVolume(law, {}, 355)).toBeCloseTo((FA0 * X) / (k355 * cA ** p.n), 8);
  });
});

describe("points from stored rows", () => {
  it("derives C_A = C_A0(1 − X) from conversion and says so", () => {
    const prepared = preparePoints([{ conversion: 0.25, rate: 1 }], 800);
    expect(prepared.points[0].concA).toBeCloseTo(600, 12);
    expect(prepared.points[0].concR).toBeCloseTo(200, 12);
    expect(prepared.assumptions.join(" ")).toMatch(/liquid phase/);
  });

  it("refuses laws the data cannot support, with a reason", () => {
    const rows = concs.map((c) => ({ concA: c, rate: 2e-5 * c }));
    const arr = tryFit("power-arrhenius", preparePoints(rows, null));
    expect(arr).toMatchObject({ ok: false, error: "needs a temperature column with at least two temperatures" });
    const rev = tryFit("reversible", preparePoints(rows, null));
    expect(rev.ok).toBe(false);
    const few = tryFit("saturation-inhibition", preparePoints(rows.slice(0, 3), null));
    expect(few).toMatchObject({ ok: false, error: expect.stringMatching(/more points/) });
  });

  it("AIC is n ln(RSS/n) + 2(p+1) (Akaike 1974, least-squares form)", () => {
    // n = 10, RSS = 10·e^-2 → n ln(RSS/n) = −20; p = 2 → +6.
    expect(akaike(10 * Math.exp(-2), 10, 2)).toBeCloseTo(-14, 12);
    expect(akaike(0, 10, 2)).toBeNull();
  });
});
