"use client";

import Link from "next/link";
import { useRouter } from "next/navigation";
import { useId, useState } from "react";
import { fromSI } from "@/lib/units/display";
import type { StoredRateRow } from "@/lib/datasets/table-law";
import { OptionList } from "@/components/ui/unit-options";
import { datasetUnitOptions, DATASET_UNITS } from "@/lib/datasets/units";
import { InverseRatePlot, type RatePoint } from "./inverse-rate-plot";
import { Pager, usePage } from "./pager";
import { TableKineticsForm } from "./table-kinetics-form";
import { formatDateTime } from "@/lib/format/dates";
import { formatNumber } from "@/lib/format/numbers";

export interface DatasetViewProps {
  projectId: string;
  dataset: { id: string; name: string };
  versions: { id: string; version: number; fileName: string; rowCount: number; createdAt: string; note: string }[];
  selected: { id: string; version: number; rows: StoredRateRow[]; feedConcA: number | null };
  canCreate: boolean;
  models: { id: string; name: string }[];
}


/** A dataset: pick a version, read its rows and its 1/(−rA) plot, use it as kinetics or fit it. */
export function DatasetView({ projectId, dataset, versions, selected, canCreate, models }: DatasetViewProps) {
  const router = useRouter();
  const ids = useId();
  const [rateUnit, setRateUnit] = useState("mol/(L min)");
  const [concUnit, setConcUnit] = useState("mol/L");
  const rows = selected.rows;
  const has = (k: keyof StoredRateRow) => rows.some((r) => r[k] !== undefined);
  const paged = usePage(rows);
  const temperatures = [...new Set(rows.map((r) => r.temperature).filter((t): t is number => t !== undefined))].sort((a, b) => a - b);
  const points: RatePoint[] = rows.flatMap((r) => {
    const x = r.conversion ?? (selected.feedConcA && r.concA !== undefined ? 1 - r.concA / selected.feedConcA : undefined);
    return x === undefined ? [] : [{ conversion: x, rate: r.rate, temperature: r.temperature }];
  });
  const rateDef = DATASET_UNITS.rate[rateUnit as keyof typeof DATASET_UNITS.rate];
  const concDef = DATASET_UNITS.concentration[concUnit as keyof typeof DATASET_UNITS.concentration];

  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <label htmlFor={`${ids}-version`} className="field-label">
            Version
          </label>
          <select id={`${ids}-version`} className="input w-auto" value={selected.version} onChange={(e) => router.push(`/projects/${projectId}/datasets/${dataset.id}?version=${e.target.value}`)}>
            {versions.map((v) => (
              <option key={v.id} value={v.version}>
                v{v.version} · {v.fileName} · {v.rowCount} rows · {formatDateTime(v.createdAt)}
              </option>
            ))}
          </select>
        </div>
        <div className="flex flex-wrap gap-2">
          {canCreate ? (
            <Link href={`/projects/${projectId}/datasets/new?dataset=${dataset.id}`} className="btn-quiet">
              Upload a new version
            </Link>
          ) : null}
          <Link href={`/projects/${projectId}/datasets/${dataset.id}/fit?version=${selected.version}`} className="btn-quiet">
            Fit a rate law
          </Link>
        </div>
      </div>

      <div className="grid gap-5 lg:grid-cols-2">
        <section className="card overflow-hidden" aria-labelledby={`${ids}-rows`}>
          <div className="flex flex-wrap items-center justify-between gap-2 border-b border-line px-3 py-2">
            <h2 id={`${ids}-rows`}>Rows of v{selected.version}</h2>
            <div className="flex gap-2">
              <select aria-label="Show the rate in" className="input w-auto py-1" value={rateUnit} onChange={(e) => setRateUnit(e.target.value)}>
                <OptionList options={datasetUnitOptions("rate")} />
              </select>
              {has("concA") || has("concR") ? (
                <select aria-label="Show concentrations in" className="input w-auto py-1" value={concUnit} onChange={(e) => setConcUnit(e.target.value)}>
                  <OptionList options={datasetUnitOptions("concentration")} />
                </select>
              ) : null}
            </div>
          </div>
          <div className="overflow-x-auto">
            <table className="table-dense" data-testid="dataset-rows">
              <thead>
                <tr>
                  <th scope="col">#</th>
                  {has("conversion") ? <th scope="col">X</th> : null}
                  {has("concA") ? <th scope="col" className="normal-case tracking-normal">C_A ({concDef.label})</th> : null}
                  {has("concR") ? <th scope="col" className="normal-case tracking-normal">C_R ({concDef.label})</th> : null}
                  {has("temperature") ? <th scope="col">T (°C)</th> : null}
                  <th scope="col" className="normal-case tracking-normal">−rA ({rateDef.label})</th>
                </tr>
              </thead>
              <tbody>
                {paged.rows.map((r, i) => (
                  <tr key={i}>
                    <td className="num">{paged.page * 25 + i + 1}</td>
                    {has("conversion") ? <td className="num">{formatNumber(r.conversion)}</td> : null}
                    {has("concA") ? <td className="num">{r.concA === undefined ? "—" : formatNumber(r.concA / concDef.factor)}</td> : null}
                    {has("concR") ? <td className="num">{r.concR === undefined ? "—" : formatNumber(r.concR / concDef.factor)}</td> : null}
                    {has("temperature") ? <td className="num">{r.temperature === undefined ? "—" : formatNumber(fromSI("temperature", r.temperature, "degC"))}</td> : null}
                    <td className="num">{formatNumber(r.rate / rateDef.factor)}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
          <Pager label="Row pages" {...paged} />
        </section>

        <section className="card space-y-2 p-3" aria-labelledby={`${ids}-plot`}>
          <h2 id={`${ids}-plot`}>1/(−rA) against conversion</h2>
          {points.length ? (
            <InverseRatePlot points={points} />
          ) : (
            <p className="text-ink-soft">These rows give concentrations of A without a feed concentration, so they cannot be drawn against conversion. Upload a version with the feed concentration.</p>
          )}
        </section>
      </div>

      {canCreate ? (
        <section className="card space-y-3 p-4" aria-labelledby={`${ids}-table`}>
          <h2 id={`${ids}-table`}>Use as measured rate table</h2>
          <p className="text-sm text-ink-soft">Makes kinetics whose rate law is this table of −rA against conversion, without fitting any rate law: sweeps can then size trains on the measured data.</p>
          <TableKineticsForm
            key={selected.id}
            projectId={projectId}
            versionId={selected.id}
            defaultName={`${dataset.name} — measured table v${selected.version}`.slice(0, 120)}
            feedConcA={selected.feedConcA}
            temperatures={temperatures}
            models={models}
          />
        </section>
      ) : null}
    </div>
  );
}
