import type { TableLawSpec } from "@/lib/engine";
import { AppError } from "@/lib/errors";

export interface StoredRateRow {
  conversion?: number;
  concA?: number;
  concR?: number;
  temperature?: number;
  rate: number;
}

const bad = (field: string, message: string) => new AppError("bad_request", message, { fields: { [field]: [message] } });
const kelvin = (t: number) => `${Number(t.toFixed(2))} K`;

/** Temperatures closer than this are one temperature (rounding of °C or °F to K). */
const SAME_TEMPERATURE_K = 0.05;

/**
 * A dataset version's rows as the engine's measured-rate table: rows at one temperature
 * (the feed's, when the data span several), conversion from each row or, for rows that give
 * the concentration of A only, X = 1 − C_A/C_A0 (constant density, so liquid phase only),
 * sorted, starting at the feed (X = 0) as the engine requires. Refusals name the input field.
 */
export function tableLawFromRows(
  rows: StoredRateRow[],
  opts: { feedConcA: number; temperature?: number; phase: "liquid" | "gas" },
): { law: TableLawSpec; temperature: number | undefined } {
  const temps = [...new Set(rows.map((r) => r.temperature).filter((t): t is number => t !== undefined))].sort((a, b) => a - b);
  const distinct = temps.filter((t, i) => i === 0 || t - temps[i - 1] > SAME_TEMPERATURE_K);
  let picked = rows;
  let temperature = opts.temperature;
  if (distinct.length > 1 || (distinct.length === 1 && temperature !== undefined)) {
    if (temperature === undefined) throw bad("feed.temperature", `The data were measured at ${distinct.map(kelvin).join(", ")}; a rate table holds at one temperature: give the feed temperature to pick those rows`);
    picked = rows.filter((r) => r.temperature !== undefined && Math.abs(r.temperature - temperature!) <= SAME_TEMPERATURE_K);
    if (!picked.length) throw bad("feed.temperature", `No rows at ${kelvin(temperature)}; the data were measured at ${distinct.map(kelvin).join(", ")}`);
  } else if (distinct.length === 1) temperature = distinct[0];

  if (opts.phase === "gas" && picked.some((r) => r.conversion === undefined)) {
    throw bad("phase", "Rows that give the concentration of A convert to conversion only at constant density: use the liquid phase, or upload conversions");
  }
  const points = picked.map((r) => {
    const x = r.conversion ?? 1 - r.concA! / opts.feedConcA;
    if (!(x >= 0 && x < 1)) throw bad("feed.concA", `A row has C_A = ${r.concA} mol/m³, above the feed concentration ${opts.feedConcA} mol/m³ (conversion would be negative)`);
    return { x, rate: r.rate };
  });
  points.sort((a, b) => a.x - b.x);
  for (let i = 1; i < points.length; i++) {
    if (points[i].x - points[i - 1].x < 1e-12) throw bad("datasetVersion", `Two rows give the same conversion ${Number(points[i].x.toPrecision(6))}; a rate table needs one rate per conversion`);
  }
  if (points.length < 2) throw bad("datasetVersion", "A rate table needs at least two rows");
  if (points[0].x > 1e-9) throw bad("datasetVersion", `The table must start at the feed (X = 0); its lowest conversion is ${Number(points[0].x.toPrecision(4))}. Upload a version with a row at the feed`);
  points[0].x = 0;
  return { law: { law: "table", conversion: points.map((p) => p.x), rate: points.map((p) => p.rate) }, temperature };
}
