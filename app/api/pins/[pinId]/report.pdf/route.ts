import { getDb } from "@/db/client";
import { requireActor } from "@/lib/auth/session";
import { route, uuidParam } from "@/lib/http";
import { getDesignReport } from "@/lib/services/design-reports";
import { reportFileName, reportUnits } from "@/lib/reports/report-format";
import { getDisplayPreference } from "@/lib/services/display-units";
import { renderReportPdf } from "@/lib/reports/report-pdf";

// pdfkit reads its font files from disk: the Node runtime, never the edge.
export const runtime = "nodejs";

type Ctx = { params: Promise<{ pinId: string }> };

/** The design report of a pinned design as an A4 PDF, for download. */
export const GET = route<Ctx>(async (_req, ctx) => {
  const actor = await requireActor();
  const report = await getDesignReport(getDb(), actor, await uuidParam(ctx, "pinId", "pinned design"));
  // The PDF speaks the reader's units, like the report page; its CSV and JSON stay SI.
  const pdf = await renderReportPdf(report, reportUnits(report, await getDisplayPreference(getDb(), actor.userId)));
  return new Response(new Uint8Array(pdf), {
    headers: {
      "Content-Type": "application/pdf",
      "Content-Disposition": `attachment; filename="${reportFileName(report, "pdf")}"`,
      "Cache-Control": "private, no-store",
    },
  });
});
