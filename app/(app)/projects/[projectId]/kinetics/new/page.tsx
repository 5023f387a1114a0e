import { ProjectCrumbs } from "@/components/layout/breadcrumbs";
import { defaultKineticsValues } from "@/components/kinetics/kinetics-form-state";
import { KineticsEditor } from "@/components/kinetics/kinetics-editor";
import { loadProjectPage } from "../../project-data";
import { can } from "@/lib/authz/policy";

export const dynamic = "force-dynamic";
export const metadata = { title: "New kinetics" };

export default async function NewKineticsPage({ params }: { params: Promise<{ projectId: string }> }) {
  const { projectId } = await params;
  const { actor, project } = await loadProjectPage(projectId);
  return (
    <div className="space-y-4">
      <ProjectCrumbs project={project} here="New kinetics" />
      <div>
        <h1>New kinetics</h1>
        <p className="text-ink-soft">Feed, reaction, rate law and thermal mode. Every number is stored in SI, whatever unit you type it in.</p>
      </div>
      {can(actor, "kinetics.create") ? (
        <KineticsEditor mode={{ kind: "create", projectId: project.id }} initial={defaultKineticsValues()} />
      ) : (
        <p className="card p-4 text-ink-soft">Your role lets you read pinned designs but not define kinetics.</p>
      )}
    </div>
  );
}
