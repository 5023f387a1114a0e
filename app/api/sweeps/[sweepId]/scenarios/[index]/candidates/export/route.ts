import { readQuery } from "@/lib/http";
import { scenarioRoute } from "@/lib/http/signed-in-route";
import { CANDIDATE_UNITS, candidateCautions, candidateRowsForExport, candidatesCsv } from "@/lib/reports/exports";
import { isNetworkExport, NETWORK_CANDIDATE_UNITS, networkCandidateRowsForExport, networkCandidatesCsv } from "@/lib/reports/network-candidate-export";
import { candidateExportQuerySchema } from "@/lib/schemas/report-exports";
import { exportCandidates } from "@/lib/services/candidate-export";

/**
 * Every candidate of one scenario (not one page), sorted and filtered as the ranked table: ?format=csv|json&sort=&dir=&feasible=&contains=&stages=
 * A network scenario's list carries conversion, yield and selectivity columns.
 */
export const GET = scenarioRoute(async ({ req, actor, db, sweepId, index }) => {
  const { format, ...q } = readQuery(req, candidateExportQuerySchema);
  const data = await exportCandidates(db, actor, sweepId, index, q);
  const network = isNetworkExport(data);
  const name = `sweep-${sweepId.slice(0, 8)}-scenario-${index + 1}-candidates.${format}`;
  const headers = { "Content-Disposition": `attachment; filename="${name}"`, "Cache-Control": "private, no-store" };
  if (format === "csv") {
    const csv = network ? networkCandidatesCsv(sweepId, data) : candidatesCsv(sweepId, data);
    return new Response(csv, { headers: { ...headers, "Content-Type": "text/csv; charset=utf-8" } });
  }
  const body = network
    ? { sweepId, kind: "network", scenario: data.scenario, total: data.total, units: NETWORK_CANDIDATE_UNITS, candidates: networkCandidateRowsForExport(data) }
    : { sweepId, kind: "single", scenario: data.scenario, total: data.total, units: CANDIDATE_UNITS, cautions: candidateCautions(data), candidates: candidateRowsForExport(data) };
  return new Response(JSON.stringify(body), { headers: { ...headers, "Content-Type": "application/json; charset=utf-8" } });
});
