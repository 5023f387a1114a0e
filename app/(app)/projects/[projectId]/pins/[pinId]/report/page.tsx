import Link from "next/link";
import { notFound } from "next/navigation";
import { ReportActions } from "@/components/reports/report-actions";
import { DesignReportView } from "@/components/reports/design-report-view";
import { getDb } from "@/db/client";
import { getDesignReport } from "@/lib/services/design-reports";
import { getDisplayPreference } from "@/lib/services/display-units";
import { uuidSchema } from "@/lib/schemas/ids";
import { loadProjectPage, orNotFound } from "../../../project-data";
import "./report-print.css";

export const dynamic = "force-dynamic";

/** The printable design report of a pinned design (A4 through the browser's print, or the PDF). */
export default async function DesignReportPage({ params }: { params: Promise<{ projectId: string; pinId: string }> }) {
  const { projectId, pinId } = await params;
  const { actor, project } = await loadProjectPage(projectId);
  if (!uuidSchema.safeParse(pinId).success) notFound();
  const report = await orNotFound(getDesignReport(getDb(), actor, pinId));
  if (report.project.id !== project.id) notFound();
  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-center justify-between gap-3 print:hidden">
        <nav aria-label="Breadcrumb" className="text-sm text-ink-soft">
          <Link href="/" className="hover:underline">
            Projects
          </Link>{" "}
          /{" "}
          <Link href={`/projects/${project.id}`} className="hover:underline">
            {project.name}
          </Link>{" "}
          / <span aria-current="page">Design report</span>
        </nav>
        <ReportActions pinId={report.pin.id} />
      </div>
      <DesignReportView report={report} preference={await getDisplayPreference(getDb(), actor.userId)} />
    </div>
  );
}
