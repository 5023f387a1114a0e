/**
 * The ranked list of a network scenario (several reactions) as CSV and JSON rows: the measures a
 * network is ranked by beside the volumes, SI numbers at full precision, the unit in every header, the
 * cautions in a leading "#" comment line (as the one-reaction list in exports.ts).
 */
import type { exportCandidates } from "@/lib/services/candidate-export";
import { scenarioCandidatesCsv } from "./scenario-candidates-csv";

type Export = Awaited<ReturnType<typeof exportCandidates>>;

const cell = (v: unknown) => (v === null || v === undefined || (typeof v === "number" && !Number.isFinite(v)) ? "" : v);

/** True when the scenario was ranked by the network designer. */
export const isNetworkExport = (data: Export) => data.scenario.reference !== null && "kind" in data.scenario.reference && data.scenario.reference.kind === "network";

/** Units of the network list's numbers, for the JSON export and the CSV headers. */
export const NETWORK_CANDIDATE_UNITS = {
  totalVolume: "m3",
  conversion: "-",
  yield: "-",
  selectivity: "-",
  objectiveValue: "yield or selectivity (-), or total volume (m3), as ranked",
  ratioToPfr: "-",
  stageVolumes: "m3",
  stageResidenceTimes: "s",
  stageTemperatures: "K",
} as const;

interface NetworkStageCells {
  volume: number;
  residenceTime: number;
  temperature: number;
}

export function networkCandidateRowsForExport(data: Export) {
  return data.items.map((c) => {
    const stages = c.stages as unknown as NetworkStageCells[];
    return {
      rank: c.rank,
      sequence: c.sequence.join("-"),
      stageCount: c.stageCount,
      feasible: c.feasible,
      totalVolume: c.totalVolume,
      conversion: c.conversion,
      yield: c.yield,
      selectivity: c.selectivity,
      objectiveValue: c.objectiveValue,
      ratioToPfr: c.ratioToPfr,
      stageVolumes: stages.map((s) => s.volume),
      stageResidenceTimes: stages.map((s) => s.residenceTime),
      stageTemperatures: stages.map((s) => s.temperature),
      onBound: c.onBound ?? [],
      reason: c.reason,
    };
  });
}

/** Every candidate of a network scenario; one row each. */
export function networkCandidatesCsv(sweepId: string, data: Export): string {
  const fields = ["rank", "sequence", "stage count", "feasible", "total volume (m3)", "conversion (-)", "yield (-)", "selectivity (-)", "ranked value", "ratio to single PFR (-)", "stage volumes (m3)", "stage residence times (s)", "stage temperatures (K)", "at a limit", "reason"];
  const rows = networkCandidateRowsForExport(data).map((c) => [
    c.rank,
    c.sequence,
    c.stageCount,
    c.feasible ? "yes" : "no",
    cell(c.totalVolume),
    cell(c.conversion),
    cell(c.yield),
    cell(c.selectivity),
    cell(c.objectiveValue),
    cell(c.ratioToPfr),
    c.stageVolumes.join(" | "),
    c.stageResidenceTimes.join(" | "),
    c.stageTemperatures.join(" | "),
    c.onBound.join(" | "),
    c.reason ?? "",
  ]);
  return scenarioCandidatesCsv(sweepId, data, fields, rows);
}
