/**
 * The cautions shown wherever results are shown and on pinned designs: one wording for the
 * whole product. `thermalWarnings` adds the stronger notice for a large adiabatic rise or a
 * stage close to its temperature limit.
 */

export const CAUTION_TEXTS = [
  "Ideal reactors only: each CSTR perfectly mixed, each PFR in plug flow with no dispersion, at steady state.",
  "Heat removal, runaway, pressure relief and materials of construction are outside this model and need their own studies.",
  "These are preliminary sizes: check them under your local codes and have a licensed engineer review them before anything is built.",
] as const;

/** An adiabatic rise at or above this (K) earns the stronger warning. */
export const LARGE_ADIABATIC_RISE_K = 50;
/** A stage whose outlet is within this much (K) of the maximum temperature earns it too. */
export const NEAR_MAX_TEMPERATURE_K = 10;

interface ThermalInput {
  thermal?: { mode: string; adiabaticRise?: unknown; maxTemperature?: unknown } | null;
  /** Outlet temperatures of the stages shown, K. */
  stageTemperatures?: number[];
}

const num = (v: unknown): number | null => (typeof v === "number" && Number.isFinite(v) ? v : null);

/** The stronger warnings that apply, each one sentence. */
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

/**
 * The cautions box; `warnings` (from thermalWarnings) are shown first and stronger. A page shows
 * the general cautions once: parts inside a page that already has its box (a pinned design in the
 * project's list) pass `warningsOnly`, which shows their own thermal warnings and nothing else.
 */
export function Cautions({
  warnings = [],
  compact = false,
  warningsOnly = false,
  className = "",
}: {
  warnings?: string[];
  compact?: boolean;
  warningsOnly?: boolean;
  className?: string;
}) {
  if (warningsOnly && warnings.length === 0) return null;
  return (
    <aside aria-label="Cautions" className={`space-y-2 text-xs ${className}`} data-testid="cautions">
      {warnings.length ? (
        <div role="alert" className="rounded border border-red-300 bg-red-50 px-3 py-2 text-red-900">
          <p className="font-semibold">
            <span aria-hidden="true">⚠ </span>Thermal warning
          </p>
          <ul className="mt-1 list-disc space-y-0.5 pl-4">
            {warnings.map((w) => (
              <li key={w}>{w}</li>
            ))}
          </ul>
        </div>
      ) : null}
      {warningsOnly ? null : (
        <div className="rounded border border-amber-300 bg-amber-50 px-3 py-2 text-amber-950">
          <p className="font-semibold">Before you rely on this</p>
          {compact ? (
            <p className="mt-0.5">{CAUTION_TEXTS.join(" ")}</p>
          ) : (
            <ul className="mt-1 list-disc space-y-0.5 pl-4">
              {CAUTION_TEXTS.map((c) => (
                <li key={c}>{c}</li>
              ))}
            </ul>
          )}
        </div>
      )}
    </aside>
  );
}
