"use client";

import { labelFor } from "@/lib/schemas/field-labels";
import { memo, useRef, useState, type KeyboardEvent } from "react";
import { formatVolume, type VolumeUnit } from "@/lib/charts/volume-units";
import { fromSI, isUnit, SI_UNIT, unitLabel, type UnitKind } from "@/lib/units/display";
import { gridFieldAt } from "@/components/sweep-builder/builder-form-state";
import { networkFieldKind } from "@/components/sweep-builder/network-grid-fields";
import type { ScenarioRow } from "@/lib/services/views";
import { formatNumber, TABLE_NUMBERS } from "@/lib/format/numbers";

/** The units the kinetics was typed in, by kind (from lib/units/typed-units). */
export type TypedUnits = Partial<Record<UnitKind, string>>;

/** The unit a grid field's values are shown in: the one the kinetics was typed in, else the stored SI one. */
const axisUnit = (path: string, units: TypedUnits | undefined): { kind: UnitKind; unit: string } | null => {
  const kind = gridFieldAt(path)?.kind ?? networkFieldKind(path);
  if (!kind) return null;
  const typed = units?.[kind];
  return { kind, unit: typed && isUnit(kind, typed) ? typed : SI_UNIT[kind] };
};

/** A varied input's name, without its unit: the builder's words, or labelFor's for any other field. */
const fieldLabel = (path: string) => gridFieldAt(path)?.label ?? labelFor(path);

/** A varied input's name with the unit its values are shown in ("Feed temperature, °C"). */
export const fieldName = (path: string, units?: TypedUnits) => {
  const shown = axisUnit(path, units);
  return shown ? `${fieldLabel(path)}, ${unitLabel(shown.kind, shown.unit)}` : fieldLabel(path);
};

/** A grid value (stored SI) on the axis, in the kinetics' typed unit when it has one. */
export const axisValue = (path: string, si: number, units?: TypedUnits) => {
  const shown = axisUnit(path, units);
  return formatNumber(shown ? fromSI(shown.kind, si, shown.unit) : si, 4, TABLE_NUMBERS);
};

export function describeOverrides(overrides: Record<string, number>): string {
  const parts = Object.entries(overrides).map(([k, v]) => `${fieldLabel(k)} ${formatNumber(v, 4, TABLE_NUMBERS)}`);
  return parts.length ? parts.join(" · ") : "Base case";
}

/** What a scenario's best train is ranked by: volume or cost (one reaction), or a network's yield, selectivity or volume. */
export type RankedBy = "volume" | "cost" | "yield" | "selectivity";
const LARGER_IS_BETTER = (o: RankedBy) => o === "yield" || o === "selectivity";

export function formatObjective(v: number | null, objective: RankedBy, unit: VolumeUnit): string {
  if (v === null) return "no feasible train";
  if (LARGER_IS_BETTER(objective)) return `${objective} ${(100 * v).toFixed(1)} %`;
  return objective === "cost" ? `cost ${formatNumber(v, 4, TABLE_NUMBERS)}` : formatVolume(v, unit);
}

