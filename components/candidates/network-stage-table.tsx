import { StageSwatch } from "@/components/charts/stage-patterns";
import { StageGlyph } from "@/components/sweeps/stage-badges";
import { useDisplayUnits } from "@/components/layout/display-units-context";
import { formatVolume, type VolumeUnit } from "@/lib/charts/volume-units";
import { formatNumber, TABLE_NUMBERS } from "@/lib/format/numbers";
import { fromSI, unitLabel } from "@/lib/units/display";
import type { NetworkStageResult } from "@/lib/engine";

/** The stages of a train of several reactions: type, volume, residence time and temperature. */
export function NetworkStageTable({ stages, unit, timeUnit, caption }: { stages: NetworkStageResult[]; unit: VolumeUnit; timeUnit: string; caption: string }) {
  // Temperatures follow the user's display-unit setting; the engine's values are kelvin.
  const tUnit = useDisplayUnits().temperature;
  return (
    <div className="overflow-x-auto" tabIndex={0} role="region" aria-label={caption}>
      <table className="table-dense" data-testid="network-stage-table">
        <caption className="sr-only">{caption}</caption>
        <thead>
          <tr>
            <th scope="col">Stage</th>
            <th scope="col">Volume</th>
            <th scope="col">Residence time, {unitLabel("time", timeUnit)}</th>
            <th scope="col">Temperature, {unitLabel("temperature", tUnit)}</th>
          </tr>
        </thead>
        <tbody>
          {stages.map((s, i) => (
            <tr key={i}>
              <td>
                <span className="inline-flex items-center gap-1.5 whitespace-nowrap">
                  <StageSwatch index={i} />
                  <span className="num">{i + 1}</span>
                  <StageGlyph type={s.type} />
                  {s.type}
                </span>
              </td>
              <td className="num">{formatVolume(s.volume, unit, 4)}</td>
              <td className="num">{formatNumber(fromSI("time", s.residenceTime, timeUnit), 4, TABLE_NUMBERS)}</td>
              <td className="num">{formatNumber(fromSI("temperature", s.temperature, tUnit), 5, TABLE_NUMBERS)}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
