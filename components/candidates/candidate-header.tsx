import Link from "next/link";
import { candidateExportHref } from "@/components/reports/export-links";
import { describeOverrides } from "@/components/sweeps/scenario-picker";
import { StageBadges } from "@/components/sweeps/stage-badges";
import { UnitSelect } from "@/components/sweeps/unit-select";
import type { VolumeUnit } from "@/lib/charts/volume-units";
import type { TrainStageType } from "@/lib/engine";

/** What the header of a candidate reads; both kinds of candidate carry it. */
export interface CandidateHeading {
  rank: number;
  sequence: TrainStageType[];
  sweep: { id: string; projectId: string; name: string };
  scenario: { index: number; overrides: Record<string, number> };
}

/**
 * The breadcrumb and header of a candidate train: rank, stages, scenario, exports and the volume
 * unit. A candidate of one reaction and one of several share it so the two screens read alike;
 * `after` is what follows the scenario line (the ranking measure, for several reactions).
 */
export function CandidateHeader({
  c,
  sweepHref,
  unit,
  onUnit,
  after,
}: {
  c: CandidateHeading;
  sweepHref: string;
  unit: VolumeUnit;
  onUnit: (u: VolumeUnit) => void;
  after?: string;
}) {
  return (
    <>
      <nav aria-label="Breadcrumb" className="text-sm text-ink-soft">
        <Link href={`/projects/${c.sweep.projectId}`} className="hover:underline">
          Project
        </Link>{" "}
        /{" "}
        <Link href={sweepHref} className="hover:underline">
          {c.sweep.name}
        </Link>{" "}
        / Rank {c.rank}
      </nav>
      <header className="flex flex-wrap items-start justify-between gap-4">
        <div>
          <h1 className="flex flex-wrap items-center gap-2" data-testid="candidate-title">
            Rank {c.rank} <StageBadges sequence={c.sequence} />
          </h1>
          <p className="mt-1 text-ink-soft">
            Scenario {c.scenario.index + 1}: {describeOverrides(c.scenario.overrides)}
            {after !== undefined ? ` · ${after}` : null}
          </p>
        </div>
        <div className="flex flex-wrap items-end gap-2">
          <a className="btn-quiet" href={candidateExportHref(c.sweep.id, c.scenario.index, "csv")} download data-testid="candidate-export-csv">
            Scenario CSV
          </a>
          <a className="btn-quiet" href={candidateExportHref(c.sweep.id, c.scenario.index, "json")} download data-testid="candidate-export-json">
            Scenario JSON
          </a>
          <UnitSelect id="cand-unit" value={unit} onChange={onUnit} />
        </div>
      </header>
    </>
  );
}

/** The headline measures of a candidate as a row of small cards. */
export function MeasureCards({ measures, testId }: { measures: [string, string][]; testId?: string }) {
  return (
    <dl className="grid grid-cols-2 gap-3 sm:grid-cols-4" data-testid={testId}>
      {measures.map(([k, v]) => (
        <div key={k} className="card px-3 py-2">
          <dt className="text-xs uppercase tracking-wide text-ink-soft">{k}</dt>
          <dd className="num mt-0.5 text-base">{v}</dd>
        </div>
      ))}
    </dl>
  );
}
