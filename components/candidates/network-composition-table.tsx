import { StageSwatch } from "@/components/charts/stage-patterns";
import { formatNumber, TABLE_NUMBERS } from "@/lib/format/numbers";
import { unitLabel } from "@/lib/units/display";
import type { NetworkStageResult } from "@/lib/engine";
import { compositionRows, percent } from "./network-results-data";

/** Outlet composition: the feed and each stage's outlet, one column per species, in the shown concentration unit. */
export function NetworkCompositionTable({
  species,
  stages,
  feed,
  unit,
  caption,
}: {
  species: string[];
  stages: NetworkStageResult[];
  feed: Record<string, number> | null;
  unit: string;
  caption: string;
}) {
  const rows = compositionRows({ species, stages, feed }, unit);
  const several = rows.filter((r) => r.steadyStates);
  return (
    <div>
      <div className="overflow-x-auto" tabIndex={0} role="region" aria-label={caption}>
        <table className="table-dense" data-testid="composition-table">
          <caption className="sr-only">{caption}</caption>
          <thead>
            <tr>
              <th scope="col">Stream</th>
              {species.map((s) => (
                <th key={s} scope="col" className="normal-case">
                  {s}, {unitLabel("concentration", unit)}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {rows.map((r, i) => (
              <tr key={r.label} data-testid="composition-row">
                <th scope="row" className="whitespace-nowrap">
                  <span className="inline-flex items-center gap-1.5">
                    {r.label === "Feed" ? null : <StageSwatch index={feed ? i - 1 : i} />}
                    {r.label === "Feed" ? "Feed" : `${r.label} outlet`}
                    {r.steadyStates ? <span aria-hidden="true"> *</span> : null}
                  </span>
                </th>
                {r.values.map((v, j) => (
                  <td key={species[j]} className="num">
                    {formatNumber(v, 4, TABLE_NUMBERS)}
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {several.length ? (
        <ul className="mt-2 space-y-0.5 px-3 pb-2 text-xs text-ink-soft" data-testid="steady-state-note">
          {several.map((r) => (
            <li key={r.label}>
              * {r.label} has {r.steadyStates!.count} steady states (conversion {r.steadyStates!.conversions.map((x) => percent(x)).join(", ")}); the train continues from the one of lowest conversion, shown here.
            </li>
          ))}
        </ul>
      ) : null}
    </div>
  );
}
