"use client";

import { keepPreviousData, useQuery } from "@tanstack/react-query";
import { useEffect } from "react";
import { LineChart } from "@/components/charts/line-chart";
import { Cautions } from "@/components/cautions/cautions";
import { ApiError, fetchJson } from "@/lib/client/fetch-json";
import { formatNumber } from "@/lib/format/numbers";
import type { NetworkKineticsSpec } from "@/lib/schemas/network-spec";
import type { NetworkPreviewAnswer } from "@/lib/services/views";
import { formatQuantity, unitLabel } from "@/lib/units/display";
import { bestProduct, pathSeries, residenceTimeAt, selectivityRange, selectivitySeries, timeUnitFor, type PathsView } from "./network-chart-data";
import { useDebounced } from "./preview-panel";

/** Typing pauses this long before the charts are recomputed (a stale request is cancelled). */
export const NETWORK_PREVIEW_DEBOUNCE_MS = 300;

interface Props {
  /** The draft chemistry as JSON, or null while the form has errors. */
  specJson: string | null;
  /** The unit the key reactant's feed was typed in: the charts read in it. */
  concUnit: string;
  /** Receives the engine's field errors of the draft (keys "spec.<path>"), {} when it accepts it. */
  onEngineErrors: (fields: Record<string, string[]>) => void;
}

export function NetworkPreviewPanel({ specJson, concUnit, onEngineErrors }: Props) {
  const request = useDebounced(specJson, NETWORK_PREVIEW_DEBOUNCE_MS);
  const query = useQuery({
    queryKey: ["network-preview", request],
    enabled: request !== null,
    placeholderData: keepPreviousData,
    retry: false,
    staleTime: 60_000,
    // The signal cancels the request of a draft typed over before its answer came.
    queryFn: ({ signal }) => fetchJson<NetworkPreviewAnswer>("/api/kinetics/preview", { method: "POST", json: { spec: JSON.parse(request!) as NetworkKineticsSpec }, signal }),
  });

  const err = query.error;
  useEffect(() => {
    if (err instanceof ApiError && err.status === 400) onEngineErrors(err.fields);
    else if (query.isSuccess) onEngineErrors({});
  }, [err, query.isSuccess, query.data, onEngineErrors]);

  // A chart of an earlier draft must not stand beside fields that now hold an error.
  const current = specJson !== null && !err;
  const paths = current ? (query.data?.paths as PathsView | undefined) : undefined;
  const stale = query.isFetching || request !== specJson;
  const longest = paths ? Math.max(0, ...paths.tube.map((p) => p.residenceTime), ...paths.tanks.map((p) => p.residenceTime)) : 0;
  const timeUnit = timeUnitFor(longest);
  const c = unitLabel("concentration", concUnit);
  const t = unitLabel("time", timeUnit);

  return (
    <section className="card space-y-4 p-4" aria-labelledby="network-preview-title" data-testid="network-preview" aria-busy={stale}>
      <div>
        <h2 id="network-preview-title">Concentration path and selectivity of the draft</h2>
        <p className="text-xs text-ink-soft">A single tube and single stirred tanks of every size, fed as above; redrawn as you type.</p>
      </div>
      {paths ? (
        <>
          <PathChart paths={paths} concUnit={concUnit} timeUnit={timeUnit} c={c} t={t} />
          {paths.product !== null ? <SelectivityChart paths={paths} concUnit={concUnit} c={c} /> : null}
        </>
      ) : (
        <div className="flex h-[300px] flex-col items-center justify-center gap-1 rounded border border-dashed border-line px-6 text-center text-ink-soft" role="status">
          <p className="font-medium text-ink">{query.isPending && request !== null && !err ? "Drawing the paths…" : "No chart yet"}</p>
          <p className="text-sm">
            {specJson === null
              ? "Waiting for a valid value in every field: fix the fields marked with ✕ and the charts appear here."
              : err
                ? "No chart for this draft; see the message below."
                : "Waiting for the draft…"}
          </p>
        </div>
      )}
      {stale && paths ? <p className="text-xs text-ink-soft" role="status">Updating…</p> : null}
      {err ? (
        <div role="alert" className="rounded border border-red-200 bg-red-50 px-3 py-2 text-sm text-red-800" data-testid="preview-error">
          <span aria-hidden="true">✕ </span>
          {err instanceof ApiError ? err.message : "The charts could not be computed; check your connection."}
        </div>
      ) : null}
      <Cautions compact />
    </section>
  );
}

