"use client";

import Link from "next/link";
import { useRouter } from "next/navigation";
import { createContext, memo, useContext, useMemo } from "react";
import { columnVisibilityFeature, createColumnHelper, rowSortingFeature, tableFeatures, useTable, type SortingState } from "@tanstack/react-table";
import { LevenspielThumbnail } from "@/components/charts/levenspiel-thumbnail";
import { formatVolume, fromCubicMetres, VOLUME_LABEL, type VolumeUnit } from "@/lib/charts/volume-units";
import { costColumns, COST_COLUMN_TITLES } from "./cost-columns";
import { StageBadges } from "./stage-badges";
import { networkColumns, NETWORK_COLUMN_TITLES } from "./network-columns";
import type { CandidateRow } from "@/lib/services/views";
import type { SortKey } from "@/lib/sweeps/sort-keys";
import type { OptionalColumn, SweepViewState } from "./view-state";
import { formatNumber, TABLE_NUMBERS } from "@/lib/format/numbers";
import { stageTypeShort } from "@/lib/stage-types";

const features = tableFeatures({ rowSortingFeature, columnVisibilityFeature });
const helper = createColumnHelper<typeof features, CandidateRow>();
const NO_ROWS: CandidateRow[] = [];

const feasibility = helper.accessor("feasible", {
  header: "Feasibility",
  enableSorting: false,
  cell: (i) =>
    i.getValue() ? (
      <span className="badge whitespace-nowrap border-accent-200 bg-accent-50 text-accent-800">✓ feasible</span>
    ) : (
      <span className="badge border-red-300 bg-red-50 text-red-800" title={i.row.original.reason ?? undefined}>
        ✕ {i.row.original.reason ?? "infeasible"}
      </span>
    ),
});

/** Column id → the server's sort key (the stage columns sort by stage count). */
const SORT_OF: Record<string, SortKey> = {
  rank: "rank",
  sequence: "sequence",
  totalVolume: "totalVolume",
  totalCost: "totalCost",
  ratioToPfr: "ratioToPfr",
  probabilityMeet: "probabilityMeet",
  stages: "stageCount",
  installedCost: "installedCost",
  reused: "reused",
  conversion: "conversion",
  yield: "yield",
  selectivity: "selectivity",
};

/** Measures where more is better: their first click sorts the largest first. */
const LARGEST_FIRST = new Set<SortKey>(["yield", "selectivity", "conversion"]);

export const COLUMN_TITLES: Record<OptionalColumn, string> = {
  chart: "Chart",
  totalCost: "Total cost",
  ratioToPfr: "Times the single-PFR volume",
  stages: "Stages (volume, outlet X)",
  feasible: "Feasibility",
  ...COST_COLUMN_TITLES,
  ...NETWORK_COLUMN_TITLES,
};

/**
 * What the cells read that changes with the page around them: the compare selection, the candidate
 * links (they carry the view back) and the thumbnails' shared scale. Read through a context, not
 * closed over by the column definitions: a column whose cell function changes is a new component to
 * React, so every cell of the table would be thrown away and built again (charts included) on each
 * sort, page change or ticked box. With these out, the columns change only with the unit and kind.
 */
interface RowContext {
  selected: string[];
  onToggle: (id: string) => void;
  candidateHref: (id: string) => string;
  yMax?: number;
  target?: number;
  unit: VolumeUnit;
}
const RowContext = createContext<RowContext>({ selected: [], onToggle: () => {}, candidateHref: () => "#", unit: "m3" });

/** A row's compare box. */
function SelectBox({ c }: { c: CandidateRow }) {
  const { selected, onToggle } = useContext(RowContext);
  const checked = selected.includes(c.id);
  return (
    <input
      type="checkbox"
      className="size-4 accent-accent-600"
      aria-label={`Select rank ${c.rank} (${c.sequence.map(stageTypeShort).join("-")}) to compare`}
      checked={checked}
      disabled={!checked && (selected.length >= 4 || !c.feasible)}
      onChange={() => onToggle(c.id)}
    />
  );
}

/**
 * A row's sequence, linked to its candidate page. The link's route is fetched ahead when the reader
 * points at it or tabs to it, not as it scrolls into view: every sort or page change brings 25 new
 * links, and fetching them all ahead competed with the request for the rows themselves.
 */
