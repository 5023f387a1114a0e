import type { CostBasis } from "@/lib/schemas/costs";
import { r10Sizes } from "./preferred-sizes";

/**
 * The cost basis a project starts from until someone saves its own. Every number is recalled,
 * not looked up, and says so beside itself on the screen: the user should replace them with a
 * current quote or their company's correlations.
 */
export function defaultCostBasis(): CostBasis {
  return {
    vessels: {
      // From memory: a published purchase-cost correlation for jacketed, agitated carbon-steel
      // vessels (S = volume in m3, valid roughly 0.5–100 m3), US Gulf Coast basis, 2010.
      CSTR: { a: 61500, b: 32500, n: 0.8, source: "from memory: jacketed agitated vessel, carbon steel, US Gulf Coast 2010" },
      // From memory: a pressure-vessel-like correlation for a tubular reactor; the exponent near
      // 0.6 is common practice for vessels (the "six-tenths rule").
      PFR: { a: 11600, b: 34000, n: 0.6, source: "from memory: tubular vessel, carbon steel, US Gulf Coast 2010; n ≈ 0.6 is common practice" },
    },
    currency: "USD",
    basisYear: 2010,
    sizes: { mode: "r10", min: 0.5, max: 100 },
    maxVesselVolume: 50,
    // From memory: installation factors of about 3–5 for process vessels are common practice.
    installationFactor: { value: 4, source: "from memory: typical installation factor for process vessels (3–5)" },
  };
}

/** The standard sizes (m3, ascending) a cost basis allows, or null for any size. */
export function standardSizesOf(basis: Pick<CostBasis, "sizes">): number[] | null {
  const s = basis.sizes;
  if (s.mode === "any") return null;
  if (s.mode === "custom") return [...new Set(s.values)].sort((p, q) => p - q);
  return r10Sizes(s.min, s.max);
}

/** The sweep objective a cost basis gives: the engine's cost objective (purchase cost, not installed). */
export function costObjectiveOf(basis: CostBasis) {
  const sizes = standardSizesOf(basis);
  const { CSTR, PFR } = basis.vessels;
  return {
    minimise: "cost" as const,
    vessels: { CSTR: { a: CSTR.a, b: CSTR.b, n: CSTR.n }, PFR: { a: PFR.a, b: PFR.b, n: PFR.n } },
    ...(sizes ? { standardSizes: sizes } : {}),
    ...(basis.maxVesselVolume !== null ? { maxVesselVolume: basis.maxVesselVolume } : {}),
  };
}

/** Installed cost of equipment bought new: purchase cost times the installation factor. */
export function installedCost(purchaseCost: number, installationFactor: number): number {
  return purchaseCost * installationFactor;
}
