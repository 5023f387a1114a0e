import type { StagePlot } from "@/lib/engine";

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
  return { curve: thin(plot.curve as Point[], THUMBNAIL_POINTS), area: outline };
}
