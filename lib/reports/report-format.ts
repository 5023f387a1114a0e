/**
 * How the report shows its numbers, in one place for the page, the PDF and the CSV: the
 * stage table's columns with their units, and the formatting of volumes and times (dates: lib/format/dates.ts).
 */
import type { DesignReport, ReportStage } from "./design-report";
import { fromSI, unitLabel } from "@/lib/units/display";
import { resolveDisplayUnits, type DisplayPreference, type DisplayUnits } from "@/lib/units/display-preference";
import { formatNumber, RECORD_NUMBERS } from "@/lib/format/numbers";
import { stageTypeName } from "@/lib/stage-types";

/** Volume and temperature in the reader's units; without `units`, m³ and K as stored. */
export const fmtVolume = (m3: number | null | undefined, units?: Pick<DisplayUnits, "volume">) =>
  m3 === null || m3 === undefined || !Number.isFinite(m3) ? "—" : units ? `${formatNumber(fromSI("volume", m3, units.volume), 4, RECORD_NUMBERS)} ${unitLabel("volume", units.volume)}` : `${formatNumber(m3, 4, RECORD_NUMBERS)} m³`;
export const fmtConversion = (x: number | null | undefined) => (x === null || x === undefined || !Number.isFinite(x) ? "—" : x.toFixed(4));
export const fmtKelvin = (t: number | null | undefined, units?: Pick<DisplayUnits, "temperature">) =>
  t === null || t === undefined || !Number.isFinite(t) ? "—" : units ? `${fromSI("temperature", t, units.temperature).toFixed(1)} ${unitLabel("temperature", units.temperature)}` : `${t.toFixed(1)} K`;

/** The units a report is shown in: the reader's choice, with the volume picked for the largest volume it shows. */
export function reportUnits(r: Pick<DesignReport, "train" | "references"> & { kinetics?: Pick<DesignReport["kinetics"], "typedUnits"> }, preference: DisplayPreference): DisplayUnits {
  const largest = Math.max(0, r.train.totalVolume ?? 0, r.references.singleCSTR ?? 0, r.references.singlePFR ?? 0);
  return resolveDisplayUnits(preference, r.kinetics?.typedUnits, { largestVolume: largest || null });
}
export const fmtPercent = (p: number | null | undefined) => (p === null || p === undefined || !Number.isFinite(p) ? "—" : `${(p * 100).toFixed(1)} %`);
export const fmtMoney = (v: number | null | undefined, currency?: string | null) =>
  v === null || v === undefined || !Number.isFinite(v) ? "—" : `${Math.round(v).toLocaleString("en-US")}${currency ? ` ${currency}` : ""}`;

/** Residence time in seconds with minutes beside it for readers who think in minutes. */
export function fmtResidence(s: number | null | undefined): string {
  if (s === null || s === undefined || !Number.isFinite(s)) return "—";
  return s >= 120 ? `${formatNumber(s, 4, RECORD_NUMBERS)} s (${formatNumber(s / 60, 3, RECORD_NUMBERS)} min)` : `${formatNumber(s, 4, RECORD_NUMBERS)} s`;
}

export interface StageColumn {
  /** Heading on the page and in the PDF. */
  heading: string;
  /** Header of the CSV column, with its unit. */
  csv: string;
  /** Raw value for the CSV and JSON (SI). */
  raw: (s: ReportStage) => number | string | null;
  /** As shown on the page and in the PDF. */
  shown: (s: ReportStage) => string;
  numeric: boolean;
}

/** A tube with recycle's recycle ratio; the column is there only when the train has one. */
const RECYCLE_COLUMN: StageColumn = {
  heading: "Recycle ratio",
  csv: "recycle ratio (-)",
  raw: (s) => s.recycleRatio,
  shown: (s) => (s.recycleRatio === null ? "—" : formatNumber(s.recycleRatio, 4, RECORD_NUMBERS)),
  numeric: true,
};

/** Whether a report's stages need the recycle ratio column. */
export const hasRecycle = (stages: readonly Pick<ReportStage, "type">[]) => stages.some((s) => s.type === "PFR-recycle");

/**
 * The stage table, in order; `units` changes what is shown, never the CSV's SI columns. `recycle` adds the
 * recycle ratio after the type (trains with a tube with recycle). The CSV keeps the type as a sweep file writes it.
 */
export const stageColumns = (units?: DisplayUnits, recycle = false): StageColumn[] => [
  { heading: "Stage", csv: "stage", raw: (s) => s.index, shown: (s) => String(s.index), numeric: true },
  { heading: "Type", csv: "type", raw: (s) => s.type, shown: (s) => stageTypeName(s.type), numeric: false },
  ...(recycle ? [RECYCLE_COLUMN] : []),
  { heading: "X in", csv: "conversion in (-)", raw: (s) => s.conversionIn, shown: (s) => fmtConversion(s.conversionIn), numeric: true },
  { heading: "X out", csv: "conversion out (-)", raw: (s) => s.conversionOut, shown: (s) => fmtConversion(s.conversionOut), numeric: true },
  { heading: "T in", csv: "temperature in (K)", raw: (s) => s.temperatureIn, shown: (s) => fmtKelvin(s.temperatureIn, units), numeric: true },
  { heading: "T out", csv: "temperature out (K)", raw: (s) => s.temperatureOut, shown: (s) => fmtKelvin(s.temperatureOut, units), numeric: true },
  { heading: "Volume", csv: "volume (m3)", raw: (s) => s.volume, shown: (s) => fmtVolume(s.volume, units), numeric: true },
  { heading: "Residence time", csv: "residence time (s)", raw: (s) => s.residenceTime, shown: (s) => fmtResidence(s.residenceTime), numeric: true },
  { heading: "Vessels", csv: "vessel count", raw: (s) => s.vesselCount, shown: (s) => `${s.vesselCount} × ${fmtVolume(s.vesselSize, units)}`, numeric: true },
  { heading: "Cost", csv: "cost (currency of the cost basis)", raw: (s) => s.cost, shown: (s) => fmtMoney(s.cost), numeric: true },
];

/** The stage table as stored (m³, K): the CSV and JSON columns. */
export const STAGE_COLUMNS: StageColumn[] = stageColumns();

/** CSV-only column: the size of each vessel, m3 (the page shows it inside "Vessels"). */
export const VESSEL_SIZE_COLUMN = { csv: "vessel size each (m3)", raw: (s: ReportStage) => s.vesselSize };

/** A clean file name for the report's downloads: project and train, no spaces or punctuation. */
export function reportFileName(report: Pick<DesignReport, "project" | "train" | "pin">, ext: string): string {
  const slug = (s: string) =>
    s
      .normalize("NFKD")
      .replace(/[^\w\s-]/g, "")
      .trim()
      .replace(/[\s_]+/g, "-")
      .toLowerCase()
      .slice(0, 48) || "design";
  return `${slug(report.project.name)}-${report.train.sequence.join("-").toLowerCase() || "train"}-${report.pin.id.slice(0, 8)}.${ext}`;
}
