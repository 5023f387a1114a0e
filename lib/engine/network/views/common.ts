import { EngineError, ensure } from "../../errors";
import { makeKinetics, type Kinetics } from "../kinetics";
import { resolveNetwork } from "../resolve";
import type { NetworkSpec } from "../types";
import type { ViewStage } from "./types";

/** The chemistry resolved once for a view; errors name the chemistry's field (resolveNetwork). */
export function kineticsFor(chemistry: NetworkSpec): Kinetics {
  return makeKinetics(resolveNetwork(chemistry));
}

/** Index of the wanted product, or -1 without one. @throws EngineError at "product" when it is not a species of the feed. */
export function productIndex(kin: Kinetics, product: string | undefined): number {
  if (product === undefined) return -1;
  const p = kin.net.index.get(product);
  if (p === undefined) throw new EngineError("invalid-spec", `the wanted product "${product}" is not in the feed; list it there (0 allowed)`, "product");
  return p;
}

/** Concentrations of every species (mol/m3) of a stream of flows F at temperature T. */
export function concentrationRecord(kin: Kinetics, F: ArrayLike<number>, T: number): Record<string, number> {
  const C = new Float64Array(kin.net.nSpecies);
  kin.concentrations(Float64Array.from(F), T, C);
  const out: Record<string, number> = {};
  kin.net.species.forEach((s, i) => {
    out[s] = C[i];
  });
  return out;
}

/** A given stage checked, with its temperature: its own when given, else the feed's. */
export function checkedStage(kin: Kinetics, stage: ViewStage, s: number): { type: ViewStage["type"]; volume: number; temperature: number } {
  ensure(stage.type === "CSTR" || stage.type === "PFR", 'a stage is a "CSTR" or a "PFR"', `stages.${s}.type`);
  ensure(Number.isFinite(stage.volume) && stage.volume >= 0, "a stage volume must be zero or more", `stages.${s}.volume`);
  const temperature = stage.temperature ?? kin.net.T0;
  ensure(Number.isFinite(temperature) && temperature > 0, "a stage temperature must be above absolute zero", `stages.${s}.temperature`);
  return { type: stage.type, volume: stage.volume, temperature };
}
