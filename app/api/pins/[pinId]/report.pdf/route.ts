import { recordRoute } from "@/lib/http/signed-in-route";
import { getDesignReport } from "@/lib/services/design-reports";
import { reportFileName, reportUnits } from "@/lib/reports/report-format";
import { getDisplayPreference } from "@/lib/services/display-units";
import { renderReportPdf } from "@/lib/reports/report-pdf";

// pdfkit reads its font files from disk: the Node runtime, never the edge.
export const runtime = "nodejs";

/** The design report of a pinned design as an A4 PDF, for download. */
export const GET = recordRoute("pinId", "pinned design")(async ({ actor, db, id }) => {
  const report = await getDesignReport(db, actor, id);
  // The PDF speaks the reader's units, like the report page; its CSV and JSON stay SI.
  const pdf = await renderReportPdf(report, reportUnits(report, await getDisplayPreference(db, actor.userId)));
  return new Response(new Uint8Array(pdf), {
    headers: {
      "Content-Type": "application/pdf",
      "Content-Disposition": `attachment; filename="${reportFileName(report, "pdf")}"`,
      "Cache-Control": "private, no-store",
    },
  });
});
