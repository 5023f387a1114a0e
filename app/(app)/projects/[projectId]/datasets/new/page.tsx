import { notFound } from "next/navigation";
import { UploadWizard, type UploadTarget } from "@/components/datasets/upload-wizard";
import { ProjectCrumbs } from "@/components/layout/breadcrumbs";
import { getDb } from "@/db/client";
import { can } from "@/lib/authz/policy";
import { datasetMappingSchema, type DatasetMapping } from "@/lib/schemas/datasets";
import { uuidSchema } from "@/lib/schemas/ids";
import { getDataset, getDatasetVersion } from "@/lib/services/datasets";
import { loadProjectPage, orNotFound } from "../../project-data";

export const dynamic = "force-dynamic";
export const metadata = { title: "Upload rate data" };

/** New dataset, or (with ?dataset=id) a new version of one, its last column choices kept. */
export default async function NewDatasetPage({ params, searchParams }: { params: Promise<{ projectId: string }>; searchParams: Promise<{ dataset?: string }> }) {
  const { projectId } = await params;
  const { dataset: datasetId } = await searchParams;
  const { actor, project } = await loadProjectPage(projectId);
  if (!can(actor, "dataset.create")) {
    return (
      <div className="space-y-4">
        <ProjectCrumbs project={project} here="Upload rate data" />
        <p className="card p-4 text-ink-soft">Your role does not let you upload rate data.</p>
      </div>
    );
  }
  let target: UploadTarget = { kind: "new", projectId: project.id };
  let initialMapping: DatasetMapping | undefined;
  if (datasetId !== undefined) {
    if (!uuidSchema.safeParse(datasetId).success) notFound();
    const dataset = await orNotFound(getDataset(getDb(), actor, datasetId));
    if (dataset.projectId !== project.id) notFound();
    const latest = dataset.versions[0];
    target = { kind: "version", projectId: project.id, datasetId: dataset.id, datasetName: dataset.name, nextVersion: (latest?.version ?? 0) + 1 };
    if (latest) {
      const parsed = datasetMappingSchema.safeParse((await getDatasetVersion(getDb(), actor, latest.id)).mapping);
      if (parsed.success) initialMapping = parsed.data;
    }
  }
  const title = target.kind === "new" ? "Upload rate data" : `New version of ${target.datasetName}`;
  return (
    <div className="space-y-4">
      <ProjectCrumbs project={project} here={title} />
      <div>
        <h1>{title}</h1>
        <p className="max-w-3xl text-ink-soft">
          Measured rates from the bench, one row per measurement: the rate and either the conversion or the concentration of A, optionally the temperature and the concentration
          of the product. Every value is checked and stored in SI; nothing is stored until the data are clean and you accept them.
        </p>
      </div>
      <UploadWizard target={target} initialMapping={initialMapping} />
    </div>
  );
}
