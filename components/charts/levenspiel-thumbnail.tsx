import { memo, useId, useMemo } from "react";
import { chartGeometry, type ChartStageBasis, type Point } from "@/lib/charts/levenspiel-geometry";
import { THUMBNAIL_TOP_POINTS } from "@/lib/charts/thumbnail-plots";
import { stageStyle } from "@/lib/charts/stage-styles";
import { fromCubicMetres, VOLUME_LABEL, type VolumeUnit } from "@/lib/charts/volume-units";
import { formatNumber, TABLE_NUMBERS } from "@/lib/format/numbers";
import { stageTypeName } from "@/lib/stage-types";
import type { StagePlot } from "@/lib/engine";
import { chartInputs } from "./candidate-chart-data";
import { StagePattern } from "./stage-patterns";

/** The thumbnail's drawing size, px: the ranked table's chart column is this wide. */
export const THUMBNAIL_WIDTH = 112;
export const THUMBNAIL_HEIGHT = 48;
const PAD = 2;

interface Props {
  stages: ChartStageBasis[];
  levenspiel: StagePlot[];
  target?: number;
  /** The height shared by every thumbnail on the page, m3, so that they compare at a glance. */
  yMax?: number;
  unit: VolumeUnit;
}

/**
 * A Levenspiel thumbnail for the ranked table: each stage's area in its colour and pattern under the
 * FA0/(−rA) curve, drawn at a fixed size as one path a stage and one for the curve. No measuring and
 * no second render (the full chart follows its box's width; a thumbnail's box never changes), and a
 * PFR's top sampled at THUMBNAIL_TOP_POINTS instead of the full chart's 200: the same picture at
 * this size, a tenth of the drawing. Memoised on the row's own arrays, so a sort, a page change or a
 * ticked compare box redraws no thumbnail whose row did not change.
 */
export const LevenspielThumbnail = memo(function LevenspielThumbnail({ stages, levenspiel, target, yMax, unit }: Props) {
  const uid = useId().replace(/[^a-zA-Z0-9_-]/g, "");
  const drawing = useMemo(() => {
    const geo = chartGeometry({ ...chartInputs(stages, levenspiel), target, yMax, topPoints: THUMBNAIL_TOP_POINTS });
    const w = THUMBNAIL_WIDTH - 2 * PAD;
    const h = THUMBNAIL_HEIGHT - 2 * PAD;
    const path = (pts: Point[]) =>
      pts.map(([x, y], i) => `${i ? "L" : "M"}${(PAD + (x / geo.xMax) * w).toFixed(1)},${(PAD + h - (Math.min(y, geo.yMax) / geo.yMax) * h).toFixed(1)}`).join("");
    const show = (m3: number) => formatNumber(fromCubicMetres(m3, unit), 3, TABLE_NUMBERS);
    const label = geo.stages.length
      ? `Levenspiel chart, ${geo.stages.length} stage${geo.stages.length === 1 ? "" : "s"}: ` +
        geo.stages.map((s) => `stage ${s.index + 1} ${stageTypeName(s.type)}${s.underCurve ? ` (recycle ratio R = ${formatNumber(s.underCurve.recycleRatio, 3, TABLE_NUMBERS)})` : ""} from X ${formatNumber(s.conversionIn, 3, TABLE_NUMBERS)} to ${formatNumber(s.conversionOut, 3, TABLE_NUMBERS)}, ${show(s.volume)} ${VOLUME_LABEL[unit]}`).join("; ")
      : "Levenspiel curve, no stages";
    return {
      label,
      areas: geo.stages.map((s) => ({ index: s.index, d: path(s.polygon) + "Z", under: s.underCurve ? path(s.underCurve.polygon) + "Z" : null })),
      curve: geo.curve.length > 1 ? path(geo.curve) : null,
    };
  }, [stages, levenspiel, target, yMax, unit]);
  return (
    <div className="w-28" data-testid="thumbnail">
      <svg width={THUMBNAIL_WIDTH} height={THUMBNAIL_HEIGHT} viewBox={`0 0 ${THUMBNAIL_WIDTH} ${THUMBNAIL_HEIGHT}`} role="img" aria-label={drawing.label} className="block">
        <defs>
          {drawing.areas.map((a) => (
            <StagePattern key={a.index} id={`${uid}-p${a.index}`} index={a.index} />
          ))}
        </defs>
        <rect width={THUMBNAIL_WIDTH} height={THUMBNAIL_HEIGHT} fill="#fff" />
        {drawing.areas.map((a) => (
          <path key={a.index} d={a.d} fill={`url(#${uid}-p${a.index})`} stroke={stageStyle(a.index).stroke} strokeWidth={1} />
        ))}
        {drawing.areas.map((a) => (a.under ? <path key={`u${a.index}`} d={a.under} fill={stageStyle(a.index).stroke} fillOpacity={0.2} stroke={stageStyle(a.index).stroke} strokeWidth={0.75} strokeDasharray="2 1.5" /> : null))}
        {drawing.curve ? <path d={drawing.curve} fill="none" stroke="#1c2430" strokeWidth={1} /> : null}
      </svg>
    </div>
  );
});
