import { columnVisibilityFeature, createColumnHelper, rowSortingFeature, tableFeatures } from "@tanstack/react-table";
import type { CandidateRow } from "@/lib/services/views";
import { formatNumber, TABLE_NUMBERS } from "@/lib/format/numbers";

export const COST_COLUMN_TITLES = { installedCost: "Installed cost", allNewCost: "Installed, all new", reused: "Reused" } as const;

// The same features as the ranked table, so these columns fit its column list.
const helper = createColumnHelper<ReturnType<typeof tableFeatures<{ rowSortingFeature: typeof rowSortingFeature; columnVisibilityFeature: typeof columnVisibilityFeature }>>, CandidateRow>();

const costed = (c: CandidateRow) => c.installedCost !== null && c.installedCost !== undefined;

/** The ranked table's cost columns: installed cost, and the count of vessels reused from the inventory. */
export function costColumns() {
  return [
    helper.accessor("installedCost", {
      header: COST_COLUMN_TITLES.installedCost,
      cell: (i) => <span className="num">{formatNumber(i.getValue(), 4, TABLE_NUMBERS)}</span>,
    }),
    // With reuse the rank follows the installed cost above; the all-new figure shows what reuse saves.
    helper.accessor((c) => c.allNewCost ?? null, {
      id: "allNewCost",
      header: COST_COLUMN_TITLES.allNewCost,
      // Sorted in the database by its own columns only; the rank already follows the cost with reuse.
      enableSorting: false,
      cell: (i) => <span className="num">{i.getValue() === null ? "—" : formatNumber(i.getValue() as number, 4, TABLE_NUMBERS)}</span>,
    }),
    helper.accessor("reused", {
      header: COST_COLUMN_TITLES.reused,
      cell: (i) => <span className="num">{costed(i.row.original) ? (i.getValue() ?? 0) : "—"}</span>,
    }),
  ];
}
