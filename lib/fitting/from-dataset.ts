import type { RateLawSpec } from "../engine/types";
import { fitRateModel, type RateFit, type RateModelKind, type RatePoint } from "./rate-models";

/** A stored dataset row, SI: conversion (-), concentrations mol/m3, temperature K, rate mol/(m3 s). */
export type DatasetRow = { conversion?: number; concA?: number; concR?: number; temperature?: number; rate: number };

const PARAMETER_UNITS: Record<string, string> = {
  k: "(mol/m³)^(1−n)/s",
  k_ref: "(mol/m³)^(1−n)/s",
  n: "—",
  kf: "1/s",
  kr: "1/s",
  vmax: "mol/(m³·s)",
  km: "mol/m³",
  ki: "mol/m³",
  Ea: "J/mol",
};

/** The criterion as reported beside every AIC figure. */
export const AIC_CRITERION =
  "AIC (Akaike 1974), least-squares form n·ln(RSS/n) + 2(p + 1), counting the error variance as a parameter; lower is better, only differences between laws fitted to the same points matter.";

export interface PreparedPoints {
  points: RatePoint[];
  /** Statements of what was derived rather than measured. */
  assumptions: string[];
  /** Why C_R is unknown for a point, if it is (the reversible law then reports an error). */
  concRMissing: string | null;
}

export class MissingFeedConcentration extends Error {}

const has = (v: unknown): v is number => typeof v === "number" && Number.isFinite(v);

/**
 * Turns stored rows into fit points. Rows holding conversion only need C_A0:
 * C_A = C_A0(1 − X) (liquid phase, constant density); the product of a reversible law, when
 * not measured, is taken as C_R = C_A0·X (one R per A, no R in the feed).
 */
export function preparePoints(rows: DatasetRow[], feedConcA: number | null): PreparedPoints {
  const assumptions: string[] = [];
  let derivedA = false;
  let derivedR = false;
  let concRMissing: string | null = null;
  const points = rows.map((row) => {
    let concA = row.concA;
    if (!has(concA)) {
      if (!has(row.conversion)) throw new MissingFeedConcentration("a row has neither concentration of A nor conversion");
      if (!(feedConcA && feedConcA > 0)) throw new MissingFeedConcentration("the rows hold conversion only");
      concA = feedConcA * (1 - row.conversion);
      derivedA = true;
    }
    let concR = row.concR;
    if (!has(concR)) {
      const x = has(row.conversion) ? row.conversion : feedConcA && feedConcA > 0 ? 1 - concA / feedConcA : undefined;
      if (x !== undefined && feedConcA && feedConcA > 0) {
        concR = feedConcA * x;
        derivedR = true;
      } else {
        concR = undefined;
        concRMissing = "needs the product concentration: a concR column, or a conversion column with the feed concentration C_A0";
      }
    }
    return { concA, rate: row.rate, ...(concR !== undefined ? { concR } : {}), ...(has(row.temperature) ? { temperature: row.temperature } : {}) };
  });
  if (derivedA) assumptions.push(`C_A = C_A0·(1 − X) with C_A0 = ${fmt(feedConcA!)} mol/m³: liquid phase at constant density.`);
  if (derivedR) assumptions.push(`For the reversible law C_R = C_A0·X: one mole of R per mole of A converted and no R in the feed (C_A0 = ${fmt(feedConcA!)} mol/m³).`);
  return { points, assumptions, concRMissing };
}

const fmt = (v: number) => Number(v.toPrecision(6)).toString();

function span(values: (number | undefined)[]): [number, number] | null {
  const v = values.filter(has);
  return v.length ? [Math.min(...v), Math.max(...v)] : null;
}

/** The measured range: a fitted law is only valid inside it. */
export function dataRange(rows: DatasetRow[], points: RatePoint[], feedConcA: number | null) {
  const conversion = span(rows.map((r, i) => (has(r.conversion) ? r.conversion : feedConcA ? 1 - points[i].concA / feedConcA : undefined)));
  return {
    points: rows.length,
    conversion,
    concA: span(points.map((p) => p.concA)),
    concR: span(points.map((p) => p.concR)),
    temperature: span(points.map((p) => p.temperature)),
    rate: span(points.map((p) => p.rate)) ?? ([0, 0] as [number, number]),
  };
}

