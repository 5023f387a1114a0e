import { ProjectsPanel, type ProjectRow } from "@/components/projects/projects-panel";
import { getDb } from "@/db/client";
import { requirePageActor } from "@/lib/auth/session";
import { can } from "@/lib/authz/policy";
import { listProjects } from "@/lib/services/projects";

export const metadata = { title: "Projects" };

export default async function TeamHomePage() {
  const actor = await requirePageActor();
  const projects = await listProjects(getDb(), actor);
  return (
    <div className="space-y-4">
      <div>
        <h1>{actor.teamName}</h1>
        <p className="text-ink-soft">Each project holds the kinetics, sweeps and pinned reactor trains of one design job.</p>
      </div>
      <ProjectsPanel initial={JSON.parse(JSON.stringify(projects)) as ProjectRow[]} canCreate={can(actor, "project.create")} />
    </div>
  );
}
