/**
 * Pure mappings from the API's answers for a train of several reactions to what the screens draw:
 * the objective's words, the outlet composition table, the concentration profiles and the
 * concentration path. The numbers arrive in SI (mol/m3, s, m3); these convert them to the units the
 * screen shows and nothing else, so a test can hold every cell against the stored outlets.
 */
import type { NetworkObjective, NetworkStageResult } from "@/lib/engine";
import type { LineSeries } from "@/components/charts/line-chart";
import { fromSI } from "@/lib/units/display";
import type { NetworkPaths, NetworkProfiles } from "./network-types";

/** The objective in the trade's words: "Highest yield of B", "Highest selectivity to B", "Least total volume". */
export function objectiveLabel(objective: NetworkObjective | null | undefined): string {
  if (!objective) return "—";
  if ("maximise" in objective) return objective.maximise === "yield" ? `Highest yield of ${objective.product}` : `Highest selectivity to ${objective.product}`;
  return "Least total volume";
}

/** Yield, selectivity or conversion as a percentage with one decimal (— when absent). */
export function percent(v: number | null | undefined, digits = 1): string {
  return typeof v === "number" && Number.isFinite(v) ? `${(100 * v).toFixed(digits)} %` : "—";
}

/** A stage's name as the tables and legends say it: "Stage 2 CSTR". */
export const stageName = (i: number, type: string) => `Stage ${i + 1} ${type}`;

/** Total residence time of a train, s: the sum of its stages' (each V/v0 with the feed's flow). */
export function trainResidenceTime(stages: readonly Pick<NetworkStageResult, "residenceTime">[]): number | null {
  if (!stages.length) return null;
  return stages.reduce((t, s) => t + s.residenceTime, 0);
}

/** An "on a bound" note from the engine ("stage 2: zero volume") with its first letter raised. */
export function boundNote(note: string): string {
  return note.charAt(0).toUpperCase() + note.slice(1);
}

export interface CompositionRow {
  /** "Feed" or "Stage 1 CSTR". */
  label: string;
  /** Concentration of each species in the shown unit, in the order of `species`. */
  values: (number | null)[];
  /** A tank with several steady states: how many, and the conversions of the others. */
  steadyStates?: { count: number; conversions: number[] };
}

/**
 * The outlet composition table: the feed, then each stage's outlet, one column per species, in
 * `unit` (a concentration unit of lib/units/display). The feed row is the first profile point (the
 * inlet of stage 1, the feed as the engine read it) when profiles are given.
 */
export function compositionRows(input: { species: string[]; stages: NetworkStageResult[]; feed?: Record<string, number> | null }, unit: string): CompositionRow[] {
  const shown = (v: number | undefined) => (typeof v === "number" && Number.isFinite(v) ? fromSI("concentration", v, unit) : null);
  const rows: CompositionRow[] = [];
  if (input.feed) rows.push({ label: "Feed", values: input.species.map((s) => shown(input.feed![s])) });
  input.stages.forEach((st, i) => {
    const several = st.steadyStates && st.steadyStates.length > 1 ? st.steadyStates : undefined;
    rows.push({
      label: stageName(i, st.type),
      values: input.species.map((s) => shown(st.outlet[s])),
      ...(several ? { steadyStates: { count: several.length, conversions: several.map((x) => x.conversion) } } : {}),
    });
  });
  return rows;
}

/** The feed's concentrations as the engine read them: the inlet of the first stage's profile. */
export function feedOf(profiles: NetworkProfiles | null | undefined): Record<string, number> | null {
  return profiles?.stages[0]?.points[0]?.concentrations ?? null;
}

/**
 * Concentration profiles: one series per species against cumulative residence time (in `timeUnit`),
 * through every stage in order. A tank's contents are uniform, so its species jump at the inlet to
 * the outlet composition and stay there across the tank's residence time.
 */
export function profileSeries(profiles: NetworkProfiles, concentrationUnit: string, timeUnit: string): LineSeries[] {
  return profiles.species.map((sp, j) => ({
    id: `profile-${sp}`,
    label: sp,
    tone: { stage: j },
    points: profiles.stages.flatMap((st) =>
      st.points.map((p) => ({ x: fromSI("time", p.residenceTime, timeUnit), y: fromSI("concentration", p.concentrations[sp] ?? 0, concentrationUnit) })),
    ),
  }));
}

/** The stage spans of the profiles chart, in `timeUnit`, for shading and labelling. */
export function stageSpans(profiles: NetworkProfiles, timeUnit: string): { from: number; to: number; label: string }[] {
  return profiles.stages.map((st, i) => ({ from: fromSI("time", st.startResidenceTime, timeUnit), to: fromSI("time", st.endResidenceTime, timeUnit), label: `${i + 1} ${st.type}` }));
}

/**
 * The concentration path: C_product against C_key. The single tube and the single stirred tanks of
 * every size from the feed are the reference lines; each stage of the train is its own segment (a
 * tube follows its profile, a tank goes straight from its inlet to its outlet, as its balance says),
 * so one sees where the train follows the tube's path and where it leaves it. Null without a product.
 */
export function pathSeries(paths: NetworkPaths, profiles: NetworkProfiles, concentrationUnit: string): LineSeries[] | null {
  const product = paths.product;
  if (!product) return null;
  const c = (v: number) => fromSI("concentration", v, concentrationUnit);
  const along = (pts: typeof paths.tube) => pts.filter((p) => p.product !== null).map((p) => ({ x: c(p.key), y: c(p.product!) }));
  const series: LineSeries[] = [{ id: "tube", label: "Single tube", tone: "reference", points: along(paths.tube) }];
  const states = [...new Set(paths.tanks.map((p) => p.steadyState ?? 0))].sort((a, b) => a - b);
  for (const s of states) {
    const pts = along(paths.tanks.filter((p) => (p.steadyState ?? 0) === s));
    series.push(
      s === 0
        ? { id: "tanks", label: "Single stirred tank", tone: "muted", points: pts }
        : { id: `tanks-${s}`, label: `Single stirred tank, steady state ${s + 1}`, tone: "muted", points: pts, line: false, markers: true },
    );
  }
  profiles.stages.forEach((st, i) => {
    const raw = st.type === "CSTR" ? [st.points[0], st.points[st.points.length - 1]].filter(Boolean) : st.points;
    series.push({
      id: `stage-${i}`,
      label: stageName(i, st.type),
      tone: { stage: i },
      markers: st.type === "CSTR",
      points: raw.map((p) => ({ x: c(p.concentrations[paths.key] ?? 0), y: c(p.concentrations[product] ?? 0) })),
    });
  });
  return series;
}
