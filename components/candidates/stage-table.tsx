import { StageLabelCell, StageTableFrame } from "./stage-table-parts";
import type { StoredStage } from "@/lib/sweeps/stored-json";
import { useDisplayUnits } from "@/components/layout/display-units-context";
import { formatVolume, type VolumeUnit } from "@/lib/charts/volume-units";
import { fromSI, unitLabel } from "@/lib/units/display";
import { formatNumber, TABLE_NUMBERS } from "@/lib/format/numbers";

/** Stages of one train: type, conversions, recycle ratios (tubes with recycle), temperatures, volume, residence time, vessels and cost. */
export function StageTable({ stages, unit, caption }: { stages: StoredStage[]; unit: VolumeUnit; caption: string }) {
  const anyCost = stages.some((s) => s.cost !== null);
  // Only a tube with recycle has a recycle ratio; the column is there when the train has one.
  const anyRecycle = stages.some((s) => s.type === "PFR-recycle");
  // Temperatures follow the user's display-unit setting; the engine's values are kelvin.
  const tUnit = useDisplayUnits().temperature;
  const t = (k: number) => formatNumber(fromSI("temperature", k, tUnit), 5, TABLE_NUMBERS);
  return (
    <StageTableFrame caption={caption} testId="stage-table">
      <thead>
        <tr>
          <th scope="col">Stage</th>
          <th scope="col">X in → out</th>
          {anyRecycle ? <th scope="col">Recycle ratio R</th> : null}
          <th scope="col">T in → out, {unitLabel("temperature", tUnit)}</th>
          <th scope="col">Volume</th>
          <th scope="col">Residence time, s</th>
          <th scope="col">Vessels</th>
          {anyCost ? <th scope="col">Cost</th> : null}
        </tr>
      </thead>
      <tbody>
        {stages.map((s, i) => (
          <tr key={i}>
            <StageLabelCell index={i} type={s.type} />
            <td className="num whitespace-nowrap">
              {formatNumber(s.conversionIn, 4, TABLE_NUMBERS)} → {formatNumber(s.conversionOut, 4, TABLE_NUMBERS)}
            </td>
            {anyRecycle ? <td className="num">{s.type === "PFR-recycle" ? formatNumber(s.recycleRatio ?? null, 3, TABLE_NUMBERS) : "—"}</td> : null}
            <td className="num whitespace-nowrap">
              {t(s.temperatureIn)} → {t(s.temperatureOut)}
            </td>
            <td className="num whitespace-nowrap">{formatVolume(s.volume, unit, 4)}</td>
            <td className="num">{formatNumber(s.residenceTime, 4, TABLE_NUMBERS)}</td>
            <td className="num whitespace-nowrap">
              {s.vessels.count} × {formatVolume(s.vessels.sizeEach, unit, 4)}
            </td>
            {anyCost ? <td className="num">{formatNumber(s.cost, 4, TABLE_NUMBERS)}</td> : null}
          </tr>
        ))}
      </tbody>
    </StageTableFrame>
  );
}
