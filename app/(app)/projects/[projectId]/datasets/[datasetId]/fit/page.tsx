import { notFound } from "next/navigation";
import { ProjectCrumbs } from "@/components/layout/breadcrumbs";
import { FitWorkbench } from "@/components/fitting/fit-workbench";
import { getDb } from "@/db/client";
import { can } from "@/lib/authz/policy";
import { uuidSchema } from "@/lib/schemas/ids";
import { getDatasetVersionForFit } from "@/lib/services/fits";
import { listKineticsModels } from "@/lib/services/kinetics";
import { loadProjectPage, orNotFound } from "../../../project-data";

export const dynamic = "force-dynamic";
export const metadata = { title: "Fit a rate law" };

const COLUMN_LABELS: Record<string, string> = { conversion: "conversion", concA: "C_A", concR: "C_R", temperature: "temperature" };

export default async function FitPage({
  params,
  searchParams,
}: {
  params: Promise<{ projectId: string; datasetId: string }>;
  searchParams: Promise<{ version?: string }>;
}) {
  const { projectId, datasetId } = await params;
  const { version } = await searchParams;
  const { actor, project } = await loadProjectPage(projectId);
  const number = version === undefined ? undefined : Number(version);
  if (!uuidSchema.safeParse(datasetId).success || !can(actor, "dataset.read") || (number !== undefined && !Number.isInteger(number))) notFound();
  const { dataset, version: v } = await orNotFound(getDatasetVersionForFit(getDb(), actor, datasetId, number));
  if (dataset.projectId !== project.id) notFound();
  const canSave = can(actor, "kinetics.create");
  const models = canSave ? (await listKineticsModels(getDb(), actor, project.id)).map((m) => ({ id: m.id, name: m.name })) : [];

  return (
    <div className="space-y-4">
      <ProjectCrumbs project={project} here={`Fit ${dataset.name}`} />
      <div>
        <h1 data-testid="fit-title">
          Fit a rate law to {dataset.name} v{v.version}
        </h1>
        <p className="text-ink-soft" data-testid="fit-points">
          {v.rowCount} points; columns: {["rate", ...v.columns.map((c) => COLUMN_LABELS[c] ?? c)].join(", ")}. Each law is fitted by nonlinear least squares
          (Levenberg-Marquardt) to the measured rates; nothing is stored until you save one as kinetics.
        </p>
      </div>
      <FitWorkbench projectId={project.id} versionId={v.id} columns={v.columns} storedFeedConcA={v.feedConcA} models={models} canSave={canSave} />
    </div>
  );
}
