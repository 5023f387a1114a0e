import type { NetworkReaction, NetworkSpec } from "../../../../lib/engine/network/types";

/** Relative difference. */
export function rel(a: number, b: number): number {
  return Math.abs(a - b) / Math.max(Math.abs(b), 1e-300);
}

/** A first-order step from one species to another: from -> to at rate k C_from. */
export function firstOrder(from: string, to: string, k: number): NetworkReaction {
  return { stoichiometry: { [from]: -1, [to]: 1 }, rate: { law: "power", k, orders: { [from]: 1 } } };
}

/** A liquid network fed at v0 (m3/s) with the given concentrations (mol/m3). */
export function liquid(concentrations: Record<string, number>, reactions: NetworkReaction[], keyReactant = "A", v0 = 1e-3): NetworkSpec {
  return { feed: { volumetricFlow: v0, concentrations }, phase: "liquid", reactions, keyReactant };
}
