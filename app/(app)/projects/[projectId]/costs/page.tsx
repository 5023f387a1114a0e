import { CostBasisEditor } from "@/components/costs/cost-basis-editor";
import { ProjectCrumbs } from "@/components/layout/breadcrumbs";
import { loadProjectPage } from "../project-data";

export const dynamic = "force-dynamic";
export const metadata = { title: "Cost basis" };

export default async function CostBasisPage({ params }: { params: Promise<{ projectId: string }> }) {
  const { projectId } = await params;
  const { project } = await loadProjectPage(projectId);
  return (
    <div className="space-y-4">
      <ProjectCrumbs project={project} here="Cost basis" />
      <div>
        <h1>Cost basis</h1>
        <p className="text-ink-soft">How this project prices vessels: the sweep builder&apos;s cost objective can start from it. Each number carries where it comes from.</p>
      </div>
      <CostBasisEditor projectId={project.id} />
    </div>
  );
}
