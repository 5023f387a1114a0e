"use client";

import { keepPreviousData, useQuery } from "@tanstack/react-query";
import { UnitOptions } from "@/components/ui/unit-options";
import { useEffect, useState } from "react";
import { LevenspielChart } from "@/components/charts/levenspiel-chart";
import { Cautions } from "@/components/cautions/cautions";
import { thermalWarnings } from "@/lib/engine";
import { ApiError, fetchJson } from "@/lib/client/fetch-json";
import type { KineticsSpec } from "@/lib/schemas/sweeps";
import type { KineticsPreview } from "@/lib/services/kinetics-checks";
import { formatQuantity, type VolumeUnit } from "@/lib/units/display";
import { formatNumber } from "@/lib/format/numbers";
import type { StageType } from "@/lib/engine";

/** The value, once it has stayed the same for `ms`. */
export function useDebounced<T>(value: T, ms: number): T {
  const [settled, setSettled] = useState(value);
  useEffect(() => {
    const t = setTimeout(() => setSettled(value), ms);
    return () => clearTimeout(t);
  }, [value, ms]);
  return settled;
}

export const PREVIEW_DEBOUNCE_MS = 250;

interface Props {
  /** The draft spec as JSON, or null while the form has errors. */
  specJson: string | null;
  /** Conversion to size the single stages to (text as typed). */
  target: string;
  onTarget: (t: string) => void;
  targetError?: string;
  /** Receives the engine's field errors of the draft (keys "spec.<path>"), {} when it accepts it. */
  onEngineErrors: (fields: Record<string, string[]>, message: string | null) => void;
}

type Shown = "both" | StageType;

