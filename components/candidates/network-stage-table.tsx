import { StageLabelCell, StageTableFrame } from "./stage-table-parts";
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
    <StageTableFrame caption={caption} testId="network-stage-table">
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
            <StageLabelCell index={i} type={s.type} />
            <td className="num">{formatVolume(s.volume, unit, 4)}</td>
            <td className="num">{formatNumber(fromSI("time", s.residenceTime, timeUnit), 4, TABLE_NUMBERS)}</td>
            <td className="num">{formatNumber(fromSI("temperature", s.temperature, tUnit), 5, TABLE_NUMBERS)}</td>
          </tr>
        ))}
      </tbody>
    </StageTableFrame>
  );
}
