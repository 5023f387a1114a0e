import type { SweepViewState } from "@/components/sweeps/view-state";

/** The server export of a scenario's whole ranked list, with the table's current sort and filters. */
export function candidateExportHref(sweepId: string, scenario: number, format: "csv" | "json", view?: Pick<SweepViewState, "sort" | "dir" | "feasible" | "contains" | "stages">): string {
  const q = new URLSearchParams({ format });
  if (view) {
    q.set("sort", view.sort);
    q.set("dir", view.dir);
    if (view.feasible) q.set("feasible", "true");
    if (view.contains) q.set("contains", view.contains);
    if (view.stages) q.set("stages", String(view.stages));
  }
  return `/api/sweeps/${sweepId}/scenarios/${scenario}/candidates/export?${q}`;
}
