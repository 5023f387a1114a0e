import Link from "next/link";
import { ProjectCrumbs } from "@/components/layout/breadcrumbs";
import { defaultBuilderValues } from "@/components/sweep-builder/builder-form-state";
import { SweepBuilder } from "@/components/sweep-builder/sweep-builder";
import { getDb } from "@/db/client";
import { can } from "@/lib/authz/policy";
import { listKineticsModels } from "@/lib/services/kinetics";
import { typedUnits } from "@/lib/units/typed-units";
import { loadProjectPage } from "../../project-data";

export const dynamic = "force-dynamic";
export const metadata = { title: "New sweep" };

export default async function NewSweepPage({ params, searchParams }: { params: Promise<{ projectId: string }>; searchParams: Promise<{ version?: string }> }) {
  const { projectId } = await params;
  const { version } = await searchParams;
  const { actor, project } = await loadProjectPage(projectId);
  const allowed = can(actor, "sweep.create");
  const models = allowed ? await listKineticsModels(getDb(), actor, project.id) : [];
  const versions = models.filter((m) => m.latestVersion).map((m) => ({ id: m.latestVersion.id, label: `${m.name} · v${m.latestVersion.version}`, units: typedUnits(m.latestVersion.spec) }));
  const chosen = versions.find((o) => o.id === version)?.id ?? versions[0]?.id ?? "";
  return (
    <div className="space-y-4">
      <ProjectCrumbs project={project} here="New sweep" />
      <div>
        <h1>New sweep</h1>
        <p className="text-ink-soft">Rank every candidate train against a target, over one scenario or a grid of them.</p>
      </div>
      {!allowed ? (
        <p className="card p-4 text-ink-soft">Your role does not run sweeps.</p>
      ) : versions.length === 0 ? (
        <div className="card p-6 text-center">
          <p className="font-medium">No kinetics in this project yet</p>
          <p className="mt-1 text-ink-soft">A sweep starts from a kinetics version.</p>
          <Link href={`/projects/${project.id}/kinetics/new`} className="btn-primary mt-3">
            Define kinetics
          </Link>
        </div>
      ) : (
        <SweepBuilder projectId={project.id} versions={versions} initial={defaultBuilderValues(chosen)} />
      )}
    </div>
  );
}
