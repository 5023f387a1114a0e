import { recordRoute } from "@/lib/http/signed-in-route";
import { getDesignReport } from "@/lib/services/design-reports";
import { stageTableCsv } from "@/lib/reports/exports";
import { reportFileName } from "@/lib/reports/report-format";

/** The stage table of a pinned design as CSV, units in the headers. */
export const GET = recordRoute("pinId", "pinned design")(async ({ actor, db, id }) => {
  const report = await getDesignReport(db, actor, id);
  return new Response(stageTableCsv(report), {
    headers: {
      "Content-Type": "text/csv; charset=utf-8",
      "Content-Disposition": `attachment; filename="${reportFileName(report, "csv")}"`,
      "Cache-Control": "private, no-store",
    },
  });
});
