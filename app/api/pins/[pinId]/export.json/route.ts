import { recordRoute } from "@/lib/http/signed-in-route";
import { getDesignReport } from "@/lib/services/design-reports";
import { reportFileName } from "@/lib/reports/report-format";

/** The design report of a pinned design as JSON (SI numbers, with the cautions). */
export const GET = recordRoute("pinId", "pinned design")(async ({ actor, db, id }) => {
  const report = await getDesignReport(db, actor, id);
  return new Response(JSON.stringify({ report }, null, 2), {
    headers: {
      "Content-Type": "application/json; charset=utf-8",
      "Content-Disposition": `attachment; filename="${reportFileName(report, "json")}"`,
      "Cache-Control": "private, no-store",
    },
  });
});
