"use client";

import { useSearchParams } from "next/navigation";
import { useQuery } from "@tanstack/react-query";
import { Cautions } from "@/components/cautions/cautions";
import { thermalWarnings } from "@/lib/engine";
import { LevenspielChart } from "@/components/charts/levenspiel-chart";
import { chartInputs } from "@/components/charts/candidate-chart-data";
import { ErrorPanel, LoadingPanel } from "@/components/sweeps/loading-and-error-panels";
// One-reaction screen until it learns the network kind (kind "network" carries other stages).
import type { CandidateAnswer, SweepView } from "@/lib/services/views";
import { fetchJson } from "@/lib/client/fetch-json";
import { formatVolume } from "@/lib/charts/volume-units";
import { useUrlUnit } from "@/components/sweeps/unit-select";
import { PinSection, RobustnessSection } from "./candidate-actions";
import { CandidateHeader, MeasureCards } from "./candidate-header";
import { StageTable } from "./stage-table";
import { VesselPlan } from "./vessel-plan";
import { TemperatureProfile } from "./temperature-profile";
import { formatNumber, TABLE_NUMBERS } from "@/lib/format/numbers";
import type { UnitKind } from "@/lib/units/display";
import { NetworkCandidateView } from "./network-candidate-view";
import type { NetworkCandidateDetail } from "./network-types";
import { networkObjectiveOf } from "@/components/sweeps/network-sweep";
import { stageTypeCautions } from "@/lib/stage-types";

/** What the server read for the page's first paint: the candidate and, when it is the same, its sweep. */
export interface CandidateInitial {
  candidate: CandidateAnswer;
  sweep?: SweepView;
}

