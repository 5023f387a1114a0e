import type { TrainPlan } from "@/lib/costs/train-plan";
import { formatVolume, type VolumeUnit } from "@/lib/charts/volume-units";
import { formatNumber, TABLE_NUMBERS } from "@/lib/format/numbers";

/** Which vessel goes where: per stage, the reused inventory vessels and what is bought new, with the saving. */
export function VesselPlan({ plan, installedCost, unit }: { plan: TrainPlan | null | undefined; installedCost: number | null | undefined; unit: VolumeUnit }) {
  if (installedCost === null || installedCost === undefined) return null;
  return (
    <section className="card overflow-hidden" aria-labelledby="vessel-plan-title" data-testid="vessel-plan">
      <h2 id="vessel-plan-title" className="border-b border-line px-3 py-2">
        Which vessel goes where
      </h2>
      {!plan ? (
        <p className="px-3 py-2 text-sm text-ink-soft">
          Every vessel is bought new. Installed cost <span className="num">{formatNumber(installedCost, 4, TABLE_NUMBERS)}</span> (purchase × installation factor).
        </p>
      ) : (
        <>
          <div className="overflow-x-auto" tabIndex={0} role="region" aria-label="Vessels of each stage">
            <table className="table-dense" data-testid="vessel-plan-table">
              <caption className="sr-only">Vessels of each stage: reused from the inventory or bought new</caption>
              <thead>
                <tr>
                  <th scope="col">Stage</th>
                  <th scope="col">Volume needed</th>
                  <th scope="col">Reused vessel</th>
                  <th scope="col">Bought new</th>
                  <th scope="col">Cost</th>
                </tr>
              </thead>
              <tbody>
                {plan.stages.map((s) => {
                  const reused = s.slots.filter((x) => x.vesselId);
                  const bought = s.slots.filter((x) => !x.vesselId);
                  return (
                    <tr key={s.stage}>
                      <td className="whitespace-nowrap">
                        <span className="num">{s.stage + 1}</span> {s.type}
                      </td>
                      <td className="num whitespace-nowrap">
                        {formatVolume(s.volumeNeeded, unit)}
                        {s.slots.length > 1 ? <span className="text-ink-soft"> ({s.slots.length} × {formatVolume(s.volumeEach, unit)})</span> : null}
                      </td>
                      <td>{reused.length ? reused.map((x) => `${x.tag} (${formatVolume(x.volume, unit)})`).join(", ") : <span className="text-ink-soft">none</span>}</td>
                      <td className="num whitespace-nowrap">{bought.length ? `new: ${bought.length} × ${formatVolume(bought[0].volume, unit)}` : <span className="text-ink-soft">nothing</span>}</td>
                      <td className="num">{formatNumber(s.cost, 4, TABLE_NUMBERS)}</td>
                    </tr>
                  );
                })}
              </tbody>
            </table>
          </div>
          <p className="border-t border-line px-3 py-2 text-sm" data-testid="vessel-plan-saving">
            Installed cost <span className="num">{formatNumber(plan.totalCost, 4, TABLE_NUMBERS)}</span> against <span className="num">{formatNumber(plan.allNewCost, 4, TABLE_NUMBERS)}</span> all new: saving{" "}
            <strong className="num">{formatNumber(plan.saving, 4, TABLE_NUMBERS)}</strong> with {plan.reusedCount} vessel{plan.reusedCount === 1 ? "" : "s"} reused. A reused vessel takes one parallel
            position of a stage when it holds at least that position&apos;s share of the volume.
          </p>
        </>
      )}
    </section>
  );
}
