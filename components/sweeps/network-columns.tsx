import { columnVisibilityFeature, createColumnHelper, rowSortingFeature, tableFeatures } from "@tanstack/react-table";
import type { CandidateRow } from "@/lib/services/views";
import type { NetworkStageResult } from "@/lib/engine";
import { formatNumber, TABLE_NUMBERS } from "@/lib/format/numbers";
import { fromCubicMetres, VOLUME_LABEL, type VolumeUnit } from "@/lib/charts/volume-units";
import { fromSI, unitLabel } from "@/lib/units/display";
import { boundNote, percent, trainResidenceTime } from "@/components/candidates/network-results-data";
import type { NetworkRowFields } from "@/components/candidates/network-types";

// The same features as the ranked table, so these columns fit its column list.
const helper = createColumnHelper<ReturnType<typeof tableFeatures<{ rowSortingFeature: typeof rowSortingFeature; columnVisibilityFeature: typeof columnVisibilityFeature }>>, CandidateRow>();

/** A row of a network sweep: the one-reaction row's fields with the network's measures beside them. */
const net = (r: CandidateRow) => r as CandidateRow & NetworkRowFields;
const stagesOf = (r: CandidateRow) => r.stages as unknown as NetworkStageResult[];

/** Titles of the network columns, for the column picker. */
export const NETWORK_COLUMN_TITLES = { yield: "Yield", selectivity: "Selectivity", conversion: "Conversion", residenceTime: "Residence time", onBound: "On a limit" } as const;

/**
 * The ranked table's measures for a sweep of several reactions: yield and selectivity of the wanted
 * product, conversion of the key reactant, total volume, residence time and where the optimum sits on
 * a limit. No cost columns and no Levenspiel thumbnails: neither means anything for a network.
 */
export function networkColumns({ product, unit, timeUnit }: { product: string | null; unit: VolumeUnit; timeUnit: string }) {
  const pct = (v: unknown) => <span className="num">{percent(typeof v === "number" ? v : null)}</span>;
  return [
    ...(product
      ? [
          helper.accessor((r) => net(r).yield ?? null, { id: "yield", header: `Yield of ${product}`, cell: (i) => pct(i.getValue()) }),
          helper.accessor((r) => net(r).selectivity ?? null, { id: "selectivity", header: `Selectivity to ${product}`, cell: (i) => pct(i.getValue()) }),
        ]
      : []),
    helper.accessor((r) => net(r).conversion ?? null, { id: "conversion", header: "Conversion", cell: (i) => pct(i.getValue()) }),
    helper.accessor("totalVolume", {
      header: `Total volume, ${VOLUME_LABEL[unit]}`,
      cell: (i) => <span className="num">{i.getValue() === null ? "—" : formatNumber(fromCubicMetres(i.getValue()!, unit), 4, TABLE_NUMBERS)}</span>,
    }),
    helper.accessor((r) => (r.feasible ? trainResidenceTime(stagesOf(r)) : null), {
      id: "residenceTime",
      header: `Residence time, ${unitLabel("time", timeUnit)}`,
      enableSorting: false,
      cell: (i) => {
        const v = i.getValue();
        return <span className="num">{v === null ? "—" : formatNumber(fromSI("time", v, timeUnit), 4, TABLE_NUMBERS)}</span>;
      },
    }),
    helper.accessor((r) => net(r).onBound ?? [], {
      id: "onBound",
      header: NETWORK_COLUMN_TITLES.onBound,
      enableSorting: false,
      cell: (i) => {
        const notes = i.getValue();
        return notes.length ? (
          <span className="text-xs text-amber-900" data-testid="on-bound-note">
            {notes.map(boundNote).join("; ")}
          </span>
        ) : (
          <span className="text-ink-faint">—</span>
        );
      },
    }),
  ];
}
