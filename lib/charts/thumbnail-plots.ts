import type { StagePlot } from "@/lib/engine";
import { sharedYMax, type ChartStageBasis } from "./levenspiel-geometry";

/** Points per stage a 112-pixel thumbnail needs: the full 25 add nothing visible at that size. */
export const THUMBNAIL_POINTS = 9;

type Point = [number, number];

/** `points` cut to at most `max`, evenly, always keeping the first and the last (the stage's ends). */
function thin(points: readonly Point[], max: number): Point[] {
  if (points.length <= max) return [...points];
  const step = (points.length - 1) / (max - 1);
  return Array.from({ length: max }, (_, i) => points[Math.round(i * step)]);
}

/**
 * A stage's plot data cut down for a thumbnail: its curve thinned, and its outline's top edge thinned
 * with both base corners kept. What the ranked table draws; the candidate page draws the full points.
 */
export function thumbnailPlot(plot: StagePlot): StagePlot {
  const area = plot.area as Point[];
  const outline = area.length <= THUMBNAIL_POINTS + 2 ? [...area] : [area[0], ...thin(area.slice(1, -1), THUMBNAIL_POINTS), area[area.length - 1]];
  const out: StagePlot = { curve: thin(plot.curve as Point[], THUMBNAIL_POINTS), area: outline };
  // A tube with recycle keeps its ratio, its tube's inlet and its area under the curve, thinned the same way.
  if (plot.recycle) {
    const under = plot.recycle.underCurve as Point[];
    const thinned = under.length <= THUMBNAIL_POINTS + 2 ? [...under] : [under[0], ...thin(under.slice(1, -1), THUMBNAIL_POINTS), under[under.length - 1]];
    out.recycle = { ...plot.recycle, underCurve: thinned };
  }
  return out;
}

/**
 * Samples of a PFR's top in a thumbnail (the full chart takes 200): a stage is at most about a
 * hundred pixels wide there, so 24 chords of at most a few pixels each follow the curve as closely
 * as the eye can tell.
 */
export const THUMBNAIL_TOP_POINTS = 24;

/** The height every thumbnail of a table page is drawn to, m3: the tallest of them, so that they compare at a glance. */
export function thumbnailYMax(rows: readonly { feasible: boolean; stages: ChartStageBasis[]; levenspiel?: StagePlot[] | null }[], target?: number): number | undefined {
  const charts = rows
    .filter((r) => r.feasible && r.levenspiel?.length)
    .map((r) => ({
      // As the thumbnail draws it (components/charts/candidate-chart-data.ts): the stages' curves joined, each stage its own outline.
      curve: r.levenspiel!.flatMap((p) => p.curve as Point[]),
      stages: r.stages.map((s, i) => {
        const recycle = r.levenspiel![i]?.recycle;
        return { type: s.type, conversionIn: s.conversionIn, conversionOut: s.conversionOut, volume: s.volume, area: r.levenspiel![i]?.area as Point[] | undefined, ...(recycle ? { recycle } : {}) };
      }),
      target,
      topPoints: THUMBNAIL_TOP_POINTS,
    }));
  return charts.length ? sharedYMax(charts) : undefined;
}
