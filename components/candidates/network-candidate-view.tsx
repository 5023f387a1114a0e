"use client";

import { Cautions } from "@/components/cautions/cautions";
import { useUrlUnit } from "@/components/sweeps/unit-select";
import { formatVolume } from "@/lib/charts/volume-units";
import { formatNumber, TABLE_NUMBERS } from "@/lib/format/numbers";
import { fromSI, unitLabel, type UnitKind } from "@/lib/units/display";
import type { NetworkObjective } from "@/lib/engine";
import { PinSection, RobustnessSection } from "./candidate-actions";
import { CandidateHeader, MeasureCards } from "./candidate-header";
import { NetworkCompositionTable } from "./network-composition-table";
import { NetworkStageTable } from "./network-stage-table";
import { NetworkPathChart, NetworkProfilesChart } from "./network-charts";
import { boundNote, feedOf, objectiveLabel, percent, trainResidenceTime } from "./network-results-data";
import { productOf, speciesOf, type NetworkCandidateDetail } from "./network-types";
import { useNetworkUnits } from "./network-units";

/** The objective's value in its own terms: a yield or selectivity as a percentage, a volume in the shown unit. */
export function objectiveValueText(objective: NetworkObjective | null | undefined, value: number | null | undefined, unit: Parameters<typeof formatVolume>[1]): string {
  if (value === null || value === undefined) return "—";
  return objective && "maximise" in objective ? percent(value, 2) : formatVolume(value, unit, 4);
}

/** In place of a chart the engine could not follow for this train: the stored numbers still hold. */
function NotDrawn() {
  return <p className="text-sm text-ink-soft">This chart could not be drawn for this train; the stored sizes and compositions below still hold.</p>;
}

/** A candidate train of a sweep of several reactions: its measures, outlet composition, profiles and path. */
export function NetworkCandidateView({
  c,
  canPin,
  back,
  objective,
  typedUnits,
}: {
  c: NetworkCandidateDetail;
  canPin: boolean;
  back: string | null;
  objective: NetworkObjective | null;
  typedUnits?: Partial<Record<UnitKind, string>>;
}) {
  const [unit, setUnit] = useUrlUnit(c.totalVolume ?? null);
  const units = useNetworkUnits(typedUnits);
  const sweepHref = back?.startsWith("/projects/") ? back : `/projects/${c.sweep.projectId}/sweeps/${c.sweep.id}`;
  const product = productOf(c);
  const key = c.keyReactant ?? c.paths?.key ?? "the key reactant";
  const tau = trainResidenceTime(c.stages);
  const ref = c.scenario.reference;
  const refText = (r: { objective: number; volume: number } | null | undefined) => (r ? `${objectiveValueText(objective, r.objective, unit)} at ${formatVolume(r.volume, unit)}` : "—");
  // The measure ranked by is marked rather than shown twice.
  const ranked = objective ? ("maximise" in objective ? objective.maximise : "volume") : null;
  const mark = (label: string, by: string) => (ranked === by ? `${label} · ranked by` : label);
  const measures: [string, string][] = [
    ...(product
      ? ([
          [mark(`Yield of ${product}`, "yield"), percent(c.yield, 2)],
          [mark(`Selectivity to ${product}`, "selectivity"), percent(c.selectivity, 2)],
        ] as [string, string][])
      : []),
    ["Conversion", percent(c.conversion, 2)],
    [mark("Total volume", "volume"), formatVolume(c.totalVolume, unit, 4)],
    ["Residence time", tau === null ? "—" : `${formatNumber(fromSI("time", tau, units.time), 4, TABLE_NUMBERS)} ${unitLabel("time", units.time)}`],
    ["Single tube", refText(ref?.singlePFR)],
    ["Single stirred tank", refText(ref?.singleCSTR)],
  ];

  return (
    <div className="space-y-5">
      <CandidateHeader c={c} sweepHref={sweepHref} unit={unit} onUnit={setUnit} after={objectiveLabel(objective)} />

      <MeasureCards measures={measures} testId="network-summary" />
      {c.onBound?.length ? (
        <div className="card border-amber-300 bg-amber-50 px-3 py-2 text-sm text-amber-900" data-testid="on-bound">
          <p className="font-medium">The optimum sits on a limit:</p>
          <ul className="list-disc pl-5">
            {c.onBound.map((n) => (
              <li key={n}>{boundNote(n)}</li>
            ))}
          </ul>
          <p className="mt-1 text-xs">A train at a limit may do better with the limit moved; a stage of zero volume means a shorter train does as well.</p>
        </div>
      ) : null}

      {!c.feasible ? (
        <div role="status" className="card border-red-200 p-4 text-red-800">
          This train cannot meet the limits{c.reason ? `: ${c.reason}` : "."}
        </div>
      ) : (
        <div className="grid gap-4 lg:grid-cols-2">
          <section className="card p-4" aria-labelledby="path-title">
            <h2 id="path-title">Concentration path</h2>
            <p className="mb-2 text-xs text-ink-soft">
              {product ?? "The product"} against {key}: the single tube and single stirred tanks of every size from the feed, and each stage of this train in its own colour.
            </p>
            {c.paths && c.profiles ? <NetworkPathChart paths={c.paths} profiles={c.profiles} unit={units.concentration} /> : <NotDrawn />}
          </section>
          <section className="card p-4" aria-labelledby="profiles-title">
            <h2 id="profiles-title">Concentration profiles</h2>
            <p className="mb-2 text-xs text-ink-soft">Every species through the train against cumulative residence time; a stirred tank&apos;s contents are uniform at its outlet composition.</p>
            {c.profiles ? <NetworkProfilesChart profiles={c.profiles} unit={units.concentration} timeUnit={units.time} /> : <NotDrawn />}
          </section>
        </div>
      )}

      <section className="card overflow-hidden" aria-labelledby="stages-title">
        <h2 id="stages-title" className="border-b border-line px-3 py-2">
          Stages
        </h2>
        <NetworkStageTable stages={c.stages} unit={unit} timeUnit={units.time} caption={`Stages of rank ${c.rank}`} />
      </section>

      <section className="card overflow-hidden" aria-labelledby="composition-title">
        <h2 id="composition-title" className="border-b border-line px-3 py-2">
          Outlet composition
        </h2>
        <NetworkCompositionTable species={speciesOf(c)} stages={c.stages} feed={feedOf(c.profiles)} unit={units.concentration} caption={`Outlet composition of rank ${c.rank}`} />
      </section>

      <div className="grid gap-4 lg:grid-cols-2">
        <PinSection c={c} canPin={canPin} />
        <RobustnessSection c={c} canRun={canPin} />
      </div>
      <Cautions />
    </div>
  );
}
