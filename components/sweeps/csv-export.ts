import { commentText, SAFE_UNPARSE } from "@/lib/client/csv-safety";
import { fetchJson } from "@/lib/client/fetch-json";
import { fromCubicMetres, VOLUME_LABEL } from "@/lib/charts/volume-units";
import { describeOverrides } from "./scenario-picker";
import type { CandidatePage } from "./types";
import { candidateQuery, type SweepViewState } from "./view-state";

const EXPORT_PAGE = 500;

/**
 * The scenario's whole ranked list (with the current sort and filters) as CSV, fetched page by
 * page from the candidates endpoint; volumes in the chosen unit, one row per candidate.
 */
export async function exportCandidatesCsv(sweepId: string, view: SweepViewState, onProgress?: (loaded: number, total: number) => void): Promise<string> {
  const rows: Record<string, string | number>[] = [];
  const u = VOLUME_LABEL[view.unit];
  let overrides = "";
  for (let page = 1; ; page++) {
    const res = await fetchJson<CandidatePage>(`/api/sweeps/${sweepId}/scenarios/${view.scenario}/candidates?${candidateQuery(view, { page, pageSize: EXPORT_PAGE })}`);
    overrides = describeOverrides(res.scenario.overrides);
    for (const c of res.items) {
      rows.push({
        rank: c.rank,
        sequence: c.sequence.join("-"),
        stages: c.stageCount,
        feasible: c.feasible ? "yes" : "no",
        [`total volume (${u})`]: c.totalVolume === null ? "" : fromCubicMetres(c.totalVolume, view.unit),
        "total cost": c.totalCost ?? "",
        "installed cost": c.installedCost ?? "",
        "reused idle vessels": c.reused ?? 0,
        "P(meet target)": c.probabilityMeet ?? "",
        "ratio to single PFR": c.ratioToPfr ?? "",
        [`stage volumes (${u})`]: c.stages.map((s) => fromCubicMetres(s.volume, view.unit).toPrecision(6)).join(" | "),
        "stage outlet conversions": c.stages.map((s) => s.conversionOut.toPrecision(6)).join(" | "),
        reason: c.reason ?? "",
      });
    }
    onProgress?.(rows.length, res.total);
    if (res.items.length < EXPORT_PAGE || rows.length >= res.total) break;
  }
  // papaparse loads only when someone exports, not with the page.
  const { unparse } = await import("papaparse");
  const preface = `# scenario ${view.scenario + 1}: ${commentText(overrides)}; preliminary sizing from ideal-reactor models, check under local codes\n`;
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
