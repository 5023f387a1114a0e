/**
 * How a report of several reactions shows its numbers, in one place for the page, the PDF and the
 * CSV: the stage table's columns, the composition table's headings, the measures in words.
 */
import { formatNumber, RECORD_NUMBERS } from "@/lib/format/numbers";
import type { DisplayUnits } from "@/lib/units/display-preference";
import type { WordLine } from "./kinetics-words";
import type { NetworkReport, NetworkStageRow } from "./network-report";
import { fmtKelvin, fmtResidence, fmtVolume } from "./report-format";

export interface NetworkStageColumn {
  heading: string;
  csv: string;
  raw: (s: NetworkStageRow) => number | string;
  shown: (s: NetworkStageRow) => string;
  numeric: boolean;
}

/** The stage table; `units` changes what is shown, never the CSV's SI columns. */
export const networkStageColumns = (units?: DisplayUnits): NetworkStageColumn[] => [
  { heading: "Stage", csv: "stage", raw: (s) => s.index, shown: (s) => String(s.index), numeric: true },
  { heading: "Type", csv: "type", raw: (s) => s.type, shown: (s) => s.type, numeric: false },
  { heading: "Volume", csv: "volume (m3)", raw: (s) => s.volume, shown: (s) => fmtVolume(s.volume, units), numeric: true },
  { heading: "Residence time", csv: "residence time (s)", raw: (s) => s.residenceTime, shown: (s) => fmtResidence(s.residenceTime), numeric: true },
  { heading: "Temperature", csv: "temperature (K)", raw: (s) => s.temperature, shown: (s) => fmtKelvin(s.temperature, units), numeric: true },
  { heading: "Steady states", csv: "steady states", raw: (s) => s.steadyStates, shown: (s) => String(s.steadyStates), numeric: true },
];

/** A concentration as the composition table shows it (mol/m³, four figures). */
export const fmtConcentration = (v: number | null) => (v === null ? "—" : formatNumber(v, 4, RECORD_NUMBERS));

/** The composition table's headings: the row's name, then one column per species. */
export const compositionHeadings = (n: NetworkReport) => ["Stream", ...n.composition.species.map((s) => `C_${s}, mol/m³`)];

/** The CSV headers of the same table. */
export const compositionCsvHeaders = (n: NetworkReport) => ["stream", ...n.composition.species.map((s) => `${s} (mol/m3)`)];

const pct = (v: number | null) => (v === null ? "—" : `${formatNumber(v * 100, 4, RECORD_NUMBERS)} %`);

/** Conversion, yield, selectivity, volume and residence time in words. */
export function measureLines(n: NetworkReport, units?: DisplayUnits): WordLine[] {
  const m = n.measures;
  const lines: WordLine[] = [{ label: `Conversion of ${n.keyReactant}`, value: pct(m.conversion) }];
  if (n.product) {
    lines.push({ label: `Yield of ${n.product}`, value: pct(m.yield) });
    lines.push({ label: `Selectivity to ${n.product}`, value: pct(m.selectivity) });
  }
  lines.push({ label: "Total volume", value: fmtVolume(m.totalVolume, units) });
  lines.push({ label: "Total residence time", value: fmtResidence(m.totalResidenceTime) });
  return lines;
}

/** The single-stage references in words: "yield 45.3 % in 429 L". */
export function referenceLines(n: NetworkReport, units?: DisplayUnits): WordLine[] {
  const o = n.chemistry.objective as { maximise?: string } | undefined;
  const measure = o?.maximise === "selectivity" ? "selectivity" : o?.maximise === "yield" ? "yield" : null;
  return n.references.map((r) => {
    if (r.volume === null) return { label: r.label, value: "cannot meet the limits" };
    const at = r.temperature === null ? "" : ` at ${fmtKelvin(r.temperature, units)}`;
    return { label: r.label, value: `${measure ? `${measure} ${pct(r.objective)} in ` : ""}${fmtVolume(r.volume, units)}${at}` };
  });
}

/** Key reactant, wanted product and heat mode. */
export function chemistryLines(n: NetworkReport): WordLine[] {
  return [
    { label: "Key reactant", value: n.keyReactant },
    { label: "Wanted product", value: n.product ?? "none named" },
    { label: "Heat", value: n.heat },
  ];
}
