/**
 * The product's cautions, in one wording for every place that shows a result: the engine's output
 * (API and command line), the screens' cautions box, the design report and its PDF, the CSV files.
 * Plain data and one pure function, so client components import them from the engine's entry without
 * pulling the numerical core into the browser (the bundler keeps only what is used; checked with
 * `npm run build`).
 */

/** What every result must be read with: the idealised models and what they leave out. */
export const CAUTIONS: readonly string[] = [
  "Ideal reactors only: each CSTR perfectly mixed, each PFR in plug flow with no dispersion, at steady state.",
  "Heat removal, runaway, pressure relief and materials of construction are outside this model and need their own studies.",
  "These are preliminary sizes: check them under your local codes and have a licensed engineer review them before anything is built.",
];

/**
 * What the sizing takes for granted beyond the cautions, for the report's assumptions section
 * (the cautions themselves are boxed once, so they are not repeated here).
 */
export const MODEL_ASSUMPTIONS: readonly string[] = [
  "One reaction, followed through the conversion of A.",
  "Rates, heats of reaction and physical properties are taken as given; the results are only as good as they are.",
];

/** An adiabatic rise at or above this (K) earns the stronger warning. */
const LARGE_ADIABATIC_RISE_K = 50;
/** A stage whose outlet is within this much (K) of the maximum temperature earns it too. */
const NEAR_MAX_TEMPERATURE_K = 10;

interface ThermalInput {
  thermal?: { mode: string; adiabaticRise?: unknown; maxTemperature?: unknown } | null;
  /** Outlet temperatures of the stages shown, K. */
  stageTemperatures?: number[];
}

const num = (v: unknown): number | null => (typeof v === "number" && Number.isFinite(v) ? v : null);

/** The stronger warnings that apply to an adiabatic train, each one sentence; none otherwise. */
export function thermalWarnings({ thermal, stageTemperatures = [] }: ThermalInput): string[] {
  if (!thermal || thermal.mode !== "adiabatic") return [];
  const out: string[] = [];
  const rise = num(thermal.adiabaticRise);
  if (rise !== null && Math.abs(rise) >= LARGE_ADIABATIC_RISE_K) {
    out.push(
      `Adiabatic rise of ${Math.round(Math.abs(rise))} K: a loss of cooling or of feed control can run away. Study heat removal and relief before relying on these sizes.`,
    );
  }
  const max = num(thermal.maxTemperature);
  if (max !== null) {
    const hottest = Math.max(...stageTemperatures.filter(Number.isFinite), -Infinity);
    if (hottest > max - NEAR_MAX_TEMPERATURE_K && Number.isFinite(hottest)) {
      out.push(`A stage reaches ${hottest.toFixed(1)} K, within ${NEAR_MAX_TEMPERATURE_K} K of the ${max.toFixed(1)} K limit: there is little margin for upsets.`);
    }
  }
  return out;
}
