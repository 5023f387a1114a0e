import { Cautions } from "@/components/cautions/cautions";
import { formatNumber } from "@/lib/charts/volume-units";

export interface RatingAnswer {
  kineticsVersion: { id: string; version: number; modelName: string };
  stages: {
    type: "CSTR" | "PFR";
    volume: number;
    tag: string | null;
    conversionIn: number;
    conversionOut: number;
    temperatureIn: number;
    temperatureOut: number;
    multiple: boolean;
    steadyStates: { conversionOut: number; temperatureOut: number }[];
  }[];
  conversionOut: number;
  target: number;
  meetsTarget: boolean;
  largestFeed: { flowA: number | null; feedVolumetricFlow: number | null; conversion: number | null; reason: string | null; why: string };
  cautions: string[];
}

/** What a fixed train reaches, stage by stage, and the largest feed that still meets the target. */
export function RatingResultView({ result: r }: { result: RatingAnswer }) {
  const multiple = r.stages.filter((s) => s.multiple);
  return (
    <div className="space-y-4" data-testid="rating-result">
      <section className="card p-4" aria-labelledby="rate-summary-title">
        <h2 id="rate-summary-title">Result</h2>
        <dl className="mt-2 grid grid-cols-1 gap-3 sm:grid-cols-3">
          <div>
            <dt className="text-xs uppercase tracking-wide text-ink-soft">Conversion reached</dt>
            <dd className="num text-base" data-testid="rating-conversion">
              {formatNumber(r.conversionOut, 5)} {r.meetsTarget ? "✓ meets" : "✕ below"} the target {formatNumber(r.target, 4)}
            </dd>
          </div>
          <div>
            <dt className="text-xs uppercase tracking-wide text-ink-soft">Largest feed of A still meeting the target</dt>
            <dd className="num text-base" data-testid="rating-largest-feed">
              {r.largestFeed.flowA === null ? r.largestFeed.reason : `${formatNumber(r.largestFeed.flowA, 5)} mol/s`}
            </dd>
          </div>
          <div>
            <dt className="text-xs uppercase tracking-wide text-ink-soft">Feed volumetric flow there</dt>
            <dd className="num text-base">{r.largestFeed.feedVolumetricFlow === null ? "—" : `${formatNumber(r.largestFeed.feedVolumetricFlow * 3600, 4)} m³/h`}</dd>
          </div>
        </dl>
        <p className="mt-2 text-xs text-ink-soft">{r.largestFeed.why}</p>
      </section>
      <section className="card overflow-hidden" aria-labelledby="rate-stages-title">
        <h2 id="rate-stages-title" className="border-b border-line px-3 py-2">
          Stages
        </h2>
        <div className="overflow-x-auto" tabIndex={0} role="region" aria-label="Rated stages">
          <table className="table-dense" data-testid="rating-stages">
            <caption className="sr-only">Rated stages: conversion and temperature in and out</caption>
            <thead>
              <tr>
                <th scope="col">Stage</th>
                <th scope="col">Volume, m³</th>
                <th scope="col">X in → out</th>
                <th scope="col">T in → out, K</th>
                <th scope="col">Steady states</th>
              </tr>
            </thead>
            <tbody>
              {r.stages.map((s, i) => (
                <tr key={i}>
                  <td className="whitespace-nowrap">
                    <span className="num">{i + 1}</span> {s.type}
                    {s.tag ? <span className="text-ink-soft"> ({s.tag})</span> : null}
                  </td>
                  <td className="num">{formatNumber(s.volume, 4)}</td>
                  <td className="num whitespace-nowrap">
                    {formatNumber(s.conversionIn, 4)} → {formatNumber(s.conversionOut, 4)}
                  </td>
                  <td className="num whitespace-nowrap">
                    {formatNumber(s.temperatureIn, 5)} → {formatNumber(s.temperatureOut, 5)}
                  </td>
                  <td>{s.multiple ? <strong>⚠ {s.steadyStates.length} (X = {s.steadyStates.map((x) => formatNumber(x.conversionOut, 3)).join(", ")})</strong> : "one"}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      </section>
      <Cautions warnings={multiple.length ? [r.cautions[0]] : []} />
    </div>
  );
}
