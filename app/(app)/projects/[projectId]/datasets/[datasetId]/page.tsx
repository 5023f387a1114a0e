import Link from "next/link";
import { notFound } from "next/navigation";
import { DatasetView } from "@/components/datasets/dataset-view";
import { ProjectCrumbs } from "@/components/layout/breadcrumbs";
import { FormMessage } from "@/components/ui/field";
import { getDb } from "@/db/client";
import { can } from "@/lib/authz/policy";
import type { StoredRateRow } from "@/lib/datasets/table-law";
import { uuidSchema } from "@/lib/schemas/ids";
import { getDataset, getDatasetVersion, listDatasetSources } from "@/lib/services/datasets";
import { listKineticsModels } from "@/lib/services/kinetics";
import { loadProjectPage, orNotFound } from "../../project-data";

export const dynamic = "force-dynamic";
export const metadata = { title: "Rate data" };

export default async function DatasetPage({ params, searchParams }: { params: Promise<{ projectId: string; datasetId: string }>; searchParams: Promise<{ version?: string; saved?: string }> }) {
  const { projectId, datasetId } = await params;
  const { version: wanted, saved } = await searchParams;
  const { actor, project } = await loadProjectPage(projectId);
  if (!uuidSchema.safeParse(datasetId).success || !can(actor, "dataset.read")) notFound();
  const db = getDb();
  const dataset = await orNotFound(getDataset(db, actor, datasetId));
  if (dataset.projectId !== project.id || !dataset.versions.length) notFound();
  const meta = dataset.versions.find((v) => String(v.version) === wanted) ?? dataset.versions[0];
  const version = await getDatasetVersion(db, actor, meta.id);
  const canCreate = can(actor, "dataset.create") && can(actor, "kinetics.create");
  const models = canCreate ? (await listKineticsModels(db, actor, project.id)).map((m) => ({ id: m.id, name: m.name })) : [];
  const sources = await listDatasetSources(db, actor, dataset.id);

  return (
    <div className="space-y-4">
      <ProjectCrumbs project={project} here={dataset.name} />
      <div>
        <h1 data-testid="dataset-title">{dataset.name}</h1>
        <p className="text-ink-soft">
          Version {version.version}: {version.rowCount} rows from {version.fileName}
          {version.feedConcA ? `, feed concentration of A ${version.feedConcA} mol/m³` : ""}
          {version.note ? ` · ${version.note}` : ""}
        </p>
      </div>
      {saved ? <FormMessage kind="info">Accepted {version.rowCount} rows as version {version.version}.</FormMessage> : null}
      <DatasetView
        projectId={project.id}
        dataset={{ id: dataset.id, name: dataset.name }}
        versions={dataset.versions.map((v) => ({ id: v.id, version: v.version, fileName: v.fileName, rowCount: v.rowCount, createdAt: v.createdAt.toISOString(), note: v.note }))}
        selected={{ id: version.id, version: version.version, rows: version.rows as unknown as StoredRateRow[], feedConcA: version.feedConcA }}
        canCreate={canCreate}
        models={models}
      />
      <section className="card space-y-2 p-4" aria-labelledby="dataset-sources">
        <h2 id="dataset-sources">Kinetics made from this dataset</h2>
        {sources.length ? (
          <ul className="list-disc space-y-1 pl-5" data-testid="dataset-sources">
            {sources.map((s) => (
              <li key={s.kineticsVersionId}>
                <Link className="underline" href={`/projects/${project.id}/kinetics/${s.modelId}`}>
                  {s.modelName}, version {s.kineticsVersion}
                </Link>{" "}
                — {s.kind === "fit" ? `fitted${s.law ? ` (${s.law.replace(/-/g, " ")} law)` : ""}` : "measured rate table"} from version {s.datasetVersion}
              </li>
            ))}
          </ul>
        ) : (
          <p className="text-ink-soft">None yet: use a version as a measured rate table, or fit a rate law and save it as kinetics.</p>
        )}
      </section>
    </div>
  );
}