function SequenceCell({ c }: { c: CandidateRow }) {
  const { candidateHref } = useContext(RowContext);
  const router = useRouter();
  const href = candidateHref(c.id);
  return (
    <>
      <Link href={href} prefetch={false} onMouseEnter={() => router.prefetch(href)} onFocus={() => router.prefetch(href)} className="rounded hover:underline" data-testid="candidate-link">
        <StageBadges sequence={c.sequence} />
      </Link>
      <RecycleRatios stages={c.stages} />
      {c.emptyStages ? (
        <span className="ml-2 text-xs text-ink-soft" data-testid="empty-stages" title="A stage with no conversion in it: the train is a shorter one plus a vessel that does nothing, so it ranks after every train without one.">
          {c.emptyStages === 1 ? "1 empty stage" : `${c.emptyStages} empty stages`}
        </span>
      ) : null}
    </>
  );
}

/**
 * "R = 0.43" after a train's badges, one ratio per tube with recycle in stage order ("R = 1000; 0"); nothing
 * without one. No thousands commas: a comma would read as the separator between two ratios.
 */
function RecycleRatios({ stages }: { stages: readonly { type: string; recycleRatio?: number }[] }) {
  const ratios = stages.filter((s) => s.type === "PFR-recycle").map((s) => formatNumber(s.recycleRatio ?? null, 3));
  if (!ratios.length) return null;
  return (
    <span className="block whitespace-nowrap text-xs text-ink-soft num" data-testid="recycle-ratios" title="Recycle ratio of each tube with recycle: recycled flow over the flow leaving the stage">
      R = {ratios.join("; ")}
    </span>
  );
}

/** One row's Levenspiel thumbnail, drawn from the plot data the row came with (no request of its own). */
const ThumbnailCell = memo(function ThumbnailCell({ c }: { c: CandidateRow }) {
  const { yMax, target, unit } = useContext(RowContext);
  if (!c.feasible || !c.levenspiel) return <span className="text-ink-faint">—</span>;
  return <LevenspielThumbnail stages={c.stages} levenspiel={c.levenspiel} target={target} yMax={yMax} unit={unit} />;
});

interface Props {
  rows: CandidateRow[] | undefined;
  view: SweepViewState;
  onSort: (sort: SortKey, dir: "asc" | "desc") => void;
  selected: string[];
  onToggle: (id: string) => void;
  candidateHref: (id: string) => string;
  yMax?: number;
  target?: number;
  /** For a sweep of several reactions: the wanted product and the residence-time unit (its own columns then). */
  network?: { product: string | null; timeUnit: string };
}

