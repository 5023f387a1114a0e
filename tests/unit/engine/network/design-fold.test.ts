import { describe, expect, it } from "vitest";
import { designNetwork } from "../../../../lib/engine/network/design";
import type { NetworkDesignSpec } from "../../../../lib/engine/network/design-types";
import { rel } from "./helpers";

/**
 * Designs pressed against the fold of a stirred tank's steady-state curve: the lowest-conversion state
 * exists only up to the fold's volume, then the tank's lowest state jumps to the ignited branch. The
 * contract asks for a design within 1e-6 relative of the fold and its objective.
 */
const A0 = 1000;
const beta = 0.01;
const k1 = 1e-8; // D = k1 tau C_A0^2 = 0.01 tau
const v0 = 1;
const cubic = (extra: NetworkDesignSpec["reactions"]): Omit<NetworkDesignSpec, "train" | "objective"> => ({
  feed: { volumetricFlow: v0, concentrations: { A: A0, B: beta * A0, C: 0 } },
  phase: "liquid",
  keyReactant: "A",
  reactions: [{ stoichiometry: { A: -1, B: 1 }, rate: { law: "power", k: k1, orders: { A: 1, B: 2 } } }, ...extra],
});

describe("designs at the fold of a stirred tank", { timeout: 120000 }, () => {
  it("least volume reaching 90 % conversion by cubic autocatalysis: one tank just past the fold", () => {
    const result = designNetwork({ ...cubic([]), train: { candidates: [["CSTR"]] }, objective: { minimise: "volume" }, constraints: { minConversion: 0.9 } });
    // x = D (1 - x)(beta + x)^2; the low branch ends where D(x) has its local maximum: 2x^2 - x + beta = 0
    // (algebra, as in cstr-fold.test.ts); below that volume the lowest state stays under 90 %
    const xF = (1 - Math.sqrt(1 - 8 * beta)) / 4;
    const vF = (xF / ((1 - xF) * (beta + xF) ** 2) / (k1 * A0 * A0)) * v0;
    const c = result.candidates[0];
    expect(c.feasible).toBe(true);
    expect(rel(c.objective!, vF)).toBeLessThan(1e-6);
    expect(c.objective!).toBeGreaterThanOrEqual(vF * (1 - 1e-9));
    expect(c.conversion!).toBeGreaterThanOrEqual(0.9);
  });

  it("highest yield of B with B decaying (B -> C): the ignited state just past the fold", () => {
    const k3 = 5e-5; // mu = k3/(k1 C_A0^2) = 5e-3
    const mu = k3 / (k1 * A0 * A0);
    const result = designNetwork({
      ...cubic([{ stoichiometry: { B: -1, C: 1 }, rate: { law: "power", k: k3, orders: { B: 1 } } }]),
      train: { candidates: [["CSTR"]] },
      objective: { maximise: "yield", product: "B" },
      constraints: { maxTotalVolume: 1e5 },
    });
    // Balances (algebra): 1 - a = D a b^2 and b - beta = D a b^2 - mu D b give a = 1 + beta - b(1 + mu D) and
    // the cubic D(1 + mu D) b^3 - D(1 + beta) b^2 + (1 + mu D) b - beta = 0. The fold is where its
    // discriminant vanishes (three real roots below, one above); there the double root is
    // (9 c3 c0 - c2 c1)/(2 (c2^2 - 3 c3 c1)) and the third follows from the sum of the roots, -c2/c3 (Vieta).
    const coefficients = (D: number) => [D * (1 + mu * D), -D * (1 + beta), 1 + mu * D, -beta] as const;
    const discriminant = (D: number) => {
      const [a, b, c, d] = coefficients(D);
      return 18 * a * b * c * d - 4 * b ** 3 * d + b * b * c * c - 4 * a * c ** 3 - 27 * a * a * d * d;
    };
    // the last D of a log grid 1..1000 with three roots brackets the ignition fold
    let lo = 1;
    for (let D = 1; D < 1000; D *= 1.01) if (discriminant(D) > 0) lo = D;
    let hi = lo * 1.01;
    for (let k = 0; k < 200; k++) {
      const mid = 0.5 * (lo + hi);
      if (discriminant(mid) > 0) lo = mid;
      else hi = mid;
    }
    const [c3, c2, c1, c0] = coefficients(lo);
    const double = (9 * c3 * c0 - c2 * c1) / (2 * (c2 * c2 - 3 * c3 * c1));
    const ignited = -c2 / c3 - 2 * double;
    expect(double).toBeLessThan(ignited);
    const vF = (lo / (k1 * A0 * A0)) * v0;

    const c = result.candidates[0];
    expect(c.feasible).toBe(true);
    expect(rel(c.totalVolume!, vF)).toBeLessThan(1e-6);
    expect(rel(c.objective!, ignited - beta)).toBeLessThan(1e-6);
  });
});