/** AIC = n ln(RSS/n) + 2(p+1); null when RSS is 0 (noise-free data), where it is −∞. */
export function akaike(rss: number, n: number, p: number): number | null {
  const v = n * Math.log(rss / n) + 2 * (p + 1);
  return Number.isFinite(v) ? v : null;
}

/** Why a law cannot be fitted to these points, before trying; null when it can be tried. */
function refusal(law: RateModelKind, points: RatePoint[], concRMissing: string | null): string | null {
  const params = { power: 2, reversible: 2, saturation: 2, "saturation-inhibition": 3, "power-arrhenius": 3 }[law];
  if (points.length <= params) return `needs more points (${points.length}) than parameters (${params})`;
  if (law === "reversible" && points.some((p) => p.concR === undefined)) return concRMissing ?? "needs the product concentration of every point";
  if (law === "power-arrhenius") {
    const temps = new Set(points.map((p) => p.temperature).filter(has));
    if (points.some((p) => !has(p.temperature)) || temps.size < 2) return "needs a temperature column with at least two temperatures";
  }
  return null;
}

export type LawResult = { law: RateModelKind; ok: true; fit: RateFit } | { law: RateModelKind; ok: false; error: string };

/** Fits one law, turning every refusal of the data (or the numerics) into a message. */
export function tryFit(law: RateModelKind, prepared: PreparedPoints): LawResult {
  const why = refusal(law, prepared.points, prepared.concRMissing);
  if (why) return { law, ok: false, error: why };
  try {
    const fit = fitRateModel(law, prepared.points);
    const finite = fit.parameters.every((p) => Number.isFinite(p.value) && Number.isFinite(p.standardError)) && Number.isFinite(fit.residualSumOfSquares);
    if (!finite) return { law, ok: false, error: "the fit did not settle on finite parameters: the data do not support this law" };
    return { law, ok: true, fit };
  } catch (err) {
    const message = err instanceof Error ? err.message : String(err);
    // ml-matrix reports a singular system in its own words; say what it means for the fit.
    if (/singular/i.test(message)) return { law, ok: false, error: "the data do not determine this law's parameters (the fit's normal equations are singular): the data do not support this law" };
    return { law, ok: false, error: message };
  }
}

/** The fit as the API returns it (and, without parity and residuals, as a kinetics source stores it). */
export function fitSummary(fit: RateFit) {
  const n = fit.predicted.length;
  return {
    formula: fit.formula,
    parameters: fit.parameters.map((p) => ({ name: p.name, value: p.value, standardError: p.standardError, interval95: p.interval95, unit: PARAMETER_UNITS[p.name] ?? "" })),
    ...(fit.referenceTemperature !== undefined ? { referenceTemperature: fit.referenceTemperature } : {}),
    rss: fit.residualSumOfSquares,
    rSquared: fit.rSquared,
    points: n,
    degreesOfFreedom: fit.degreesOfFreedom,
    aic: akaike(fit.residualSumOfSquares, n, fit.parameters.length),
    status: fit.status,
  };
}

/**
 * The engine's rate law for a fitted law, in SI numbers. The reversible law's reverse term
 * reads C_R, so the reaction's stoichiometry must hold R.
 */
export function toEngineLaw(fit: RateFit): RateLawSpec {
  const v = Object.fromEntries(fit.parameters.map((p) => [p.name, p.value]));
  switch (fit.kind) {
    case "power":
      return { law: "power", k: v.k, orders: { A: v.n } };
    case "reversible":
      return { law: "power", k: v.kf, orders: { A: 1 }, reverse: { k: v.kr, orders: { R: 1 } } };
    case "saturation":
      return { law: "saturation", vmax: v.vmax, km: v.km };
    case "saturation-inhibition":
      return { law: "saturation", vmax: v.vmax, km: v.km, ki: v.ki };
    case "power-arrhenius":
      return { law: "power", k: v.k_ref, orders: { A: v.n }, activationEnergy: v.Ea, referenceTemperature: fit.referenceTemperature! };
  }
}