export function RankedTable({ rows, view, onSort, selected, onToggle, candidateHref, yMax, target, network }: Props) {
  // The sweep page resolves a null (follow the setting) before passing the view in.
  const unit: VolumeUnit = view.unit ?? "m3";
  const networkProduct = network?.product;
  const networkTime = network?.timeUnit;
  const isNetwork = !!network;
  const columns = useMemo(() => {
    const lead = [
      helper.display({
        id: "select",
        enableSorting: false,
        header: () => <span className="sr-only">Select to compare</span>,
        cell: ({ row }) => <SelectBox c={row.original} />,
      }),
      helper.accessor("rank", { header: "Rank", cell: (i) => <span className="num">{i.getValue()}</span> }),
      helper.accessor("sequence", {
        header: isNetwork ? "Train" : "Sequence",
        cell: (i) => <SequenceCell c={i.row.original} />,
      }),
    ];
    if (isNetwork) return helper.columns([...lead, ...networkColumns({ product: networkProduct ?? null, unit, timeUnit: networkTime ?? "s" }), feasibility]);
    return helper.columns([
      ...lead,
      helper.display({
        id: "chart",
        header: "Chart",
        enableSorting: false,
        cell: ({ row }) => <ThumbnailCell c={row.original} />,
      }),
      helper.accessor("totalVolume", {
        header: `Total volume, ${VOLUME_LABEL[unit]}`,
        cell: (i) => <span className="num">{i.getValue() === null ? "—" : formatNumber(fromCubicMetres(i.getValue()!, unit), 4, TABLE_NUMBERS)}</span>,
      }),
      helper.accessor("totalCost", { header: "Total cost", cell: (i) => <span className="num">{formatNumber(i.getValue(), 4, TABLE_NUMBERS)}</span> }),
      ...costColumns(),
      helper.accessor("ratioToPfr", { header: "Times the single-PFR volume", cell: (i) => <span className="num">{i.getValue() === null ? "—" : `${formatNumber(i.getValue(), 3, TABLE_NUMBERS)}×`}</span> }),
      helper.accessor((r) => r.probabilityMeet ?? null, {
        id: "probabilityMeet",
        header: "P(meet target)",
        cell: (i) => <span className="num">{i.getValue() === null ? "—" : `${(100 * (i.getValue() as number)).toFixed(1)} %`}</span>,
      }),
      helper.accessor("stages", {
        header: "Stages (volume, outlet X)",
        cell: (i) => (
          <ol className="flex flex-wrap gap-x-3 gap-y-0.5 text-xs">
            {i.getValue().map((s, k) => (
              <li key={k} className="num whitespace-nowrap">
                <span className="text-ink-faint">{k + 1}</span> {formatVolume(s.volume, unit)} → {formatNumber(s.conversionOut, 4, TABLE_NUMBERS)}
              </li>
            ))}
          </ol>
        ),
      }),
      feasibility,
      ]);
  }, [unit, isNetwork, networkProduct, networkTime]);
  const rowContext = useMemo(() => ({ selected, onToggle, candidateHref, yMax, target, unit }), [selected, onToggle, candidateHref, yMax, target, unit]);

  const sorting: SortingState = useMemo(() => {
    const col = Object.entries(SORT_OF).find(([, k]) => k === view.sort)?.[0] ?? "rank";
    return [{ id: col, desc: view.dir === "desc" }];
  }, [view.sort, view.dir]);
  // "P(meet target)" shows only for a sweep that also rated its trains under uncertainty.
  const rated = rows?.some((r) => r.probabilityMeet !== null && r.probabilityMeet !== undefined) ?? false;
  const columnVisibility = useMemo(() => ({ ...Object.fromEntries(view.hidden.map((c) => [c, false])), probabilityMeet: rated }), [view.hidden, rated]);

  const table = useTable({
    features,
    columns,
    data: rows ?? NO_ROWS,
    getRowId: (r) => r.id,
    manualSorting: true,
    enableMultiSort: false,
    state: { sorting, columnVisibility },
    onSortingChange: () => {},
  });

  return (
    <RowContext.Provider value={rowContext}>
    <div id="ranked-trains" className="overflow-x-auto" tabIndex={0} role="region" aria-label="Ranked trains table">
      <table className="table-dense" data-testid="ranked-table">
        <caption className="sr-only">Ranked candidate trains of the scenario; use the column buttons to sort.</caption>
        <thead>
          {table.getHeaderGroups().map((group) => (
            <tr key={group.id}>
              {group.headers.map((header) => {
                const key = SORT_OF[header.column.id];
                const sorted = header.column.getIsSorted();
                const label = <table.FlexRender header={header} />;
                return (
                  <th key={header.id} scope="col" aria-sort={key ? (sorted === "asc" ? "ascending" : sorted === "desc" ? "descending" : "none") : undefined}>
                    {key ? (
                      <button
                        type="button"
                        className="inline-flex items-center gap-1 rounded uppercase tracking-wide hover:text-ink"
                        onClick={() => onSort(key, view.sort === key ? (view.dir === "asc" ? "desc" : "asc") : LARGEST_FIRST.has(key) ? "desc" : "asc")}
                        data-testid={`sort-${header.column.id}`}
                      >
                        {label}
                        <span aria-hidden="true" className={sorted ? "text-accent-700" : "text-ink-faint"}>
                          {sorted === "asc" ? "▲" : sorted === "desc" ? "▼" : "↕"}
                        </span>
                      </button>
                    ) : (
                      label
                    )}
                  </th>
                );
              })}
            </tr>
          ))}
        </thead>
        <tbody>
          {table.getRowModel().rows.map((row) => (
            <tr key={row.id} className={row.original.feasible ? "" : "bg-paper text-ink-soft"} data-testid="candidate-row">
              {row.getVisibleCells().map((cell) => (
                <td key={cell.id}>
                  <table.FlexRender cell={cell} />
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
    </RowContext.Provider>
  );
}
