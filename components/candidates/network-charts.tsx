"use client";

import { useMemo } from "react";
import { LineChart } from "@/components/charts/line-chart";
import { unitLabel } from "@/lib/units/display";
import { pathSeries, profileSeries, stageSpans } from "./network-results-data";
import type { NetworkPaths, NetworkProfiles } from "./network-types";

/** C_product against C_key: the single tube and tanks from the feed, and each stage of this train. */
export function NetworkPathChart({ paths, profiles, unit, height = 320 }: { paths: NetworkPaths; profiles: NetworkProfiles; unit: string; height?: number }) {
  const series = useMemo(() => pathSeries(paths, profiles, unit), [paths, profiles, unit]);
  if (!series || !paths.product) return <p className="text-sm text-ink-soft">The sweep ranks by volume without a wanted product, so there is no concentration path to draw.</p>;
  const u = unitLabel("concentration", unit);
  return (
    <LineChart
      series={series}
      xLabel={`${paths.key}, ${u}`}
      yLabel={`${paths.product}, ${u}`}
      summary={`Concentration path: ${paths.product} against ${paths.key} for a single tube, single stirred tanks and each stage of this train.`}
      height={height}
      testId="path-chart"
    />
  );
}

/** Every species against cumulative residence time through the train, the stages shaded and named. */
export function NetworkProfilesChart({ profiles, unit, timeUnit, height = 320 }: { profiles: NetworkProfiles; unit: string; timeUnit: string; height?: number }) {
  const series = useMemo(() => profileSeries(profiles, unit, timeUnit), [profiles, unit, timeUnit]);
  const bands = useMemo(() => stageSpans(profiles, timeUnit), [profiles, timeUnit]);
  const end = bands.length ? bands[bands.length - 1]!.to : 0;
  return (
    <LineChart
      series={series}
      xLabel={`Cumulative residence time, ${unitLabel("time", timeUnit)}`}
      yLabel={`Concentration, ${unitLabel("concentration", unit)}`}
      summary={`Concentration profiles of ${profiles.species.join(", ")} through the train's ${profiles.stages.length} stages against cumulative residence time.`}
      height={height}
      testId="profiles-chart"
      bands={bands}
      xRange={end > 0 ? [0, end] : undefined}
    />
  );
}
