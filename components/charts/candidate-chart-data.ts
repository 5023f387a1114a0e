import type { ChartStage, ChartStageBasis, Point } from "@/lib/charts/levenspiel-geometry";
import type { StagePlot } from "@/lib/engine";

/** The chart's inputs from a candidate's stored stages and their plot data. */
export function chartInputs(stages: ChartStageBasis[], plots: StagePlot[] | undefined) {
  const curve: Point[] = (plots ?? []).flatMap((p) => p.curve);
  const chartStages: ChartStage[] = stages.map((s, i) => {
    const recycle = plots?.[i]?.recycle;
    return { type: s.type, conversionIn: s.conversionIn, conversionOut: s.conversionOut, volume: s.volume, area: plots?.[i]?.area, ...(recycle ? { recycle } : {}) };
  });
  return { curve, stages: chartStages };
}
