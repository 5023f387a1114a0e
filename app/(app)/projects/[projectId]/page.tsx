import Link from "next/link";
import { notFound } from "next/navigation";
import { AuditList, type AuditRow } from "@/components/audit/audit-list";
import { getDb } from "@/db/client";
import { requirePageActor } from "@/lib/auth/session";
import { can } from "@/lib/authz/policy";
import { AppError } from "@/lib/errors";
import { uuidSchema } from "@/lib/schemas/foundation";
import { listAuditEntries } from "@/lib/services/audit";
import { getProjectById } from "@/lib/services/projects";

export const dynamic = "force-dynamic";

async function loadProject(projectId: string) {
  const actor = await requirePageActor();
  if (!uuidSchema.safeParse(projectId).success) notFound();
  try {
    return { actor, project: await getProjectById(getDb(), actor, projectId) };
  } catch (err) {
    if (err instanceof AppError && err.code === "not_found") notFound();
    throw err;
  }
}

export default async function ProjectPage({ params }: { params: Promise<{ projectId: string }> }) {
  const { projectId } = await params;
  const { actor, project } = await loadProject(projectId);
  const audit = can(actor, "audit.read") ? await listAuditEntries(getDb(), actor, { entityType: "project", entityId: project.id }) : null;

  return (
    <div className="space-y-5">
      <div className="text-sm text-ink-soft">
        <Link href="/" className="hover:underline">
          Projects
        </Link>{" "}
        / {project.name}
      </div>
      <div className="flex items-start justify-between gap-4">
        <div>
          <h1 data-testid="project-title">{project.name}</h1>
          <p className="mt-1 max-w-3xl text-ink-soft">{project.description || "No purpose written yet."}</p>
        </div>
        {project.archivedAt ? <span className="badge border-line">archived</span> : null}
      </div>
      <div className="grid gap-4 md:grid-cols-3">
        {[
          ["Kinetics", "Rate laws and bench data for this project's reaction."],
          ["Sweeps", "Ranked candidate trains over operating scenarios."],
          ["Pinned designs", "The trains chosen for the design basis, with their review state."],
        ].map(([title, text]) => (
          <section key={title} className="card p-4">
            <h2>{title}</h2>
            <p className="mt-1 text-ink-soft">{text}</p>
            <p className="mt-3 text-xs text-ink-faint">None yet.</p>
          </section>
        ))}
      </div>
      {audit ? (
        <section className="card overflow-hidden">
          <h2 className="border-b border-line px-3 py-2">Audit trail</h2>
          <AuditList entries={JSON.parse(JSON.stringify(audit)) as AuditRow[]} />
        </section>
      ) : null}
    </div>
  );
}
