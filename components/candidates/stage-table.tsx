import { StageSwatch } from "@/components/charts/stage-patterns";
import { StageGlyph } from "@/components/sweeps/stage-badges";
import type { StoredStage } from "@/components/sweeps/types";
import { formatNumber, formatVolume, type VolumeUnit } from "@/lib/charts/volume-units";

/** Stages of one train: type, conversions, temperatures, volume, residence time, vessels and cost. */
export function StageTable({ stages, unit, caption }: { stages: StoredStage[]; unit: VolumeUnit; caption: string }) {
  const anyCost = stages.some((s) => s.cost !== null);
  return (
    <div className="overflow-x-auto" tabIndex={0} role="region" aria-label={caption}>
      <table className="table-dense" data-testid="stage-table">
        <caption className="sr-only">{caption}</caption>
        <thead>
          <tr>
            <th scope="col">Stage</th>
            <th scope="col">X in → out</th>
            <th scope="col">T in → out, K</th>
            <th scope="col">Volume</th>
            <th scope="col">Residence time, s</th>
            <th scope="col">Vessels</th>
            {anyCost ? <th scope="col">Cost</th> : null}
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
              <td className="num whitespace-nowrap">
                {formatNumber(s.conversionIn, 4)} → {formatNumber(s.conversionOut, 4)}
              </td>
              <td className="num whitespace-nowrap">
                {formatNumber(s.temperatureIn, 5)} → {formatNumber(s.temperatureOut, 5)}
              </td>
              <td className="num whitespace-nowrap">{formatVolume(s.volume, unit, 4)}</td>
              <td className="num">{formatNumber(s.residenceTime, 4)}</td>
              <td className="num whitespace-nowrap">
                {s.vessels.count} × {formatVolume(s.vessels.sizeEach, unit, 4)}
              </td>
              {anyCost ? <td className="num">{formatNumber(s.cost, 4)}</td> : null}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
