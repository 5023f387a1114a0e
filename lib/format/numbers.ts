/**
 * The one number formatter of the product: screens, charts, the design report, its PDF and the
 * fit summaries all write numbers through it. Dependency-free, so client components and the
 * server share it.
 */

export interface NumberStyle {
  /**
   * Keep every significant figure in exponent form ("1.000e-4" rather than "1e-4"): the design
   * report, the fit summaries and the result tables state how many figures a value carries.
   */
  allFigures?: boolean;
  /** Thousands separators in plain form ("12,300"), for the columns of result tables and charts. */
  grouping?: boolean;
}

/** Result tables and charts: separators for large sizes and costs, every figure kept. */
export const TABLE_NUMBERS: NumberStyle = { grouping: true, allFigures: true };
/** The design report and fitted parameters: every figure kept, no separators. */
export const RECORD_NUMBERS: NumberStyle = { allFigures: true };

/** Below this or at and above UPPER, a magnitude is written in exponent form. */
const LOWER = 1e-3;
const UPPER = 1e6;

/**
 * The grouped plain form's formatter, made once: `toLocaleString` with options builds a new one on
 * every call, which a page of a few hundred numbers feels (tens of milliseconds a redraw).
 */
const GROUPED = new Intl.NumberFormat("en-US", { maximumFractionDigits: 6 });

/**
 * `value` to `digits` significant figures; exponent form for very small or very large magnitudes
 * (below 0.001, or a million and above), plain otherwise; "—" for anything that is not a finite
 * number, so a missing value never reads as zero.
 */
export function formatNumber(value: unknown, digits = 4, style: NumberStyle = {}): string {
  if (typeof value !== "number" || !Number.isFinite(value)) return "—";
  if (value === 0) return "0";
  const abs = Math.abs(value);
  if (abs >= UPPER || abs < LOWER) {
    const e = value.toExponential(digits - 1);
    return style.allFigures ? e : e.replace(/\.?0+e/, "e");
  }
  const rounded = Number(value.toPrecision(digits));
  return style.grouping ? GROUPED.format(rounded) : String(rounded);
}
