import { getDb } from "@/db/client";
import { requireActor } from "@/lib/auth/session";
import { route, uuidParam } from "@/lib/http";
import { getDesignReport } from "@/lib/services/design-reports";
import { stageTableCsv } from "@/lib/reports/exports";
import { reportFileName } from "@/lib/reports/report-format";

type Ctx = { params: Promise<{ pinId: string }> };

/** The stage table of a pinned design as CSV, units in the headers. */
export const GET = route<Ctx>(async (_req, ctx) => {
  const actor = await requireActor();
  const report = await getDesignReport(getDb(), actor, await uuidParam(ctx, "pinId", "pinned design"));
  return new Response(stageTableCsv(report), {
    headers: {
      "Content-Type": "text/csv; charset=utf-8",
      "Content-Disposition": `attachment; filename="${reportFileName(report, "csv")}"`,
      "Cache-Control": "private, no-store",
    },
  });
});
