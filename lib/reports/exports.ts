/**
 * CSV files of the report and of a scenario's ranked list: SI numbers at full precision, the
 * unit in every header, the cautions in a leading "#" comment line.
 */
import Papa from "papaparse";
import { commentText, SAFE_UNPARSE } from "@/lib/client/csv-safety";
import { CAUTIONS } from "@/lib/engine";
import { stageTypeCautions } from "@/lib/stage-types";
import type { exportCandidates } from "@/lib/services/candidate-export";
import { scenarioCandidatesCsv } from "./scenario-candidates-csv";
import type { DesignReport } from "./design-report";
import { compositionCsvHeaders } from "./network-format";
import type { NetworkReport } from "./network-report";
import { hasRecycle, stageColumns, STAGE_COLUMNS, VESSEL_SIZE_COLUMN } from "./report-format";

/** A leading "# " line carrying user text, safe to open in a spreadsheet (see commentText). */
const commentLine = (text: string) => `# ${commentText(text)}`;

/** The cautions, in the words of every other place they are shown, on one comment line. */
const PREFACE = commentLine(CAUTIONS.join(" "));

const cell = (v: unknown) => (v === null || v === undefined || (typeof v === "number" && !Number.isFinite(v)) ? "" : v);

/** The stage table of a pinned design (for several reactions, its composition table). */
export function stageTableCsv(report: DesignReport): string {
  if (report.network) return compositionCsv(report, report.network);
  const columns = hasRecycle(report.stages) ? stageColumns(undefined, true) : STAGE_COLUMNS;
  const rows = report.stages.map((s) => {
    const row: Record<string, unknown> = {};
    for (const c of columns) row[c.csv] = cell(c.raw(s));
    row[VESSEL_SIZE_COLUMN.csv] = cell(VESSEL_SIZE_COLUMN.raw(s));
    return row;
  });
  const fields = [...columns.map((c) => c.csv), VESSEL_SIZE_COLUMN.csv];
  const title = commentLine(`${report.project.name}: ${report.train.label}, pinned design ${report.pin.id} (${report.pin.state})`);
  // The report's general cautions: the product's, and a tube with recycle's when the train has one.
  const preface = commentLine(report.cautions.general.join(" "));
  return `${title}\n${preface}\n${Papa.unparse({ fields, data: rows.map((r) => fields.map((f) => r[f])) }, SAFE_UNPARSE)}\n`;
}

/**
 * The composition table of a train of several reactions: the feed, each stage's outlet and the
 * train's totals, one column per species (mol/m3), with each stage's size and the train's measures.
 */
export function compositionCsv(report: DesignReport, n: NetworkReport): string {
  const product = n.product;
  const fields = [
    "stream",
    "stage",
    "type",
    "volume (m3)",
    "residence time (s)",
    "temperature (K)",
    ...compositionCsvHeaders(n).slice(1),
    `conversion of ${n.keyReactant} (-)`,
    ...(product ? [`yield of ${product} (-)`, `selectivity to ${product} (-)`] : []),
  ];
  const measures = (m: { conversion: number | null; yield: number | null; selectivity: number | null }) => [cell(m.conversion), ...(product ? [cell(m.yield), cell(m.selectivity)] : [])];
  const blankMeasures = product ? ["", "", ""] : [""];
  const rows = n.composition.rows.map((row) => {
    const stage = row.stage === null ? null : n.stages[row.stage - 1];
    return [row.label, stage?.index ?? "", stage?.type ?? "", cell(stage?.volume), cell(stage?.residenceTime), cell(stage?.temperature), ...row.values.map(cell), ...blankMeasures];
  });
  const last = n.composition.rows[n.composition.rows.length - 1];
  rows.push(["Train outlet (totals)", "", report.train.label, cell(n.measures.totalVolume), cell(n.measures.totalResidenceTime), "", ...last.values.map(cell), ...measures(n.measures)]);
  const title = commentLine(`${report.project.name}: ${report.train.label}, pinned design ${report.pin.id} (${report.pin.state}); ${n.measures.objectiveLabel}`);
  return `${title}\n${PREFACE}\n${Papa.unparse({ fields, data: rows }, SAFE_UNPARSE)}\n`;
}

type Export = Awaited<ReturnType<typeof exportCandidates>>;

/** Units of the ranked list's numbers, for the JSON export and the CSV headers. */
export const CANDIDATE_UNITS = {
  totalVolume: "m3",
  totalCost: "currency of the cost basis",
  installedCost: "currency of the cost basis",
  reusedVessels: "-",
  probabilityMeet: "-",
  ratioToPfr: "-",
  stageVolumes: "m3",
  stageConversionsOut: "-",
  stageRecycleRatios: "-",
} as const;

/** Each stage's recycle ratio, null for a stage that is not a tube with recycle. */
const recycleRatios = (stages: readonly { type: string; recycleRatio?: number }[]) => stages.map((s) => (s.type === "PFR-recycle" ? (s.recycleRatio ?? null) : null));

/** The cautions of a list of trains: the product's, and a tube with recycle's when one of them has one. */
export function candidateCautions(data: Export): string[] {
  return [...CAUTIONS, ...stageTypeCautions(data.items.flatMap((c) => c.sequence))];
}

export function candidateRowsForExport(data: Export) {
  return data.items.map((c) => ({
    rank: c.rank,
    sequence: c.sequence.join("-"),
    stageCount: c.stageCount,
    feasible: c.feasible,
    totalVolume: c.totalVolume,
    totalCost: c.totalCost,
    installedCost: c.installedCost,
    reusedVessels: c.reused,
    probabilityMeet: c.probabilityMeet,
    ratioToPfr: c.ratioToPfr,
    stageVolumes: c.stages.map((s) => Number(s.volume)),
    stageConversionsOut: c.stages.map((s) => Number(s.conversionOut)),
    stageRecycleRatios: recycleRatios(c.stages),
    reason: c.reason,
  }));
}

/** Every candidate of a scenario; one row each. */
export function candidatesCsv(sweepId: string, data: Export): string {
  // The recycle ratios' column only when a train of the list has a tube with recycle (blank for its other stages).
  const recycle = data.items.some((c) => c.sequence.includes("PFR-recycle"));
  const fields = [
    "rank",
    "sequence",
    "stage count",
    "feasible",
    "total volume (m3)",
    "total cost (currency of the cost basis)",
    "installed cost (currency of the cost basis)",
    "reused idle vessels",
    "probability of meeting the target (-)",
    "ratio to single PFR (-)",
    "stage volumes (m3)",
    "stage outlet conversions (-)",
    ...(recycle ? ["stage recycle ratios (-)"] : []),
    "reason",
  ];
  const rows = candidateRowsForExport(data).map((c) => [
    c.rank,
    c.sequence,
    c.stageCount,
    c.feasible ? "yes" : "no",
    cell(c.totalVolume),
    cell(c.totalCost),
    cell(c.installedCost),
    c.reusedVessels,
    cell(c.probabilityMeet),
    cell(c.ratioToPfr),
    c.stageVolumes.join(" | "),
    c.stageConversionsOut.join(" | "),
    ...(recycle ? [c.stageRecycleRatios.map((r) => (r === null ? "" : r)).join(" | ")] : []),
    c.reason ?? "",
  ]);
  return scenarioCandidatesCsv(sweepId, data, fields, rows, candidateCautions(data));
}
