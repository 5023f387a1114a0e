import { designTrains, EngineError, type DesignResult, type DesignSpec } from "@/lib/engine";
import { AppError } from "@/lib/errors";
import { labelFor } from "@/lib/schemas/field-labels";
import type { KineticsSpec } from "@/lib/schemas/sweeps";

/** Errors in what the user typed (as opposed to a request that cannot be met). */
const INPUT_CODES = new Set(["invalid-spec", "invalid-unit", "invalid-expression"]);

const escape = (s: string) => s.replace(/[.*+?^${}()|[\]\\]/g, "\\$&");

/**
 * What the engine said about one field, without the field's path or key, in words a person reads
 * after the field's label: "Stage 1 volume: "abc" is not a quantity with a unit, e.g. 2.5 m³".
 * The engine itself stays free of labels (it is also a command-line tool that speaks paths).
 */
export function engineMessageInWords(err: EngineError): string {
  const last = err.path.split(".").at(-1) ?? "";
  let m = err.message.replace(new RegExp(`^${escape(err.path)}:? ?`), "");
  const unreadable = /^cannot read "(.*)" as a quantity/.exec(m);
  if (err.code === "invalid-unit" && unreadable) return `"${unreadable[1]}" is not a quantity with a unit, e.g. 2.5 m³`;
  const range = /must be an integer within (-?\d+)\.\.(-?\d+)$/.exec(m);
  if (range) return `a whole number from ${range[1]} to ${range[2]}`;
  if (last && !/^\d+$/.test(last)) m = m.replace(new RegExp(`^${escape(last)} `), "");
  m = m
    .replace(/^must be a finite number$/, "enter a number")
    .replace(/within \(0, 1\)/g, "between 0 and 1 (not 0 or 1)")
    .replace(/within \(0, (\d+)\]/g, "above 0 and at most $1")
    .replace(/>= ?(-?[\d.]+)/g, "$1 or more")
    .replace(/> ?(-?[\d.]+)/g, "above $1")
    .replace(/\b(\d+)\.\.(\d+)\b/g, "$1 to $2");
  return m.charAt(0).toLowerCase() === m.charAt(0) ? m : m.charAt(0).toLowerCase() + m.slice(1);
}

/** An engine refusal as a 400 naming the field; `prefix` maps engine paths into the request body. */
export function toBadRequest(err: EngineError, prefix = ""): AppError {
  const field = prefix ? `${prefix}.${err.path}` : err.path;
  const words = engineMessageInWords(err);
  return new AppError("bad_request", `${labelFor(field)}: ${words}`, { fields: { [field]: [words] } });
}

/**
 * Checks a kinetics version the way the engine will read it (units, expressions, orders,
 * rate sign), without the target or train of any sweep: sizes one CSTR to a small conversion.
 */
export function checkKinetics(spec: KineticsSpec, prefix = "spec"): void {
  try {
    designTrains({ ...(spec as DesignSpec), target: { conversion: 0.01 }, train: { candidates: [["CSTR"]] } });
  } catch (err) {
    if (err instanceof EngineError && INPUT_CODES.has(err.code)) throw toBadRequest(err, prefix);
    if (!(err instanceof EngineError)) throw err;
    // infeasible/equilibrium at 1 % conversion says nothing about the kinetics being malformed
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
