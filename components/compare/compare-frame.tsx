import Link from "next/link";
import { UnitSelect } from "@/components/sweeps/unit-select";
import type { VolumeUnit } from "@/lib/charts/volume-units";
import type { TrainStageType } from "@/lib/engine";
import { describeOverrides } from "@/components/sweeps/scenario-picker";
import { StageBadges } from "@/components/sweeps/stage-badges";

/** A train compared, as far as the frame of the comparison needs it. */
interface Compared {
  id: string;
  rank: number;
  sweep: { id: string; projectId: string; name: string };
}

/** The letter a compared train goes by: A, B, C… in the order chosen. */
export const trainLetter = (i: number) => String.fromCharCode(65 + i);

/**
 * The head of a comparison: the way back to each sweep compared, the title and the volume unit.
 * Trains of one reaction and of several are compared under the same head; `summary` says how to read them.
 */
export function CompareHeader({ list, summary, unit, onUnit }: { list: Compared[]; summary: string; unit: VolumeUnit; onUnit: (u: VolumeUnit) => void }) {
  const sweepsCompared = [...new Map(list.map((c) => [c.sweep.id, c.sweep])).values()];
  return (
    <>
      <nav aria-label="Back to the sweeps compared" className="flex flex-wrap gap-3 text-sm" data-testid="compare-back">
        {sweepsCompared.map((sw) => (
          <Link key={sw.id} href={`/projects/${sw.projectId}/sweeps/${sw.id}`} className="text-accent-700 hover:underline">
            ← Back to sweep {sw.name}
          </Link>
        ))}
      </nav>
      <header className="flex flex-wrap items-end justify-between gap-4">
        <div>
          <h1>Compare {list.length} trains</h1>
          <p className="mt-1 text-ink-soft">{summary}</p>
        </div>
        <UnitSelect id="cmp-unit" value={unit} onChange={onUnit} />
      </header>
    </>
  );
}

/** The differences table of a comparison: a column a train, a row a measure (the rows are the caller's). */
export function DifferencesTable({ list, children }: { list: Compared[]; children: React.ReactNode }) {
  return (
    <section className="card overflow-x-auto" aria-labelledby="diff-title">
      <h2 id="diff-title" className="border-b border-line px-3 py-2">
        Differences
      </h2>
      <table className="table-dense" data-testid="compare-differences">
        <thead>
          <tr>
            <th scope="col">Measure</th>
            {list.map((c, i) => (
              <th key={c.id} scope="col">
                {trainLetter(i)} · rank {c.rank}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>{children}</tbody>
      </table>
    </section>
  );
}

/** The head of one train's card: its letter, rank and stages, and the sweep and scenario it came from. */
export function CompareCardHeading({ c, index, unit }: { c: Compared & { sequence: TrainStageType[]; scenario: { index: number; overrides: Record<string, number> } }; index: number; unit: VolumeUnit }) {
  return (
    <div className="border-b border-line px-3 py-2">
      <h2 id={`cmp-${c.id}`} className="flex flex-wrap items-center gap-2">
        {trainLetter(index)} · rank {c.rank} <StageBadges sequence={c.sequence} />
      </h2>
      <p className="text-xs text-ink-soft">
        <Link href={`/projects/${c.sweep.projectId}/sweeps/${c.sweep.id}/candidates/${c.id}?unit=${unit}`} className="hover:underline">
          {c.sweep.name}
        </Link>{" "}
        · scenario {c.scenario.index + 1}: {describeOverrides(c.scenario.overrides)}
      </p>
    </div>
  );
}
