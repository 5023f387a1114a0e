import { commentText, SAFE_UNPARSE } from "@/lib/client/csv-safety";
import { fetchJson } from "@/lib/client/fetch-json";
import { fromCubicMetres, VOLUME_LABEL, type VolumeUnit } from "@/lib/charts/volume-units";
import { describeOverrides } from "./scenario-picker";
import type { CandidatePage } from "@/lib/services/views";
import { candidateQuery, type SweepViewState } from "./view-state";
import { RECYCLE_CAUTION } from "@/lib/stage-types";

const EXPORT_PAGE = 500;

/**
 * Significant digits of every number in the export: 6 is finer than any input a sizing study
 * starts from (kinetics and feed are rarely known to better than 3), and it keeps binary noise
 * such as 0.37500000000000006 out of the cells. Ranks, counts and flags are whole and stay so.
 */
export const CSV_DIGITS = 6;
export const csvNumber = (v: number | null | undefined): number | "" => (v === null || v === undefined || !Number.isFinite(v) ? "" : Number(v.toPrecision(CSV_DIGITS)));

/**
 * The scenario's whole ranked list (with the current sort and filters) as CSV, fetched page by
 * page from the candidates endpoint; volumes in the chosen unit, one row per candidate.
 */
export async function exportCandidatesCsv(
  sweepId: string,
  view: SweepViewState,
  opts: { shownUnit: VolumeUnit | null },
  onProgress?: (loaded: number, total: number) => void,
): Promise<string> {
  const rows: Record<string, string | number>[] = [];
  const shown = opts.shownUnit && opts.shownUnit !== "m3" ? opts.shownUnit : null;
  const u = shown ? VOLUME_LABEL[shown] : "";
  let overrides = "";
  let anyRecycle = false;
  for (let page = 1; ; page++) {
    const res = await fetchJson<CandidatePage>(`/api/sweeps/${sweepId}/scenarios/${view.scenario}/candidates?${candidateQuery(view, { page, pageSize: EXPORT_PAGE })}`);
    overrides = describeOverrides(res.scenario.overrides);
    for (const c of res.items) {
      const recycle = c.sequence.includes("PFR-recycle");
      anyRecycle ||= recycle;
      rows.push({
        rank: c.rank,
        sequence: c.sequence.join("-"),
        stages: c.stageCount,
        feasible: c.feasible ? "yes" : "no",
        // SI columns always, with the unit in the header; the shown-unit columns only when asked.
        "total volume (m³)": csvNumber(c.totalVolume),
        ...(shown ? { [`total volume (${u})`]: c.totalVolume === null ? "" : csvNumber(fromCubicMetres(c.totalVolume, shown)) } : {}),
        "total cost": csvNumber(c.totalCost),
        "installed cost": csvNumber(c.installedCost),
        "reused idle vessels": c.reused ?? 0,
        "P(meet target)": csvNumber(c.probabilityMeet),
        "ratio to single PFR": csvNumber(c.ratioToPfr),
        "stage volumes (m³)": c.stages.map((s) => csvNumber(s.volume)).join(" | "),
        ...(shown ? { [`stage volumes (${u})`]: c.stages.map((s) => csvNumber(fromCubicMetres(s.volume, shown))).join(" | ") } : {}),
        "stage outlet conversions": c.stages.map((s) => csvNumber(s.conversionOut)).join(" | "),
        // Blank for a stage that is not a tube with recycle; the column is dropped below when no train has one.
        "stage recycle ratios": c.stages.map((s) => (s.type === "PFR-recycle" ? csvNumber((s as { recycleRatio?: number }).recycleRatio) : "")).join(" | "),
        reason: c.reason ?? "",
      });
    }
    onProgress?.(rows.length, res.total);
    if (res.items.length < EXPORT_PAGE || rows.length >= res.total) break;
  }
  // papaparse loads only when someone exports, not with the page.
  const { unparse } = await import("papaparse");
  if (!anyRecycle) for (const r of rows) delete r["stage recycle ratios"];
  const recycleCaution = anyRecycle ? `; ${RECYCLE_CAUTION}` : "";
  const preface = `# scenario ${view.scenario + 1}: ${commentText(overrides)}; preliminary sizing from ideal-reactor models, check under local codes${commentText(recycleCaution)}; numbers to ${CSV_DIGITS} significant digits\n`;
  return preface + unparse(rows, SAFE_UNPARSE);
}

export function downloadText(filename: string, text: string) {
  const url = URL.createObjectURL(new Blob([text], { type: "text/csv;charset=utf-8" }));
  const a = document.createElement("a");
  a.href = url;
  a.download = filename;
  document.body.append(a);
  a.click();
  a.remove();
  setTimeout(() => URL.revokeObjectURL(url), 1000);
}