function PathChart({ paths, concUnit, timeUnit, c, t }: { paths: PathsView; concUnit: string; timeUnit: "s" | "min" | "h"; c: string; t: string }) {
  const product = paths.product;
  const tube = bestProduct(paths.tube);
  const tank = bestProduct(paths.tanks.filter((p) => !p.steadyState));
  const several = paths.tanks.some((p) => (p.steadyState ?? 0) > 0);
  return (
    <div>
      <h3 className="text-sm font-semibold">Concentration path</h3>
      <LineChart
        testId="network-path-chart"
        series={pathSeries(paths, concUnit, timeUnit)}
        xLabel={product ? `C ${paths.key}, ${c}` : `Residence time, ${t}`}
        yLabel={product ? `C ${product}, ${c}` : `C ${paths.key}, ${c}`}
        summary={
          product
            ? `Concentration of ${product} against that of ${paths.key} for a single tube and for single stirred tanks; the figures are in the table below.`
            : `Concentration of ${paths.key} against residence time for a single tube and for single stirred tanks.`
        }
        height={280}
      />
      {several ? <p className="mt-1 text-xs text-ink-soft">Some tank sizes have several steady states (marked); a train continues from the one of lowest conversion.</p> : null}
      {product ? (
        <table className="table-dense mt-2" data-testid="best-product">
          <caption className="sr-only">Highest concentration of {product}</caption>
          <thead>
            <tr>
              <th scope="col">From the feed</th>
              <th scope="col" className="text-right">Highest C {product}</th>
              <th scope="col" className="text-right">at residence time</th>
              <th scope="col" className="text-right">Conversion there</th>
            </tr>
          </thead>
          <tbody>
            {(
              [
                ["Single tube", tube, "best-tube"],
                ["Single stirred tank", tank, "best-tank"],
              ] as const
            ).map(([label, best, id]) => (
              <tr key={id}>
                <th scope="row">{label}</th>
                <td className="num text-right" data-testid={`${id}-product`}>
                  {formatQuantity("concentration", best?.product, concUnit)}
                </td>
                <td className="num text-right" data-testid={`${id}-time`}>
                  {formatQuantity("time", best?.residenceTime, timeUnit)}
                </td>
                <td className="num text-right">{best ? `${formatNumber(best.conversion * 100, 3)} %` : "—"}</td>
              </tr>
            ))}
          </tbody>
        </table>
      ) : (
        <>
          <p className="mt-2 rounded border border-line bg-paper px-3 py-2 text-sm" role="note">
            Choose a wanted product above to see its concentration path against {paths.key} and the selectivity.
          </p>
          <dl className="mt-2 grid grid-cols-2 gap-3 text-sm" data-testid="key-readout">
            {(
              [
                ["Single tube", residenceTimeAt(paths.tube, 0.9)],
                ["Single stirred tank", residenceTimeAt(paths.tanks.filter((p) => !p.steadyState), 0.9)],
              ] as const
            ).map(([label, tau]) => (
              <div key={label} className="rounded border border-line p-2">
                <dt className="text-xs uppercase tracking-wide text-ink-soft">{label} to 90 % conversion</dt>
                <dd className="num font-semibold">{tau === null ? "not reached in the range drawn" : formatQuantity("time", tau, timeUnit)}</dd>
              </div>
            ))}
          </dl>
        </>
      )}
    </div>
  );
}

function SelectivityChart({ paths, concUnit, c }: { paths: PathsView; concUnit: string; c: string }) {
  const along = paths.tube.filter((p) => p.selectivity !== null);
  const atFeed = along[0];
  const atEnd = along.at(-1);
  const series = selectivitySeries(paths, concUnit);
  const { range, cut } = selectivityRange(series);
  return (
    <div>
      <h3 className="text-sm font-semibold">Instantaneous selectivity to {paths.product}</h3>
      <LineChart
        testId="network-selectivity-chart"
        series={series}
        yRange={range}
        xLabel={`C ${paths.key}, ${c}`}
        yLabel={`${paths.product} formed per ${paths.key} used`}
        summary={`Instantaneous selectivity to ${paths.product} against the concentration of ${paths.key} along a single tube.`}
        height={220}
      />
      {cut ? <p className="mt-1 text-xs text-ink-soft">Below −1, where {paths.product} is used up faster than {paths.key}, the curve is cut off.</p> : null}
      <dl className="mt-2 grid grid-cols-2 gap-3 text-sm" data-testid="selectivity-readout">
        <div className="rounded border border-line p-2">
          <dt className="text-xs uppercase tracking-wide text-ink-soft">At the feed</dt>
          <dd className="num font-semibold">{formatNumber(atFeed?.selectivity, 4)}</dd>
        </div>
        <div className="rounded border border-line p-2">
          <dt className="text-xs uppercase tracking-wide text-ink-soft">At the tube&apos;s last point drawn, {formatNumber(atEnd ? atEnd.conversion * 100 : null, 3)} % conversion</dt>
          <dd className="num font-semibold">{formatNumber(atEnd?.selectivity, 4)}</dd>
        </div>
      </dl>
    </div>
  );
}