export function PreviewPanel({ specJson, target, onTarget, targetError, onEngineErrors }: Props) {
  const [volumeUnit, setVolumeUnit] = useState<VolumeUnit>("L");
  const [shown, setShown] = useState<Shown>("both");
  const targetNumber = Number(target);
  const targetOk = target.trim() !== "" && targetNumber > 0 && targetNumber < 1;
  const request = useDebounced(specJson && targetOk ? `${specJson}|${targetNumber}` : null, PREVIEW_DEBOUNCE_MS);
  const query = useQuery({
    queryKey: ["kinetics-preview", request],
    enabled: request !== null,
    placeholderData: keepPreviousData,
    retry: false,
    staleTime: 60_000,
    queryFn: async ({ signal }) => {
      // The spec itself may hold "|" (a rate constant's shown unit is "mol/L|h"): split at the last one.
      const cut = request!.lastIndexOf("|");
      const spec = request!.slice(0, cut);
      const t = request!.slice(cut + 1);
      const started = performance.now();
      const body = await fetchJson<{ preview: KineticsPreview }>("/api/kinetics/preview", {
        method: "POST",
        json: { spec: JSON.parse(spec) as KineticsSpec, targetConversion: Number(t) },
        signal,
      });
      return { ...body.preview, elapsedMs: Math.round(performance.now() - started) };
    },
  });

  const err = query.error;
  useEffect(() => {
    if (err instanceof ApiError && err.status === 400) onEngineErrors(err.fields, err.message);
    else if (query.isSuccess) onEngineErrors({}, null);
  }, [err, query.isSuccess, query.data, onEngineErrors]);

  // A figure from an earlier draft must not stand beside fields that now hold an error.
  const current = specJson !== null && targetOk && !err;
  const p = current ? query.data : undefined;
  const spec = specJson ? (JSON.parse(specJson) as KineticsSpec) : null;
  const v0 = spec && typeof spec.feed.flowA === "number" && typeof spec.feed.concA === "number" ? spec.feed.flowA / spec.feed.concA : null;
  const stages = p
    ? [
        ...(shown !== "PFR" && p.reference.singleCSTR !== null
          ? [{ type: "CSTR" as const, conversionIn: 0, conversionOut: p.targetConversion, volume: p.reference.singleCSTR, area: p.cstrOutline }]
          : []),
        ...(shown !== "CSTR" && p.reference.singlePFR !== null
          ? [{ type: "PFR" as const, conversionIn: 0, conversionOut: p.targetConversion, volume: p.reference.singlePFR, area: p.pfrOutline }]
          : []),
      ]
    : [];
  const stale = query.isFetching || (request !== (specJson && targetOk ? `${specJson}|${targetNumber}` : null));

  return (
    <section className="card p-4" aria-labelledby="preview-title" data-testid="kinetics-preview">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h2 id="preview-title">Levenspiel plot of the draft</h2>
          <p className="text-xs text-ink-soft">FA0/(−rA) against conversion; redrawn as you type.</p>
        </div>
        <div className="flex gap-2">
          <div>
            <label htmlFor="preview-target" className="field-label">
              Target X
            </label>
            <input
              id="preview-target"
              className="input num w-20"
              inputMode="decimal"
              value={target}
              aria-invalid={!!targetError || !targetOk}
              aria-describedby={!targetOk || targetError ? "preview-target-error" : undefined}
              onChange={(e) => onTarget(e.target.value)}
            />
          </div>
          <div>
            <label htmlFor="preview-unit" className="field-label">
              Volume unit
            </label>
            <select id="preview-unit" className="input w-auto" value={volumeUnit} onChange={(e) => setVolumeUnit(e.target.value as VolumeUnit)}>
              <UnitOptions kind={"volume"} />
            </select>
          </div>
        </div>
      </div>
      {!targetOk || targetError ? (
        <p id="preview-target-error" className="field-error" role="alert">
          {targetError ?? "The target conversion is a number between 0 and 1."}
        </p>
      ) : null}

      <div className="relative mt-3 min-h-[320px]" aria-busy={stale}>
        {p && p.curve.length > 1 ? (
          <LevenspielChart curve={p.curve} stages={stages} target={p.targetConversion} equilibrium={p.equilibriumConversion} volumeUnit={volumeUnit} height={320} alternatives />
        ) : query.isPending && request !== null ? (
          <div className="flex h-[320px] items-center justify-center rounded border border-dashed border-line text-ink-soft" role="status">
            Drawing the curve…
          </div>
        ) : (
          <div className="flex h-[320px] flex-col items-center justify-center gap-1 rounded border border-dashed border-line px-6 text-center text-ink-soft" role="status">
            <p className="font-medium text-ink">No plot yet</p>
            <p className="text-sm">
              {specJson === null
                ? "Waiting for a valid value in every field: fix the fields marked with ✕ and the plot appears here."
                : !targetOk
                  ? "Waiting for a valid target X (a number between 0 and 1)."
                  : err ? "No plot for this draft; see the message below." : "Waiting for the draft…"}
            </p>
          </div>
        )}
        {stale && p ? <span className="absolute right-2 top-2 rounded bg-white/90 px-1.5 text-xs text-ink-soft">updating…</span> : null}
      </div>

      {err ? (
        <div role="alert" className="mt-3 rounded border border-red-200 bg-red-50 px-3 py-2 text-sm text-red-800" data-testid="preview-error">
          <span aria-hidden="true">✕ </span>
          {err instanceof ApiError ? err.message : "The preview could not be computed; check your connection."}
        </div>
      ) : null}

      <fieldset className="mt-3 flex flex-wrap items-center gap-3 text-sm">
        <legend className="sr-only">Single stages shown</legend>
        {(
          [
            ["both", "Both"],
            ["CSTR", "Single CSTR"],
            ["PFR", "Single PFR"],
          ] as const
        ).map(([value, label]) => (
          <label key={value} className="flex items-center gap-1">
            <input type="radio" name="preview-shown" value={value} checked={shown === value} onChange={() => setShown(value)} /> {label}
          </label>
        ))}
      </fieldset>

      <dl className="mt-3 grid grid-cols-2 gap-3 text-sm">
        <div className="rounded border border-line p-2">
          <dt className="text-xs uppercase tracking-wide text-ink-soft">Single CSTR to X = {p ? formatNumber(p.targetConversion, 3) : "—"}</dt>
          <dd className="num text-base font-semibold" data-testid="single-cstr-volume">
            {formatQuantity("volume", p?.reference.singleCSTR, volumeUnit)}
          </dd>
          <dd className="num text-xs text-ink-soft">τ {v0 && p?.reference.singleCSTR ? formatQuantity("time", p.reference.singleCSTR / v0, "s") : "—"}</dd>
        </div>
        <div className="rounded border border-line p-2">
          <dt className="text-xs uppercase tracking-wide text-ink-soft">Single PFR to X = {p ? formatNumber(p.targetConversion, 3) : "—"}</dt>
          <dd className="num text-base font-semibold" data-testid="single-pfr-volume">
            {formatQuantity("volume", p?.reference.singlePFR, volumeUnit)}
          </dd>
          <dd className="num text-xs text-ink-soft">τ {v0 && p?.reference.singlePFR ? formatQuantity("time", p.reference.singlePFR / v0, "s") : "—"}</dd>
        </div>
      </dl>
      {p?.equilibriumConversion ? (
        <p className="mt-2 text-sm text-ink-soft">
          Equilibrium limit X<sub>eq</sub> = <span className="num">{formatNumber(p.equilibriumConversion, 4)}</span>: no train passes it.
        </p>
      ) : null}
      {p ? (
        <p className="mt-1 text-xs text-ink-soft" data-testid="preview-timing" data-ms={p.elapsedMs}>
          Computed in {p.elapsedMs} ms after a {PREVIEW_DEBOUNCE_MS} ms pause in typing.
        </p>
      ) : null}
      <Cautions className="mt-3" compact warnings={thermalWarnings({ thermal: spec?.reaction.thermal })} />
    </section>
  );
}
