"use client";

import { formatNumber, formatVolume, type VolumeUnit } from "@/lib/charts/volume-units";
import { fromSI, isUnit, unitLabel, type UnitKind } from "@/lib/units/display";
import type { ScenarioRow } from "./types";

const FIELD_NAMES: Record<string, string> = {
  "feed.flowA": "Feed flow FA0, mol/s",
  "feed.concA": "Feed concentration CA0, mol/m³",
  "feed.temperature": "Feed temperature, K",
  "target.conversion": "Target conversion",
};
/** The grid's fields that carry a unit, and their kind: the axis shows them in the kinetics' typed unit. */
const AXIS_KIND: Record<string, UnitKind> = { "feed.flowA": "molarFlow", "feed.concA": "concentration", "feed.temperature": "temperature" };

/** The units the kinetics was typed in, by kind (from lib/units/typed-units). */
export type TypedUnits = Partial<Record<UnitKind, string>>;

const axisUnit = (path: string, units: TypedUnits | undefined) => {
  const kind = AXIS_KIND[path];
  const unit = kind ? units?.[kind] : undefined;
  return kind && unit && isUnit(kind, unit) ? { kind, unit } : null;
};

export const fieldName = (path: string, units?: TypedUnits) => {
  const typed = axisUnit(path, units);
  const name = FIELD_NAMES[path] ?? path;
  return typed ? `${name.split(",")[0]}, ${unitLabel(typed.kind, typed.unit)}` : name;
};

/** A grid value (stored SI) on the axis, in the kinetics' typed unit when it has one. */
export const axisValue = (path: string, si: number, units?: TypedUnits) => {
  const typed = axisUnit(path, units);
  return formatNumber(typed ? fromSI(typed.kind, si, typed.unit) : si, 4);
};

export function describeOverrides(overrides: Record<string, number>): string {
  const parts = Object.entries(overrides).map(([k, v]) => `${fieldName(k).split(",")[0]} ${formatNumber(v, 4)}`);
  return parts.length ? parts.join(" · ") : "Base case";
}

export function formatObjective(v: number | null, objective: "volume" | "cost", unit: VolumeUnit): string {
  if (v === null) return "no feasible train";
  return objective === "cost" ? `cost ${formatNumber(v, 4)}` : formatVolume(v, unit);
}

export function ScenarioPicker({
  scenarios,
  value,
  onChange,
  objective,
  unit,
}: {
  scenarios: ScenarioRow[];
  value: number;
  onChange: (index: number) => void;
  objective: "volume" | "cost";
  unit: VolumeUnit;
}) {
  return (
    <div className="min-w-0 flex-1">
      <label htmlFor="scenario-picker" className="field-label">
        Scenario ({scenarios.length})
      </label>
      <select id="scenario-picker" className="input" value={value} onChange={(e) => onChange(Number(e.target.value))} data-testid="scenario-picker">
        {scenarios.map((s) => (
          <option key={s.index} value={s.index}>
            #{s.index + 1} · {describeOverrides(s.overrides)} — {s.status === "failed" ? `failed: ${s.error?.message ?? "error"}` : `best ${formatObjective(s.bestObjective, objective, unit)}`}
          </option>
        ))}
      </select>
    </div>
  );
}

/** The two fields a grid varies, when it varies exactly two. */
export function twoVariedFields(scenarios: ScenarioRow[]): [string, string] | null {
  const fields = new Map<string, Set<number>>();
  for (const s of scenarios) for (const [k, v] of Object.entries(s.overrides)) (fields.get(k) ?? fields.set(k, new Set()).get(k)!).add(v);
  const varied = [...fields].filter(([, vals]) => vals.size > 1).map(([k]) => k);
  return varied.length === 2 ? [varied[0], varied[1]] : null;
}

/**
 * Heat map of the best objective over a two-field grid: a table whose cells carry the value as
 * text and a shade (darker = larger); each cell opens its scenario.
 */
