import { getDb } from "@/db/client";
import { requireActor } from "@/lib/auth/session";
import { route, uuidParam } from "@/lib/http";
import { getDesignReport } from "@/lib/services/design-reports";
import { reportFileName } from "@/lib/reports/report-format";

type Ctx = { params: Promise<{ pinId: string }> };

/** The design report of a pinned design as JSON (SI numbers, with the cautions). */
export const GET = route<Ctx>(async (_req, ctx) => {
  const actor = await requireActor();
  const report = await getDesignReport(getDb(), actor, await uuidParam(ctx, "pinId", "pinned design"));
  return new Response(JSON.stringify({ report }, null, 2), {
    headers: {
      "Content-Type": "application/json; charset=utf-8",
      "Content-Disposition": `attachment; filename="${reportFileName(report, "json")}"`,
      "Cache-Control": "private, no-store",
    },
  });
});
