import { getDb } from "@/db/client";
import { requireActor } from "@/lib/auth/session";
import { AppError } from "@/lib/errors";
import { readQuery, route, uuidParam } from "@/lib/http";
import { CANDIDATE_UNITS, candidateRowsForExport, candidatesCsv } from "@/lib/reports/exports";
import { candidateExportQuerySchema } from "@/lib/schemas/report-exports";
import { exportCandidates } from "@/lib/services/candidate-export";

type Ctx = { params: Promise<{ sweepId: string; index: string }> };

/** Every candidate of one scenario (not one page), sorted and filtered as the ranked table: ?format=csv|json&sort=&dir=&feasible=&contains=&stages= */
export const GET = route<Ctx>(async (req, ctx) => {
  const actor = await requireActor();
  const sweepId = await uuidParam(ctx, "sweepId", "sweep");
  const { index } = await ctx.params;
  if (!/^\d{1,6}$/.test(index)) throw new AppError("not_found", "No such scenario");
  const { format, ...q } = readQuery(req, candidateExportQuerySchema);
  const data = await exportCandidates(getDb(), actor, sweepId, Number(index), q);
  const name = `sweep-${sweepId.slice(0, 8)}-scenario-${Number(index) + 1}-candidates.${format}`;
  const headers = { "Content-Disposition": `attachment; filename="${name}"`, "Cache-Control": "private, no-store" };
  if (format === "csv") return new Response(candidatesCsv(sweepId, data), { headers: { ...headers, "Content-Type": "text/csv; charset=utf-8" } });
  const body = { sweepId, scenario: data.scenario, total: data.total, units: CANDIDATE_UNITS, candidates: candidateRowsForExport(data) };
  return new Response(JSON.stringify(body), { headers: { ...headers, "Content-Type": "application/json; charset=utf-8" } });
});
