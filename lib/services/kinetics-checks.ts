import { designNetwork, designTrains, EngineError, type DesignResult, type DesignSpec } from "@/lib/engine";
import { isNetworkSpec, type NetworkKineticsSpec } from "@/lib/schemas/network-spec";
import type { AnyKineticsSpec, KineticsSpec } from "@/lib/schemas/sweeps";
import { toBadRequest } from "./engine-errors";

/** Errors in what the user typed (as opposed to a request that cannot be met). */
const INPUT_CODES = new Set(["invalid-spec", "invalid-unit", "invalid-expression"]);

/**
 * Checks a kinetics version the way the engine will read it (units, expressions, orders,
 * rate sign), without the target or train of any sweep: sizes one CSTR to a small conversion.
 */
export function checkKinetics(spec: AnyKineticsSpec, prefix = "spec"): void {
  if (isNetworkSpec(spec)) return checkNetworkKinetics(spec as NetworkKineticsSpec, prefix);
  try {
    designTrains({ ...(spec as DesignSpec), target: { conversion: 0.01 }, train: { candidates: [["CSTR"]] } });
  } catch (err) {
    if (err instanceof EngineError && INPUT_CODES.has(err.code)) throw toBadRequest(err, prefix);
    if (!(err instanceof EngineError)) throw err;
    // infeasible/equilibrium at 1 % conversion says nothing about the kinetics being malformed
  }
}

/**
 * The same for a model of several reactions: the engine reads the chemistry (units, expressions, species,
 * key reactant, wanted product) and sizes one stirred tank to 1 % conversion, which is cheap; a network
 * that cannot reach it (an equilibrium below 1 %) is not malformed, so only input errors are refused.
 */
function checkNetworkKinetics(spec: NetworkKineticsSpec, prefix: string): void {
  const { shownUnits: _units, product, ...chemistry } = spec;
  try {
    designNetwork({
      ...chemistry,
      thermal: { mode: "isothermal" },
      train: { candidates: [["CSTR"]] },
      objective: { minimise: "volume", ...(product !== undefined ? { product } : {}) },
      constraints: { minConversion: 0.01 },
    });
  } catch (err) {
    if (!(err instanceof EngineError)) throw err;
    // The objective's product is the model's wanted product.
    if (INPUT_CODES.has(err.code)) throw toBadRequest(err.path === "objective.product" ? new EngineError(err.code, err.message, "product") : err, prefix);
  }
}

export interface KineticsPreview {
  /** FA0/(-rA) against X from the feed to the drawn conversion, m3: [[X, FA0/(-rA)], ...]. */
  curve: [number, number][];
  targetConversion: number;
  equilibriumConversion: number | null;
  reference: { singleCSTR: number | null; singlePFR: number | null };
  /** The single-CSTR rectangle and single-PFR area, as closed outlines on the same axes. */
  cstrOutline: [number, number][];
  pfrOutline: [number, number][];
  cautions: string[];
}

/**
 * The Levenspiel curve of a draft kinetics spec and its single-stage references, for the live
 * chart: one CSTR and one PFR sized from the feed to the target (default 0.9, or 95 % of the
 * equilibrium conversion when that is lower).
 */
export function previewKinetics(spec: KineticsSpec, targetConversion?: number): KineticsPreview {
  const run = (conversion: number): DesignResult =>
    designTrains({ ...(spec as DesignSpec), target: { conversion }, train: { candidates: [["CSTR"], ["PFR"]] } });
  let result: DesignResult;
  let target = targetConversion ?? 0.9;
  try {
    result = run(target);
  } catch (err) {
    if (!(err instanceof EngineError)) throw err;
    if (err.code === "equilibrium" && targetConversion === undefined) {
      const eq = Number(/([0-9.]+)/.exec(err.message.split("equilibrium")[1] ?? "")?.[1]);
      if (!(eq > 0 && eq < 1)) throw toBadRequest(err, "spec");
      target = 0.95 * eq;
      result = run(target);
    } else {
      throw toBadRequest(err, err.path.startsWith("target") ? "" : "spec");
    }
  }
  const cstr = result.candidates.find((c) => c.sequence.length === 1 && c.sequence[0] === "CSTR");
  const pfr = result.candidates.find((c) => c.sequence.length === 1 && c.sequence[0] === "PFR");
  const pfrStage = pfr?.stages[0];
  return {
    curve: pfrStage?.levenspiel.curve ?? cstr?.stages[0]?.levenspiel.curve ?? [],
    targetConversion: target,
    equilibriumConversion: result.equilibriumConversion ?? null,
    reference: result.reference,
    cstrOutline: cstr?.stages[0]?.levenspiel.area ?? [],
    pfrOutline: pfrStage?.levenspiel.area ?? [],
    cautions: result.cautions,
  };
}
