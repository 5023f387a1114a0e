import { describe, expect, it } from "vitest";
import { AppError } from "@/lib/errors";
import { CAUTIONS } from "@/lib/engine";
import { networkPreviewSchema } from "@/lib/schemas/network-preview";
import { previewNetwork } from "@/lib/services/network-preview";

const k1 = 0.02; // 1/s
const k2 = 0.005; // 1/s
const body = (over: Record<string, unknown> = {}) => ({
  spec: {
    feed: { volumetricFlow: "2 L/s", concentrations: { A: "1 mol/L", B: 0, C: 0 }, temperature: 320 },
    phase: "liquid",
    reactions: [
      { stoichiometry: { A: -1, B: 1 }, rate: { law: "power", k: k1, orders: { A: 1 } } },
      { stoichiometry: { B: -1, C: 1 }, rate: { law: "power", k: k2, orders: { B: 1 } } },
    ],
    keyReactant: "A",
    product: "B",
    shownUnits: { "feed.volumetricFlow": "L/s" },
  },
  ...over,
});
const preview = (b: unknown) => previewNetwork(networkPreviewSchema.parse(b));
const max = (xs: { product: number | null; residenceTime: number }[]) => xs.reduce((a, p) => ((p.product ?? -1) > (a.product ?? -1) ? p : a));

describe("live preview of several reactions", () => {
  it("A → B → C, first order: the tube and tank maxima of B are the closed forms (Levenspiel, Chemical Reaction Engineering, 3rd ed., ch. 8)", () => {
    const p = preview(body());
    expect(p.kind).toBe("network");
    expect(p.cautions).toEqual([...CAUTIONS]);
    expect(p.paths.key).toBe("A");
    expect(p.paths.product).toBe("B");
    const CA0 = 1000;
    // Plug flow: C_B,max / C_A0 = (k1/k2)^(k2/(k2-k1)) at τ = ln(k2/k1)/(k2-k1)
    const tube = max(p.paths.tube);
    expect(tube.product! / (CA0 * (k1 / k2) ** (k2 / (k2 - k1)))).toBeCloseTo(1, 3);
    expect(tube.residenceTime / (Math.log(k2 / k1) / (k2 - k1))).toBeCloseTo(1, 1);
    // One stirred tank: C_B,max / C_A0 = 1/((k2/k1)^(1/2) + 1)^2 at τ = 1/sqrt(k1 k2)
    const tank = max(p.paths.tanks);
    expect(tank.product! / (CA0 / (Math.sqrt(k2 / k1) + 1) ** 2)).toBeCloseTo(1, 3);
    expect(tank.residenceTime / (1 / Math.sqrt(k1 * k2))).toBeCloseTo(1, 1);
    // Instantaneous selectivity at the feed: all of A's consumption makes B (r1 / r1 = 1)
    expect(p.paths.tube[0]!.selectivity).toBeCloseTo(1, 12);
  });

  it("a product chosen in the request wins over the model's own", () => {
    const p = preview(body({ product: "C" }));
    expect(p.paths.product).toBe("C");
  });

  it("without a wanted product, the paths carry the key reactant only", () => {
    const b = body();
    delete (b.spec as { product?: string }).product;
    const p = preview(b);
    expect(p.paths.product).toBeNull();
    expect(p.paths.tube.every((q) => q.product === null && q.selectivity === null)).toBe(true);
    // First order in plug flow: C_A = C_A0 e^(-k1 τ) (common practice)
    const q = p.paths.tube[40]!;
    expect(q.key / (1000 * Math.exp(-k1 * q.residenceTime))).toBeCloseTo(1, 4);
  });

  it("an engine refusal is a 400 at the field, keyed by its place in the request", () => {
    const b = body();
    (b.spec.reactions[1]!.rate as Record<string, unknown>) = { law: "expression", expression: "k2 * C_B +* 2", parameters: { k2: 0.005 } };
    let caught: unknown;
    try {
      preview(b);
    } catch (e) {
      caught = e;
    }
    expect(caught).toBeInstanceOf(AppError);
    const err = caught as AppError;
    expect(err.status).toBe(400);
    expect(Object.keys(err.fields ?? {})).toEqual(["spec.reactions.1.rate.expression"]);
    expect(err.message).toMatch(/^Reaction 2, rate expression: /);
  });

  it("a bad unit is refused at its field in the trade's words", () => {
    const b = body();
    b.spec.feed.volumetricFlow = "2 L/parsec";
    let caught: unknown;
    try {
      preview(b);
    } catch (e) {
      caught = e;
    }
    expect((caught as AppError).fields).toHaveProperty(["spec.feed.volumetricFlow"]);
    expect((caught as AppError).message).toMatch(/^Feed volumetric flow: /);
  });

  it("the request schema checks the wanted product against the species", () => {
    const r = networkPreviewSchema.safeParse(body({ product: "Z" }));
    expect(r.success).toBe(false);
    expect(r.error!.issues.map((i) => i.path.join("."))).toEqual(["product"]);
  });
});
