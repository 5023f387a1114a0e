import Papa from "papaparse";
import { commentText, SAFE_UNPARSE } from "@/lib/client/csv-safety";
import { CAUTIONS } from "@/lib/engine";

/**
 * The candidates CSV of one scenario, either kind of sweep: a title line naming the sweep, the scenario
 * and its changed numbers, the cautions on a second comment line (the product's unless told), then the table. Comment lines go
 * through commentText so user text is safe to open in a spreadsheet.
 */
export function scenarioCandidatesCsv(
  sweepId: string,
  data: { scenario: { index: number; overrides: Record<string, unknown> }; total: number },
  fields: string[],
  rows: unknown[][],
  cautions: readonly string[] = CAUTIONS,
): string {
  const overrides = Object.entries(data.scenario.overrides)
    .map(([k, v]) => `${k} = ${v}`)
    .join(", ");
  const title = `# ${commentText(`sweep ${sweepId}, scenario ${data.scenario.index + 1}${overrides ? ` (${overrides})` : ""}: ${data.total} candidates`)}`;
  return `${title}\n# ${commentText(cautions.join(" "))}\n${Papa.unparse({ fields, data: rows }, SAFE_UNPARSE)}\n`;
}