export function ObjectiveHeatMap({
  scenarios,
  fields,
  selected,
  onSelect,
  objective,
  unit,
  typedUnits,
}: {
  scenarios: ScenarioRow[];
  fields: [string, string];
  selected: number;
  onSelect: (index: number) => void;
  objective: "volume" | "cost";
  unit: VolumeUnit;
  typedUnits?: TypedUnits;
}) {
  const [fx, fy] = fields;
  const xs = [...new Set(scenarios.map((s) => s.overrides[fx]))].sort((a, b) => a - b);
  const ys = [...new Set(scenarios.map((s) => s.overrides[fy]))].sort((a, b) => a - b);
  const at = new Map(scenarios.map((s) => [`${s.overrides[fx]}|${s.overrides[fy]}`, s]));
  const values = scenarios.map((s) => s.bestObjective).filter((v): v is number => v !== null);
  const lo = Math.min(...values);
  const hi = Math.max(...values);
  const best = values.length ? lo : null;
  const shade = (v: number) => (hi > lo ? (v - lo) / (hi - lo) : 0);
  const cellText = (v: number | null) => (v === null ? "—" : objective === "cost" ? formatNumber(v, 3) : formatVolume(v, unit, 3));

  return (
    <section className="card p-4" aria-labelledby="heatmap-title" data-testid="heat-map">
      <h2 id="heatmap-title">Best {objective === "cost" ? "cost" : "total volume"} across the grid</h2>
      <p className="mt-0.5 text-xs text-ink-soft">
        Darker cells are larger; the smallest is marked ★. Choose a cell to open its scenario.
      </p>
      <div className="mt-3 overflow-x-auto">
        <table className="border-separate border-spacing-0.5 text-xs">
          <caption className="sr-only">
            Best objective by {fieldName(fy, typedUnits)} (rows) and {fieldName(fx, typedUnits)} (columns)
          </caption>
          <thead>
            <tr>
              <th scope="col" className="px-2 py-1 text-left font-medium text-ink-soft">
                {fieldName(fy, typedUnits)} ↓ / {fieldName(fx, typedUnits)} →
              </th>
              {xs.map((x) => (
                <th key={x} scope="col" className="num px-2 py-1 text-right font-medium text-ink-soft">
                  {axisValue(fx, x, typedUnits)}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {ys.map((y) => (
              <tr key={y}>
                <th scope="row" className="num px-2 py-1 text-right font-medium text-ink-soft">
                  {axisValue(fy, y, typedUnits)}
                </th>
                {xs.map((x) => {
                  const s = at.get(`${x}|${y}`);
                  if (!s) return <td key={x} className="px-2 py-1 text-ink-faint">·</td>;
                  const v = s.bestObjective;
                  const t = v === null ? 0 : shade(v);
                  const dark = t > 0.55;
                  return (
                    <td key={x} className="p-0">
                      <button
                        type="button"
                        onClick={() => onSelect(s.index)}
                        aria-pressed={s.index === selected}
                        aria-label={`${fieldName(fx, typedUnits)} ${axisValue(fx, x, typedUnits)}, ${fieldName(fy, typedUnits)} ${axisValue(fy, y, typedUnits)}: ${cellText(v)}${v === best ? ", smallest" : ""}`}
                        className={`num block w-full min-w-20 rounded-sm px-2 py-1.5 text-right ${s.index === selected ? "ring-2 ring-ink ring-offset-1" : ""} ${dark ? "text-white" : "text-ink"}`}
                        style={{ background: v === null ? "repeating-linear-gradient(45deg,#f7f8fa 0 4px,#dde2e8 4px 8px)" : `rgb(${Math.round(238 - 223 * t)} ${Math.round(248 - 177 * t)} ${Math.round(247 - 179 * t)})` }}
                      >
                        {v === best ? "★ " : ""}
                        {cellText(v)}
                      </button>
                    </td>
                  );
                })}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </section>
  );
}
