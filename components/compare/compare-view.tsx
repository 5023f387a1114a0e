"use client";

import { useSearchParams } from "next/navigation";
import { useMemo } from "react";
import { useQuery } from "@tanstack/react-query";
import { StageTable } from "@/components/candidates/stage-table";
import { Cautions } from "@/components/cautions/cautions";
import { stageTypeCautions } from "@/lib/stage-types";
import { LevenspielChart } from "@/components/charts/levenspiel-chart";
import { chartInputs } from "@/components/charts/candidate-chart-data";
import { StageBadges } from "@/components/sweeps/stage-badges";
import { ErrorPanel, LoadingPanel } from "@/components/sweeps/loading-and-error-panels";
// One-reaction screen until it learns the network kind (kind "network" carries other stages).
import type { CandidateDetail as AnyCandidateDetail, NetworkCandidateDetail as NetworkCompared, SingleCandidateDetail as CandidateDetail } from "@/lib/services/views";
import { fetchJson } from "@/lib/client/fetch-json";
import { sharedYMax } from "@/lib/charts/levenspiel-geometry";
import { formatVolume } from "@/lib/charts/volume-units";
import { useUrlUnit } from "@/components/sweeps/unit-select";
import { formatNumber, TABLE_NUMBERS } from "@/lib/format/numbers";
import type { NetworkCandidateDetail } from "@/components/candidates/network-types";
import { NetworkCompare } from "./network-compare";
import { CompareCardHeading, CompareHeader, DifferencesTable } from "./compare-frame";

const signed = (v: number | null, text: (n: number) => string) => (v === null ? "—" : v === 0 ? "best" : `+${text(v)}`);

export function CompareView() {
  const params = useSearchParams();
  const ids = (params.get("ids") ?? "").split(",").filter(Boolean);
  const valid = ids.length >= 2 && ids.length <= 4;
  const q = useQuery({
    queryKey: ["compare", ids.join(",")],
    queryFn: () => fetchJson<{ candidates: AnyCandidateDetail[] }>(`/api/candidates/compare?ids=${ids.join(",")}`).then((r) => r.candidates),
    enabled: valid,
  });
  const charts = useMemo(() => (q.data ?? []).map((c) => (c.kind === "network" ? chartInputs([], []) : chartInputs(c.stages, c.levenspiel))), [q.data]);
  const yMax = useMemo(() => (charts.length ? sharedYMax(charts) : undefined), [charts]);
  const [unit, setUnit] = useUrlUnit(Math.max(0, ...(q.data ?? []).map((c) => c.totalVolume ?? 0)) || null);

  if (!valid)
    return (
      <div className="card p-6 text-ink-soft" data-testid="compare-empty">
        <h1>Compare trains</h1>
        <p className="mt-2">Choose two to four trains in a sweep&apos;s ranked table and press “Compare selected”.</p>
      </div>
    );
  if (q.isPending) return <LoadingPanel label="Loading the trains…" />;
  if (q.isError) return <ErrorPanel error={q.error} what="these candidates" />;
  // Trains of several reactions compare by yield, selectivity and volume, without Levenspiel charts.
  const networks = q.data.filter((c): c is NetworkCompared => c.kind === "network");
  if (networks.length) {
    // The server's items, read through the screens' own shape of them (a mismatch fails to compile here).
    const read: NetworkCandidateDetail[] = networks;
    if (networks.length === q.data.length) return <NetworkCompare list={read} />;
    return (
      <div className="card p-6 text-ink-soft" data-testid="compare-mixed">
        <h1>Compare trains</h1>
        <p className="mt-2">Trains for one reaction and for several reactions are ranked by different measures; compare trains of one kind at a time.</p>
      </div>
    );
  }
  const list = q.data.filter((c): c is CandidateDetail => c.kind === "single");
  const fewest = Math.min(...list.map((c) => c.stageCount));
  const anyCost = list.some((c) => c.totalCost !== null);
  // One train per row: side by side, a stage table lost its volume column at 1280 and 1024 px.
  const cols = "grid-cols-1";

  return (
    <div className="space-y-5">
      <CompareHeader list={list} summary="Charts share one vertical scale, so equal areas are equal volumes across them." unit={unit} onUnit={setUnit} />

      <DifferencesTable list={list}>
        <tr>
          <th scope="row">Sequence</th>
          {list.map((c) => (
            <td key={c.id}>
              <StageBadges sequence={c.sequence} />
            </td>
          ))}
        </tr>
        <Row label="Total volume" list={list} cell={(c) => formatVolume(c.totalVolume, unit, 4)} />
        <Row label="Volume over the smallest" list={list} cell={(c) => signed(c.differences.volumeOverBest, (v) => formatVolume(v, unit, 3))} />
        {anyCost ? <Row label="Total cost" list={list} cell={(c) => formatNumber(c.totalCost, 4, TABLE_NUMBERS)} /> : null}
        {anyCost ? <Row label="Cost over the cheapest" list={list} cell={(c) => signed(c.differences.costOverBest, (v) => formatNumber(v, 3, TABLE_NUMBERS))} /> : null}
        <Row label="Stages" list={list} cell={(c) => `${c.stageCount}${c.stageCount > fewest ? ` (+${c.stageCount - fewest})` : ""}`} />
        <Row label="Ratio to single PFR" list={list} cell={(c) => (c.ratioToPfr === null ? "—" : `${formatNumber(c.ratioToPfr, 4, TABLE_NUMBERS)}×`)} />
      </DifferencesTable>

      <div className={`grid gap-4 ${cols}`}>
        {list.map((c, i) => (
          <section key={c.id} className="card min-w-0 overflow-hidden" aria-labelledby={`cmp-${c.id}`} data-testid="compare-card">
            <CompareCardHeading c={c} index={i} unit={unit} />
            <div className="p-3">
              {c.feasible ? (
                <LevenspielChart {...charts[i]} yMax={yMax} volumeUnit={unit} height={260} equilibrium={c.scenario.reference?.equilibriumConversion ?? null} />
              ) : (
                <p className="text-red-800">Infeasible: no chart.</p>
              )}
            </div>
            <StageTable stages={c.stages} unit={unit} caption={`Stages of train ${String.fromCharCode(65 + i)}`} />
          </section>
        ))}
      </div>
      <Cautions compact more={stageTypeCautions(list.flatMap((c) => c.sequence))} />
    </div>
  );
}

function Row({ label, list, cell }: { label: string; list: CandidateDetail[]; cell: (c: CandidateDetail) => string }) {
  return (
    <tr>
      <th scope="row">{label}</th>
      {list.map((c) => (
        <td key={c.id} className="num">
          {cell(c)}
        </td>
      ))}
    </tr>
  );
}