export function CandidateView({ candidateId, canPin, typedUnits, initial }: { candidateId: string; canPin: boolean; typedUnits?: Partial<Record<UnitKind, string>>; initial?: CandidateInitial }) {
  const params = useSearchParams();
  const back = params.get("back");
  // Seeded with the server's read under the key the browser uses: the page shows the candidate
  // with its first paint, and a later visit within the stale time reads the same cache.
  const q = useQuery({
    queryKey: ["candidate", candidateId],
    queryFn: () => fetchJson<{ candidate: CandidateAnswer }>(`/api/candidates/${candidateId}`).then((r) => r.candidate),
    initialData: initial?.candidate.id === candidateId ? initial.candidate : undefined,
  });
  const sweepId = q.data?.sweep.id;
  const sweepQ = useQuery({
    queryKey: ["sweep", sweepId],
    queryFn: () => fetchJson<{ sweep: SweepView }>(`/api/sweeps/${sweepId}`).then((r) => r.sweep),
    enabled: !!sweepId,
    initialData: initial?.sweep && initial.sweep.id === sweepId ? initial.sweep : undefined,
  });
  const [unit, setUnit] = useUrlUnit(q.data?.totalVolume ?? null);

  if (q.isPending) return <LoadingPanel label="Loading the candidate…" />;
  if (q.isError) return <ErrorPanel error={q.error} what="this candidate" />;
  // A train of several reactions has its own view (measures, composition, profiles, path).
  if (q.data.kind === "network") {
    // The server's answer, read through the screens' own shape of it (a mismatch fails to compile here).
    const n: NetworkCandidateDetail = q.data;
    return <NetworkCandidateView c={n} canPin={canPin} back={back} objective={n.scenario.reference?.objective ?? networkObjectiveOf(sweepQ.data)} typedUnits={typedUnits} />;
  }
  const c = q.data;
  const sweepHref = back?.startsWith("/projects/") ? back : `/projects/${c.sweep.projectId}/sweeps/${c.sweep.id}`;
  const ref = c.scenario.reference;
  const singleSpec = sweepQ.data?.kind === "single" ? sweepQ.data.spec : undefined;
  const thermal = singleSpec?.reaction?.thermal;
  const bestPath = ref?.bestTemperaturePath ?? null;
  // Shown when temperatures change along the train or a best temperature path is there to compare with.
  const adiabatic =
    thermal?.mode === "adiabatic" || bestPath !== null || c.stages.some((s, i) => Math.abs(s.temperatureOut - s.temperatureIn) > 1e-6 || (i > 0 && s.temperatureIn !== c.stages[i - 1]!.temperatureOut));
  // The path's highest temperature is the limit it keeps to (kelvin, as stored).
  const maxTemperature = bestPath?.highestTemperature ?? null;
  const warnings = thermalWarnings({ thermal, stageTemperatures: c.stages.map((s) => s.temperatureOut) });
  const target = singleSpec?.target?.conversion;
  const empty = c.stages.filter((s) => s.volume === 0).map((s) => c.stages.indexOf(s) + 1);

  return (
    <div className="space-y-5">
      <CandidateHeader c={c} sweepHref={sweepHref} unit={unit} onUnit={setUnit} />

      <MeasureCards
        measures={[
          ["Total volume", formatVolume(c.totalVolume, unit, 4)],
          ["Total cost", formatNumber(c.totalCost, 4, TABLE_NUMBERS)],
          ["Ratio to single PFR", c.ratioToPfr === null ? "—" : `${formatNumber(c.ratioToPfr, 4, TABLE_NUMBERS)}×`],
          ["Single CSTR / PFR", `${formatVolume(ref?.singleCSTR, unit)} / ${formatVolume(ref?.singlePFR, unit)}`],
          ...(bestPath && c.totalVolume !== null
            ? ([["Over the best temperature path", `${formatNumber(c.totalVolume / bestPath.volume, 4, TABLE_NUMBERS)}× (path ${formatVolume(bestPath.volume, unit, 4)})`]] as [string, string][])
            : []),
        ]}
      />

      {!c.feasible ? (
        <div role="status" className="card border-red-200 p-4 text-red-800">
          This train cannot reach the target within the limits.
        </div>
      ) : (
        <div className="grid gap-4 lg:grid-cols-[3fr_2fr]">
          <section className="card p-4" aria-labelledby="chart-title">
            <h2 id="chart-title">Levenspiel area chart</h2>
            <p className="mb-2 text-xs text-ink-soft">
              Each CSTR is the rectangle at its outlet height; each PFR the area under the curve. Areas are the stage volumes.
              {c.sequence.includes("PFR-recycle")
                ? " A tube with recycle is the rectangle at the mean height over its tube; the area under the curve from its tube's inlet X₁ (ticked on the axis, outlined dashed) times R + 1 is the same volume."
                : null}
            </p>
            <LevenspielChart {...chartInputs(c.stages, c.levenspiel)} target={target} equilibrium={ref?.equilibriumConversion ?? null} volumeUnit={unit} height={340} />
            {empty.length ? <p className="mt-1 text-xs text-ink-soft">Stage {empty.join(", ")} has zero volume at this optimum and draws no area.</p> : null}
          </section>
          <div className="space-y-4">
            <PinSection c={c} canPin={canPin} />
            {adiabatic ? (
              <section className="card p-4" aria-labelledby="temp-title">
                <h2 id="temp-title">{bestPath ? "Conversion and temperature" : "Temperature profile"}</h2>
                {bestPath ? (
                  <p className="mb-2 text-xs text-ink-soft">
                    The best temperature path runs at the temperature of the highest rate at each conversion, within the temperatures allowed; a tube that follows it has the least volume any train can have.
                  </p>
                ) : null}
                <TemperatureProfile stages={c.stages} bestPath={bestPath} maxTemperature={maxTemperature} />
              </section>
            ) : null}
          </div>
        </div>
      )}

      <RobustnessSection c={c} canRun={canPin} />

      <section className="card overflow-hidden" aria-labelledby="stages-title">
        <h2 id="stages-title" className="border-b border-line px-3 py-2">
          Stages
        </h2>
        <StageTable stages={c.stages} unit={unit} caption={`Stages of rank ${c.rank}`} />
      </section>
      <VesselPlan plan={c.inventoryPlan} installedCost={c.installedCost} unit={unit} />
      <Cautions warnings={warnings} more={stageTypeCautions(c.sequence)} />
    </div>
  );
}
