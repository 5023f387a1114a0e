"use client";

import { Cautions } from "@/components/cautions/cautions";
import { useDisplayUnits } from "@/components/layout/display-units-context";
import { formatQuantity, fromSI, toSI, unitLabel, type UnitKind } from "@/lib/units/display";
import { formatNumber, TABLE_NUMBERS } from "@/lib/format/numbers";
import type { RatingAnswer } from "@/lib/services/views";
import { stageTypeCautions, stageTypeName } from "@/lib/stage-types";

/** What a fixed train reaches, stage by stage, and the largest feed that still meets the target. */
export function RatingResultView({ result: r, typedUnits }: { result: RatingAnswer; typedUnits?: Partial<Record<UnitKind, string>> }) {
  const multiple = r.stages.filter((s) => s.multiple);
  const anyRecycle = r.stages.some((s) => s.type === "PFR-recycle");
  // The engine answers in SI; the screen speaks the user's display-unit choice ("as typed" by default).
  const u = useDisplayUnits(Math.max(0, ...r.stages.map((s) => s.volume)) || null, typedUnits);
  const t = (k: number) => formatNumber(fromSI("temperature", k, u.temperature), 5, TABLE_NUMBERS);
  // A volumetric flow has no kind of its own: the shown volume per the shown time unit.
  const perTime = toSI("time", 1, u.time);
  const flowText = (q: number) => `${formatNumber(fromSI("volume", q * perTime, u.volume), 4, TABLE_NUMBERS)} ${unitLabel("volume", u.volume)}/${unitLabel("time", u.time)}`;
  return (
    <div className="space-y-4" data-testid="rating-result">
      <section className="card p-4" aria-labelledby="rate-summary-title">
        <h2 id="rate-summary-title">Result</h2>
        <dl className="mt-2 grid grid-cols-1 gap-3 sm:grid-cols-3">
          <div>
            <dt className="text-xs uppercase tracking-wide text-ink-soft">Conversion reached</dt>
            <dd className="num text-base" data-testid="rating-conversion">
              {formatNumber(r.conversionOut, 5, TABLE_NUMBERS)} {r.meetsTarget ? "✓ meets" : "✕ below"} the target {formatNumber(r.target, 4, TABLE_NUMBERS)}
            </dd>
          </div>
          <div>
            <dt className="text-xs uppercase tracking-wide text-ink-soft">Largest feed of A still meeting the target</dt>
            <dd className="num text-base" data-testid="rating-largest-feed">
              {r.largestFeed.flowA === null ? r.largestFeed.reason : formatQuantity("molarFlow", r.largestFeed.flowA, u.molarFlow, 5)}
            </dd>
          </div>
          <div>
            <dt className="text-xs uppercase tracking-wide text-ink-soft">Feed volumetric flow there</dt>
            <dd className="num text-base">{r.largestFeed.feedVolumetricFlow === null ? "—" : flowText(r.largestFeed.feedVolumetricFlow)}</dd>
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
                <th scope="col">Volume, {unitLabel("volume", u.volume)}</th>
                {anyRecycle ? <th scope="col">Recycle ratio R</th> : null}
                <th scope="col">X in → out</th>
                <th scope="col">T in → out, {unitLabel("temperature", u.temperature)}</th>
                <th scope="col">Steady states</th>
              </tr>
            </thead>
            <tbody>
              {r.stages.map((s, i) => (
                <tr key={i}>
                  <td className="whitespace-nowrap">
                    <span className="num">{i + 1}</span> {stageTypeName(s.type)}
                    {s.tag ? <span className="text-ink-soft"> ({s.tag})</span> : null}
                  </td>
                  <td className="num">{formatNumber(fromSI("volume", s.volume, u.volume), 4, TABLE_NUMBERS)}</td>
                  {anyRecycle ? <td className="num">{s.type === "PFR-recycle" ? formatNumber(s.recycleRatio ?? null, 4, TABLE_NUMBERS) : "—"}</td> : null}
                  <td className="num whitespace-nowrap">
                    {formatNumber(s.conversionIn, 4, TABLE_NUMBERS)} → {formatNumber(s.conversionOut, 4, TABLE_NUMBERS)}
                  </td>
                  <td className="num whitespace-nowrap">
                    {t(s.temperatureIn)} → {t(s.temperatureOut)}
                  </td>
                  <td>{s.multiple ? <strong>⚠ {s.steadyStates.length} (X = {s.steadyStates.map((x) => formatNumber(x.conversionOut, 3, TABLE_NUMBERS)).join(", ")})</strong> : "one"}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      </section>
      <Cautions warnings={multiple.length ? [r.cautions[0]] : []} more={stageTypeCautions(r.stages.map((s) => s.type))} />
    </div>
  );
}
