"use client";

import { useState } from "react";
import { FIT_LAW_INFO, type LawFitOut } from "@/lib/schemas/fits";
import { formatNumber, RECORD_NUMBERS } from "@/lib/format/numbers";

type Ok = Extract<LawFitOut, { ok: true }>;
type SortKey = "rss" | "rSquared" | "aic";
const SORTS: { key: SortKey; label: string; better: "asc" | "desc" }[] = [
  { key: "rss", label: "RSS", better: "asc" },
  { key: "rSquared", label: "R²", better: "desc" },
  { key: "aic", label: "AIC", better: "asc" },
];

/** The fits side by side, sortable by RSS, R² or AIC; refused laws listed below with their reason. */
export function FitComparison({ fits, selected, onSelect, criterion }: { fits: LawFitOut[]; selected: string | null; onSelect: (law: string) => void; criterion: string }) {
  const [sort, setSort] = useState<{ key: SortKey; dir: "asc" | "desc" }>({ key: "aic", dir: "asc" });
  const ok = fits.filter((f): f is Ok => f.ok);
  const failed = fits.filter((f) => !f.ok);
  const value = (f: Ok, k: SortKey) => (k === "aic" ? (f.aic ?? -Infinity) : f[k]);
  const rows = [...ok].sort((a, b) => (sort.dir === "asc" ? 1 : -1) * (value(a, sort.key) - value(b, sort.key)));

  return (
    <section className="card overflow-hidden" aria-labelledby="fit-comparison-title">
      <h2 id="fit-comparison-title" className="border-b border-line px-3 py-2">
        Comparison of the fits
      </h2>
      {rows.length ? (
        <div className="overflow-x-auto">
          <table className="table-dense" data-testid="fit-comparison">
            <caption className="sr-only">Fitted rate laws; sort by RSS, R² or AIC with the column buttons</caption>
            <thead>
              <tr>
                <th scope="col">Shown</th>
                <th scope="col">Law</th>
                <th scope="col">Parameters (value ± SE, 95 % interval)</th>
                {SORTS.map((s) => (
                  <th key={s.key} scope="col" aria-sort={sort.key === s.key ? (sort.dir === "asc" ? "ascending" : "descending") : "none"}>
                    <button
                      type="button"
                      className="font-semibold underline-offset-2 hover:underline"
                      onClick={() => setSort((cur) => ({ key: s.key, dir: cur.key === s.key ? (cur.dir === "asc" ? "desc" : "asc") : s.better }))}
                    >
                      {s.label}
                      <span aria-hidden="true">{sort.key === s.key ? (sort.dir === "asc" ? " ▲" : " ▼") : " ↕"}</span>
                    </button>
                  </th>
                ))}
                <th scope="col">Points / dof</th>
              </tr>
            </thead>
            <tbody>
              {rows.map((f) => (
                <tr key={f.law} data-testid={`fit-row-${f.law}`}>
                  <td>
                    <input
                      type="radio"
                      name="fit-shown"
                      aria-label={`Show plots of the ${FIT_LAW_INFO[f.law].label.toLowerCase()}`}
                      checked={selected === f.law}
                      onChange={() => onSelect(f.law)}
                    />
                  </td>
                  <td>
                    <div className="font-medium">{FIT_LAW_INFO[f.law].label}</div>
                    <div className="font-mono text-xs text-ink-soft">{f.formula}</div>
                    {f.status !== "converged" ? <div className="text-xs text-red-800">Stopped before converging</div> : null}
                  </td>
                  <td>
                    <ul className="space-y-0.5">
                      {f.parameters.map((p) => (
                        <li key={p.name} className="num whitespace-nowrap text-sm">
                          {p.name} = {formatNumber(p.value, 4, RECORD_NUMBERS)} ± {formatNumber(p.standardError, 2, RECORD_NUMBERS)} {p.unit !== "—" ? p.unit : ""}
                          <span className="text-ink-soft">
                            {" "}
                            [{formatNumber(p.interval95[0], 4, RECORD_NUMBERS)}, {formatNumber(p.interval95[1], 4, RECORD_NUMBERS)}]
                          </span>
                        </li>
                      ))}
                      {f.referenceTemperature ? <li className="num text-xs text-ink-soft">T_ref = {formatNumber(f.referenceTemperature, 4, RECORD_NUMBERS)} K</li> : null}
                    </ul>
                  </td>
                  <td className="num">{formatNumber(f.rss, 3, RECORD_NUMBERS)}</td>
                  <td className="num">{f.rSquared.toFixed(5)}</td>
                  <td className="num">{f.aic === null ? "−∞ (RSS = 0)" : f.aic.toFixed(2)}</td>
                  <td className="num">
                    {f.points} / {f.degreesOfFreedom}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      ) : (
        <p className="px-3 py-2 text-sm text-ink-soft">No law could be fitted to these points.</p>
      )}
      {failed.length ? (
        <ul className="border-t border-line px-3 py-2 text-sm" data-testid="fit-refusals">
          {failed.map((f) => (
            <li key={f.law}>
              <span aria-hidden="true">✕ </span>
              <strong>{FIT_LAW_INFO[f.law].label}</strong>: {f.ok ? "" : f.error}
            </li>
          ))}
        </ul>
      ) : null}
      <p className="border-t border-line px-3 py-2 text-xs text-ink-soft">{criterion}</p>
    </section>
  );
}
