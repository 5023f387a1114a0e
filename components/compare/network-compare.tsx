"use client";

import { useQueries } from "@tanstack/react-query";
import { fetchJson } from "@/lib/client/fetch-json";
import { Cautions } from "@/components/cautions/cautions";
import { NetworkCompositionTable } from "@/components/candidates/network-composition-table";
import { NetworkPathChart } from "@/components/candidates/network-charts";
import { boundNote, feedOf, objectiveLabel, percent, trainResidenceTime } from "@/components/candidates/network-results-data";
import { productOf, speciesOf, type NetworkCandidateDetail } from "@/components/candidates/network-types";
import { useNetworkUnits } from "@/components/candidates/network-units";
import { StageBadges } from "@/components/sweeps/stage-badges";
import { useUrlUnit } from "@/components/sweeps/unit-select";
import { formatVolume } from "@/lib/charts/volume-units";
import { formatNumber, TABLE_NUMBERS } from "@/lib/format/numbers";
import { fromSI, unitLabel } from "@/lib/units/display";
import { compareNetworkTrains } from "./network-compare-data";
import { CompareCardHeading, CompareHeader, DifferencesTable, trainLetter } from "./compare-frame";

/** A difference to the best: "best" for the best one itself, else the gap with its sign. */
const gap = (v: number | null, text: (n: number) => string, sign: "+" | "−") => (v === null ? "—" : Math.abs(v) < 1e-12 ? "best" : `${sign}${text(v)}`);

/** Trains of several reactions side by side: yield, selectivity, conversion, volume, train and the product leaving, with differences to the best. */
export function NetworkCompare({ list }: { list: NetworkCandidateDetail[] }) {
  const [unit, setUnit] = useUrlUnit(Math.max(0, ...list.map((c) => c.totalVolume ?? 0)) || null);
  const units = useNetworkUnits();
  // Compare lists the stored rows; each train's profiles and paths come with its own answer, computed on request.
  const views = useQueries({
    queries: list.map((c) => ({
      queryKey: ["candidate", c.id],
      queryFn: () => fetchJson<{ candidate: NetworkCandidateDetail }>(`/api/candidates/${c.id}`).then((r) => r.candidate),
      enabled: c.feasible,
    })),
  });
  const diffs = compareNetworkTrains(list.map((c) => ({ ...c, product: productOf(c) })));
  const products = [...new Set(list.map(productOf).filter((p): p is string => !!p))];
  const product = products.length === 1 ? products[0] : null;
  const conc = (v: number | null) => (v === null ? "—" : `${formatNumber(fromSI("concentration", v, units.concentration), 4, TABLE_NUMBERS)} ${unitLabel("concentration", units.concentration)}`);
  const rows: [string, (c: NetworkCandidateDetail, i: number) => React.ReactNode][] = [
    ["Train", (c) => <StageBadges sequence={c.sequence} />],
    ["Ranked by", (c) => objectiveLabel(c.scenario.reference?.objective)],
    ...(product
      ? ([
          [`Yield of ${product}`, (c) => percent(c.yield, 2)],
          ["Yield below the best", (_c, i) => gap(diffs[i]!.yieldBelowBest, (v) => `${(100 * v).toFixed(2)} points`, "−")],
          [`Selectivity to ${product}`, (c) => percent(c.selectivity, 2)],
          ["Selectivity below the best", (_c, i) => gap(diffs[i]!.selectivityBelowBest, (v) => `${(100 * v).toFixed(2)} points`, "−")],
        ] as [string, (c: NetworkCandidateDetail, i: number) => React.ReactNode][])
      : []),
    ["Conversion", (c) => percent(c.conversion, 2)],
    ["Total volume", (c) => formatVolume(c.totalVolume, unit, 4)],
    ["Volume over the smallest", (_c, i) => gap(diffs[i]!.volumeOverBest, (v) => formatVolume(v, unit, 3), "+")],
    [
      "Residence time",
      (c) => {
        const t = trainResidenceTime(c.stages);
        return t === null ? "—" : `${formatNumber(fromSI("time", t, units.time), 4, TABLE_NUMBERS)} ${unitLabel("time", units.time)}`;
      },
    ],
    ...(product ? ([[`${product} leaving the train`, (_c, i) => conc(diffs[i]!.productOutlet)]] as [string, (c: NetworkCandidateDetail, i: number) => React.ReactNode][]) : []),
    ["On a limit", (c) => (c.onBound?.length ? c.onBound.map(boundNote).join("; ") : "—")],
  ];

  return (
    <div className="space-y-5">
      <CompareHeader list={list} summary="Trains for several reactions: each measure, and how far each train is from the best of those compared." unit={unit} onUnit={setUnit} />

      <DifferencesTable list={list}>
        {rows.map(([label, cell]) => (
          <tr key={label}>
            <th scope="row">{label}</th>
            {list.map((c, i) => (
              <td key={c.id} className="num">
                {cell(c, i)}
              </td>
            ))}
          </tr>
        ))}
      </DifferencesTable>

      <div className="grid gap-4">
        {list.map((c, i) => (
          <section key={c.id} className="card min-w-0 overflow-hidden" aria-labelledby={`cmp-${c.id}`} data-testid="compare-card">
            <CompareCardHeading c={c} index={i} unit={unit} />
            {!c.feasible ? (
              <p className="p-3 text-red-800">This train cannot meet the limits{c.reason ? `: ${c.reason}` : "."}</p>
            ) : views[i]?.data?.paths && views[i]?.data?.profiles ? (
              <div className="p-3">
                <NetworkPathChart paths={views[i]!.data!.paths!} profiles={views[i]!.data!.profiles!} unit={units.concentration} height={260} />
              </div>
            ) : views[i]?.isPending ? (
              <p className="p-3 text-sm text-ink-soft">Drawing the concentration path…</p>
            ) : null}
            <NetworkCompositionTable
              species={speciesOf(views[i]?.data ?? c)}
              stages={c.stages}
              feed={feedOf(views[i]?.data?.profiles)}
              unit={units.concentration}
              caption={`Outlet composition of train ${trainLetter(i)}`}
            />
          </section>
        ))}
      </div>
      <Cautions compact />
    </div>
  );
}
