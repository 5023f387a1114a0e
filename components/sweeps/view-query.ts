/**
 * The sweep page's view (scenario, sort, filters, page, columns, unit) as plain functions, with no
 * "use client": the server page reads the same state from the URL to render the first page, and
 * must ask for exactly the page (and the query key) the client would.
 */
import { isVolumeUnit, type VolumeUnit } from "@/lib/charts/volume-units";
import { SORT_KEYS, type SortKey } from "@/lib/sweeps/sort-keys";
import { WRITTEN_SEQUENCE } from "@/lib/stage-types";
import type { CandidatePage, ScenarioRow, SweepView } from "@/lib/services/views";

export const PAGE_SIZES = [25, 50, 100] as const;
/** Columns the reader may hide. */
export const OPTIONAL_COLUMNS = ["chart", "totalCost", "ratioToPfr", "stages", "feasible", "installedCost", "reused", "residenceTime", "onBound"] as const;
export type OptionalColumn = (typeof OPTIONAL_COLUMNS)[number];
/** The optional columns each kind of sweep has (a network sweep has no cost and no Levenspiel chart). */
export const SINGLE_COLUMNS: readonly OptionalColumn[] = ["chart", "totalCost", "ratioToPfr", "stages", "feasible", "installedCost", "reused"];
export const NETWORK_COLUMNS: readonly OptionalColumn[] = ["residenceTime", "onBound", "feasible"];

/** Everything a link to the sweep page carries: scenario, sort, filters, page, columns and units. */
export interface SweepViewState {
  scenario: number;
  sort: SortKey;
  dir: "asc" | "desc";
  feasible: boolean;
  contains: string;
  stages: number | null;
  page: number;
  pageSize: number;
  hidden: OptionalColumn[];
  /** A volume unit chosen on this page; null follows the user's display-unit setting. */
  unit: VolumeUnit | null;
}

const intOr = (v: string | null, fallback: number, min = 0) => {
  const n = Number(v);
  return v !== null && Number.isInteger(n) && n >= min ? n : fallback;
};

export function parseViewState(q: URLSearchParams): SweepViewState {
  const sort = q.get("sort");
  const size = intOr(q.get("size"), 25, 1);
  const stages = intOr(q.get("stages"), 0, 1);
  const contains = q.get("contains") ?? "";
  return {
    scenario: intOr(q.get("scenario"), 0),
    sort: (SORT_KEYS as readonly string[]).includes(sort ?? "") ? (sort as SortKey) : "rank",
    dir: q.get("dir") === "desc" ? "desc" : "asc",
    feasible: q.get("feasible") === "1",
    contains: WRITTEN_SEQUENCE.test(contains) ? contains : "",
    stages: stages >= 1 && stages <= 8 ? stages : null,
    page: intOr(q.get("page"), 1, 1),
    pageSize: (PAGE_SIZES as readonly number[]).includes(size) ? size : 25,
    hidden: (q.get("hide") ?? "").split(",").filter((c): c is OptionalColumn => (OPTIONAL_COLUMNS as readonly string[]).includes(c)),
    unit: isVolumeUnit(q.get("unit")) ? (q.get("unit") as VolumeUnit) : null,
  };
}

/** The state after a change: any change but paging itself starts again at page 1. */
export function applyViewPatch(state: SweepViewState, patch: Partial<SweepViewState>): SweepViewState {
  return { ...state, ...("page" in patch ? {} : { page: 1 }), ...patch };
}

/** The query string of a state, leaving out defaults so links stay short. */
export function serialiseViewState(s: SweepViewState): string {
  const q = new URLSearchParams();
  if (s.scenario) q.set("scenario", String(s.scenario));
  if (s.sort !== "rank") q.set("sort", s.sort);
  if (s.dir !== "asc") q.set("dir", s.dir);
  if (s.feasible) q.set("feasible", "1");
  if (s.contains) q.set("contains", s.contains);
  if (s.stages) q.set("stages", String(s.stages));
  if (s.page > 1) q.set("page", String(s.page));
  if (s.pageSize !== 25) q.set("size", String(s.pageSize));
  if (s.hidden.length) q.set("hide", s.hidden.join(","));
  if (s.unit) q.set("unit", s.unit);
  return q.toString();
}

/** The candidates endpoint's query for a state. */
export function candidateQuery(s: SweepViewState, overrides: { page?: number; pageSize?: number; levenspiel?: boolean } = {}): string {
  const q = new URLSearchParams({ sort: s.sort, dir: s.dir, page: String(overrides.page ?? s.page), pageSize: String(overrides.pageSize ?? s.pageSize) });
  if (s.feasible) q.set("feasible", "true");
  if (s.contains) q.set("contains", s.contains);
  if (s.stages) q.set("stages", String(s.stages));
  // The ranked table draws small charts: thinned plot points are all it needs.
  if (overrides.levenspiel) q.set("include", "thumbnails");
  return q.toString();
}

/** Whether the Levenspiel thumbnails ride along with the page (small pages only; a network has none). */
export function chartsRideAlong(s: SweepViewState, network: boolean): boolean {
  return !network && s.pageSize <= 50 && !s.hidden.includes("chart");
}

/** The TanStack Query key of one page of candidates: the server's first page is seeded under it. */
export function candidatesKey(sweepId: string, s: SweepViewState, network: boolean) {
  return ["candidates", sweepId, s.scenario, candidateQuery(s, { levenspiel: chartsRideAlong(s, network) })] as const;
}

/** What the server read for the sweep page's first paint (the page's first-page.ts fills it). */
export interface FirstPage {
  sweep: SweepView;
  scenarios?: ScenarioRow[];
  /** The first table page and the query key it answers (the client seeds its cache under that key only). */
  candidates?: { key: readonly unknown[]; page: CandidatePage };
}
