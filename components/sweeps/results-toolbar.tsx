"use client";

import { useState } from "react";
import { COLUMN_TITLES } from "./ranked-table";
import { UnitSelect } from "./unit-select";
import { candidateExportHref } from "@/components/reports/export-links";
import { downloadText, exportCandidatesCsv } from "./csv-export";
import { keyOfWrittenSequence, sequenceFromKey, stageTypeShort } from "@/lib/stage-types";
import { PAGE_SIZES, SINGLE_COLUMNS, type OptionalColumn, type SweepViewState } from "./view-state";

const CONTAINS = ["", "CSTR", "PFR", "CSTR-PFR", "PFR-CSTR", "CSTR-CSTR", "PFR-PFR"];
/** Runs with a tube with recycle, offered when the sweep's trains can hold one (written as the sweep file writes types). */
const CONTAINS_RECYCLE = ["PFR-recycle", "CSTR-PFR-recycle", "PFR-recycle-CSTR", "PFR-recycle-PFR"];
/** "CSTR-PFR-recycle" → "CSTR › PFR+R", the badges' short labels. */
const containsLabel = (c: string) => (c ? sequenceFromKey(keyOfWrittenSequence(c)).map(stageTypeShort).join(" › ") : "any");

/** Filters, units, columns, page size and CSV export of the ranked table; all kept in the URL. */
export function ResultsToolbar({
  sweepId,
  view,
  setView,
  columns = SINGLE_COLUMNS,
  withRecycle = false,
}: {
  sweepId: string;
  view: SweepViewState;
  setView: (p: Partial<SweepViewState>) => void;
  /** The optional columns this sweep's table has. */
  columns?: readonly OptionalColumn[];
  /** Whether a train of this sweep can hold a tube with recycle (its filter then offers runs with one). */
  withRecycle?: boolean;
}) {
  const [exporting, setExporting] = useState<string | null>(null);
  const [exportError, setExportError] = useState<string | null>(null);
  const [withShown, setWithShown] = useState(false);
  const shownUnit = view.unit ?? "m3";

  const onExport = async () => {
    setExportError(null);
    setExporting("Preparing…");
    try {
      const csv = await exportCandidatesCsv(sweepId, view, { shownUnit: withShown ? shownUnit : null }, (n, total) => setExporting(`${n} / ${total}`));
      downloadText(`sweep-${sweepId.slice(0, 8)}-scenario-${view.scenario + 1}.csv`, csv);
    } catch (e) {
      setExportError(`Export failed: ${e instanceof Error ? e.message : "unknown error"}`);
    } finally {
      setExporting(null);
    }
  };

  return (
    <div className="flex flex-wrap items-end gap-x-4 gap-y-3">
      <div className="flex items-center gap-2 pb-1.5">
        <input id="f-feasible" type="checkbox" className="size-4 accent-accent-600" checked={view.feasible} onChange={(e) => setView({ feasible: e.target.checked })} />
        <label htmlFor="f-feasible" className="text-sm">
          Feasible only
        </label>
      </div>
      <div>
        <label htmlFor="f-contains" className="field-label">
          Contains the sequence
        </label>
        <select id="f-contains" className="input w-36" value={view.contains} onChange={(e) => setView({ contains: e.target.value })}>
          {(withRecycle ? [...CONTAINS, ...CONTAINS_RECYCLE] : CONTAINS).map((c) => (
            <option key={c} value={c}>
              {containsLabel(c)}
            </option>
          ))}
        </select>
      </div>
      <div>
        <label htmlFor="f-stages" className="field-label">
          Stages
        </label>
        <select id="f-stages" className="input w-24" value={view.stages ?? ""} onChange={(e) => setView({ stages: e.target.value ? Number(e.target.value) : null })}>
          <option value="">any</option>
          {[1, 2, 3, 4, 5, 6, 7, 8].map((n) => (
            <option key={n} value={n}>
              {n}
            </option>
          ))}
        </select>
      </div>
      <UnitSelect id="f-unit" value={shownUnit} onChange={(unit) => setView({ unit, page: view.page })} testId="unit-picker" />
      <div>
        <label htmlFor="f-size" className="field-label">
          Rows
        </label>
        <select id="f-size" className="input w-20" value={view.pageSize} onChange={(e) => setView({ pageSize: Number(e.target.value) })}>
          {PAGE_SIZES.map((n) => (
            <option key={n} value={n}>
              {n}
            </option>
          ))}
        </select>
      </div>
      <fieldset className="min-w-0">
        <legend className="field-label">Columns</legend>
        <div className="flex flex-wrap gap-x-3 gap-y-1 pb-1.5">
          {columns.map((c) => (
            <label key={c} className="flex items-center gap-1 text-sm">
              <input
                type="checkbox"
                className="size-4 accent-accent-600"
                checked={!view.hidden.includes(c)}
                onChange={(e) => setView({ hidden: e.target.checked ? view.hidden.filter((h) => h !== c) : [...view.hidden, c], page: view.page })}
              />
              {COLUMN_TITLES[c]}
            </label>
          ))}
        </div>
      </fieldset>
      <div className="ml-auto flex flex-col items-end">
        <div className="flex items-center gap-2">
          <label className="flex items-center gap-1 text-sm">
            <input type="checkbox" className="size-4 accent-accent-600" checked={withShown} onChange={(e) => setWithShown(e.target.checked)} data-testid="export-shown-units" />
            Add columns in the units shown
          </label>
          <button type="button" className="btn-quiet" onClick={onExport} disabled={exporting !== null} data-testid="export-csv">
            {exporting ? `Exporting ${exporting}` : "Export CSV"}
          </button>
          <a className="btn-quiet" href={candidateExportHref(sweepId, view.scenario, "csv", view)} download data-testid="export-server-csv" title="Every candidate, SI units, from the server">
            CSV (SI units)
          </a>
          <a className="btn-quiet" href={candidateExportHref(sweepId, view.scenario, "json", view)} download data-testid="export-server-json">
            JSON
          </a>
        </div>
        {exportError ? (
          <p role="alert" className="field-error">
            {exportError}
          </p>
        ) : null}
      </div>
    </div>
  );
}