/** Memoised: a sort or a page change of the table below must not rebuild every scenario's line. */
export const ScenarioPicker = memo(function ScenarioPicker({
  scenarios,
  value,
  onChange,
  objective,
  unit,
}: {
  scenarios: ScenarioRow[];
  value: number;
  onChange: (index: number) => void;
  objective: RankedBy;
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
});

/** The two fields a grid varies, when it varies exactly two. */
export function twoVariedFields(scenarios: ScenarioRow[]): [string, string] | null {
  const fields = new Map<string, Set<number>>();
  for (const s of scenarios) for (const [k, v] of Object.entries(s.overrides)) (fields.get(k) ?? fields.set(k, new Set()).get(k)!).add(v);
  const varied = [...fields].filter(([, vals]) => vals.size > 1).map(([k]) => k);
  return varied.length === 2 ? [varied[0], varied[1]] : null;
}

/**
 * Whether white text contrasts more than the ink colour (#1c2430) with a cell's shade, by the
 * WCAG 2.1 relative luminance: a fixed cut on the shade left mid-tones below 4.5:1 either way.
 */
export function whiteReadsBetter(rgb: [number, number, number]): boolean {
  const lum = luminance(rgb);
  return 1.05 / (lum + 0.05) > (lum + 0.05) / (INK_LUMINANCE + 0.05);
}

const INK_LUMINANCE = 0.0167; // #1c2430

function luminance([r, g, b]: [number, number, number]): number {
  const lin = (v: number) => {
    const c = v / 255;
    return c <= 0.03928 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
  };
  return 0.2126 * lin(r) + 0.7152 * lin(g) + 0.0722 * lin(b);
}

/**
 * The cell colour for a shade t in [0, 1] (light teal to deep teal). Mid-tones whose luminance
 * lies between 0.183 and 0.252 give neither white nor ink text 4.5:1, so those shades move on to
 * the first darker one that does; the order of the shades is kept.
 */
export function cellShade(t: number): [number, number, number] {
  for (let u = t; ; u = Math.min(1, u + 0.01)) {
    const rgb: [number, number, number] = [Math.round(238 - 223 * u), Math.round(248 - 177 * u), Math.round(247 - 179 * u)];
    const lum = luminance(rgb);
    if (lum <= 0.183 || lum >= 0.252 || u >= 1) return rgb;
  }
}

/** Where an arrow key (or Home/End, with Ctrl for the whole grid) takes the focus from [row, col]. */
export function nextCell(key: string, ctrl: boolean, [r, c]: [number, number], rows: number, cols: number, exists: (r: number, c: number) => boolean): [number, number] | null {
  // Step in one direction, skipping holes in the grid (a scenario the sweep did not produce).
  const walk = (dr: number, dc: number, from: [number, number]): [number, number] | null => {
    for (let rr = from[0] + dr, cc = from[1] + dc; rr >= 0 && rr < rows && cc >= 0 && cc < cols; rr += dr, cc += dc) if (exists(rr, cc)) return [rr, cc];
    return null;
  };
  const firstFrom = (start: [number, number], dr: number, dc: number) => (exists(...start) ? start : walk(dr, dc, start));
  switch (key) {
    case "ArrowRight":
      return walk(0, 1, [r, c]);
    case "ArrowLeft":
      return walk(0, -1, [r, c]);
    case "ArrowDown":
      return walk(1, 0, [r, c]);
    case "ArrowUp":
      return walk(-1, 0, [r, c]);
    case "Home":
      return ctrl ? firstFrom([0, 0], 0, 1) : firstFrom([r, 0], 0, 1);
    case "End":
      return ctrl ? firstFrom([rows - 1, cols - 1], 0, -1) : firstFrom([r, cols - 1], 0, -1);
    default:
      return null;
  }
}

/**
 * Heat map of the best objective over a two-field grid: a table whose cells carry the value as
 * text and a shade (darker = larger); each cell opens its scenario.
 * The grid is one tab stop (ARIA grid, roving tabindex): a hundred cells as separate stops put the
 * ranked table a hundred key presses away. Arrows, Home and End move; Enter or Space opens.
 * Memoised: a sort or a page change of the table below must not rebuild the map.
 */
export const ObjectiveHeatMap = memo(function ObjectiveHeatMap({
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
  objective: RankedBy;
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
  const largest = LARGER_IS_BETTER(objective);
  const best = values.length ? (largest ? hi : lo) : null;
  const shade = (v: number) => (hi > lo ? (v - lo) / (hi - lo) : 0);
  const [active, setActive] = useState<[number, number] | null>(null);
  const tableRef = useRef<HTMLTableElement>(null);
  const cellAt = (r: number, c: number) => at.get(`${xs[c]}|${ys[r]}`);
  const selectedPos = ((): [number, number] => {
    for (let r = 0; r < ys.length; r++) for (let c = 0; c < xs.length; c++) if (cellAt(r, c)?.index === selected) return [r, c];
    for (let r = 0; r < ys.length; r++) for (let c = 0; c < xs.length; c++) if (cellAt(r, c)) return [r, c];
    return [0, 0];
  })();
  // The tab stop is the cell last reached with the arrows while the focus is in the grid, else the selected one.
  const [tr, tc] = active ?? selectedPos;
  const onKeyDown = (e: KeyboardEvent<HTMLTableElement>) => {
    const to = nextCell(e.key, e.ctrlKey || e.metaKey, [tr, tc], ys.length, xs.length, (r, c) => !!cellAt(r, c));
    if (!to && !["ArrowRight", "ArrowLeft", "ArrowUp", "ArrowDown", "Home", "End"].includes(e.key)) return;
    e.preventDefault();
    if (!to) return;
    setActive(to);
    tableRef.current?.querySelector<HTMLButtonElement>(`[data-cell="${to[0]}-${to[1]}"]`)?.focus();
  };
  const cellText = (v: number | null) => (v === null ? "—" : largest ? `${(100 * v).toFixed(1)} %` : objective === "cost" ? formatNumber(v, 3, TABLE_NUMBERS) : formatVolume(v, unit, 3));

  return (
    <section className="card p-4" aria-labelledby="heatmap-title" data-testid="heat-map">
      <h2 id="heatmap-title">Best {objective === "cost" ? "cost" : largest ? objective : "total volume"} across the grid</h2>
      <p className="mt-0.5 text-xs text-ink-soft">
        Darker cells are larger; the {largest ? "largest" : "smallest"} is marked ★. Choose a cell to open its scenario.
      </p>
      <div className="mt-3 overflow-x-auto">
        <table
          ref={tableRef}
          role="grid"
          aria-labelledby="heatmap-title"
          className="border-separate border-spacing-0.5 text-xs"
          onKeyDown={onKeyDown}
          onBlur={(e) => {
            if (!e.currentTarget.contains(e.relatedTarget as Node | null)) setActive(null);
          }}
        >
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
            {ys.map((y, r) => (
              <tr key={y}>
                <th scope="row" className="num px-2 py-1 text-right font-medium text-ink-soft">
                  {axisValue(fy, y, typedUnits)}
                </th>
                {xs.map((x, c) => {
                  const s = at.get(`${x}|${y}`);
                  if (!s)
                    return (
                      <td key={x} role="gridcell" className="px-2 py-1 text-ink-faint">
                        ·
                      </td>
                    );
                  const v = s.bestObjective;
                  const t = v === null ? 0 : shade(v);
                  const rgb = cellShade(t);
                  const dark = v !== null && whiteReadsBetter(rgb);
                  return (
                    <td key={x} role="gridcell" aria-selected={s.index === selected} className="p-0">
                      <button
                        type="button"
                        tabIndex={r === tr && c === tc ? 0 : -1}
                        data-cell={`${r}-${c}`}
                        onFocus={() => setActive([r, c])}
                        onClick={() => onSelect(s.index)}
                        aria-pressed={s.index === selected}
                        aria-label={`${fieldName(fx, typedUnits)} ${axisValue(fx, x, typedUnits)}, ${fieldName(fy, typedUnits)} ${axisValue(fy, y, typedUnits)}: ${cellText(v)}${v === best ? (largest ? ", largest" : ", smallest") : ""}`}
                        className={`num block w-full min-w-20 rounded-sm px-2 py-1.5 text-right ${s.index === selected ? "ring-2 ring-ink ring-offset-1" : ""} ${dark ? "text-white" : "text-ink"}`}
                        style={{ background: v === null ? "repeating-linear-gradient(45deg,#f7f8fa 0 4px,#dde2e8 4px 8px)" : `rgb(${rgb[0]} ${rgb[1]} ${rgb[2]})` }}
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
});
