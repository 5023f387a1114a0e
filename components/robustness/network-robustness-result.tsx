"use client";

import type { NetworkRobustnessRunResult } from "@/lib/schemas/robustness";
import { SampleHistogram } from "./sample-histogram";

const pct = (x: number | null | undefined, digits = 1) => (x === null || x === undefined || !Number.isFinite(x) ? "—" : `${(100 * x).toFixed(digits)} %`);

/** The chance of missing the minimum yield in the words the panel and its tests use. */
export const missYieldText = (r: NetworkRobustnessRunResult) =>
  r.probabilityMissMinYield === null ? "No minimum yield is set for this sweep" : `Chance of missing the minimum yield: ${pct(r.probabilityMissMinYield, 0)}`;

/** One sentence a screen reader gets in place of the chart, and everyone gets beside it. */
export function networkResultSummary(r: NetworkRobustnessRunResult): string {
  const p = r.product ?? "the wanted product";
  const y = r.yield;
  const yieldPart = y ? `the yield of ${p} was ${pct(y.p5)} or more in 95 % of them, ${pct(y.p50)} at the median and at most ${pct(y.p95)} in 95 %; ` : "";
  const limits = [r.minConversion !== null ? `minimum conversion ${pct(r.minConversion)}` : null, r.minYield !== null ? `minimum yield ${pct(r.minYield)}` : null].filter(Boolean).join(" and ");
  return (
    `Over ${r.samples.toLocaleString("en")} samples (random seed ${r.seed}) ${yieldPart}the conversion of the key reactant was ${pct(r.conversion.p50)} at the median. ` +
    (r.probabilityMissMinYield !== null ? `The train missed the minimum yield in ${pct(r.probabilityMissMinYield)} of the samples (± ${pct(r.probabilityMissMinYieldStandardError, 2)} standard error). ` : "") +
    (limits ? `It met every limit (${limits}) in ${pct(r.probabilityMeet)} of them` : `No limits are set, so every rated sample counts as meeting them (${pct(r.probabilityMeet)})`) +
    (r.refusedSamples ? `; ${r.refusedSamples} samples could not be rated and count as misses.` : ".")
  );
}

/** Yield and conversion spreads, the chance of missing the minimum yield, and the yield's histogram with that minimum marked. */
export function NetworkRobustnessResult({ result: r }: { result: NetworkRobustnessRunResult }) {
  const p = r.product ?? "product";
  const tiles: [string, string][] = [
    ...(r.yield
      ? ([
          [`Yield of ${p} P5 / P50 / P95`, `${pct(r.yield.p5)} / ${pct(r.yield.p50)} / ${pct(r.yield.p95)}`],
          [`Mean yield of ${p}`, pct(r.yield.mean, 2)],
        ] as [string, string][])
      : []),
    ["Conversion P5 / P50 / P95", `${pct(r.conversion.p5)} / ${pct(r.conversion.p50)} / ${pct(r.conversion.p95)}`],
    ["Chance of meeting every limit", pct(r.probabilityMeet)],
  ];
  const showYield = !!r.yield;
  return (
    <div className="space-y-3" data-testid="robustness-result">
      <p className="text-base font-medium" data-testid="robustness-miss-yield">
        {missYieldText(r)}
      </p>
      <dl className="grid grid-cols-2 gap-2 sm:grid-cols-4">
        {tiles.map(([k, v]) => (
          <div key={k} className="rounded border border-line px-2 py-1">
            <dt className="text-xs text-ink-soft">{k}</dt>
            <dd className="num text-sm">{v}</dd>
          </div>
        ))}
      </dl>
      <p className="text-xs text-ink-soft">
        At the nominal inputs: conversion {pct(r.nominal?.conversion, 2)}
        {r.product ? `, yield of ${r.product} ${pct(r.nominal?.yield, 2)}` : ""} · samples that could not be rated {r.refusedSamples}
      </p>
      <div className="grid gap-3 md:grid-cols-[3fr_2fr]">
        <div>
          <SampleHistogram
            bins={showYield ? r.yield!.histogram : r.conversion.histogram}
            limit={showYield ? r.minYield : r.minConversion}
            limitLabel={showYield ? `minimum yield ${pct(r.minYield)}` : `minimum conversion ${pct(r.minConversion)}`}
            xLabel={showYield ? `Yield of ${p}, %` : "Conversion of the key reactant, %"}
            summary={`Histogram of the ${showYield ? "yield" : "conversion"} over the samples. ${networkResultSummary(r)}`}
            testId="robustness-histogram"
          />
          <p className="text-xs text-ink-soft">Dashed line: the {showYield ? "minimum yield" : "minimum conversion"}. Bars to its left are samples that miss it.</p>
        </div>
        <p className="text-sm" data-testid="robustness-summary">
          {networkResultSummary(r)}
        </p>
      </div>
    </div>
  );
}
