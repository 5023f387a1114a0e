import Link from "next/link";
import { ProjectCostLinks } from "@/components/costs/project-cost-links";
import { AuditList, type AuditRow } from "@/components/audit/audit-list";
import { Cautions } from "@/components/cautions/cautions";
import { stageTypeCautions } from "@/lib/stage-types";
import { DatasetsPanel, type DatasetRow } from "@/components/datasets/datasets-panel";
import { PinsPanel, type PinRow } from "@/components/pins/pins-panel";
import { SweepsList, type SweepRow } from "@/components/sweeps/sweeps-list";
import { getDb } from "@/db/client";
import { can } from "@/lib/authz/policy";
import { listAuditEntries } from "@/lib/services/audit";
import { listDatasets } from "@/lib/services/datasets";
import { listKineticsModels } from "@/lib/services/kinetics";
import { pinLabels } from "@/lib/services/pin-labels";
import { listPins } from "@/lib/services/pins";
import { listSweeps } from "@/lib/services/sweeps";
import { loadProjectPage } from "./project-data";
import { formatDateTime } from "@/lib/format/dates";
import type { TrainStageType } from "@/lib/engine";

export const dynamic = "force-dynamic";

const wire = <T,>(v: unknown) => JSON.parse(JSON.stringify(v)) as T;

export default async function ProjectPage({ params }: { params: Promise<{ projectId: string }> }) {
  const { projectId } = await params;
  const { actor, project } = await loadProjectPage(projectId);
  const db = getDb();
  const readsKinetics = can(actor, "kinetics.read");
  const [audit, models, sweeps, pins] = await Promise.all([
    can(actor, "audit.read") ? listAuditEntries(db, actor, { entityType: "project", entityId: project.id }) : null,
    readsKinetics ? listKineticsModels(db, actor, project.id) : [],
    can(actor, "sweep.read") ? listSweeps(db, actor, project.id) : null,
    listPins(db, actor, project.id),
  ]);
  const datasets = can(actor, "dataset.read") ? await listDatasets(db, actor, project.id) : null;
  const { names, versions } = await pinLabels(db, actor, pins);
  const pinRows: PinRow[] = pins.map((p) => {
    const c = p.candidate as { sequence?: TrainStageType[]; totalVolume?: number | null; totalCost?: number | null; stages?: { temperatureOut?: number }[]; sweep?: { id: string; name: string } };
    const v = versions[p.kineticsVersionId];
    return {
      id: p.id,
      state: p.state,
      note: p.note,
      pinnedAt: p.pinnedAt.toISOString(),
      pinnedByName: names[p.pinnedBy] ?? "someone",
      reviewerName: p.reviewerId ? (names[p.reviewerId] ?? "someone") : null,
      reviewComment: p.reviewComment,
      reviewedAt: p.reviewedAt?.toISOString() ?? null,
      kinetics: { label: v?.label ?? "kinetics version", href: v && readsKinetics ? `/projects/${project.id}/kinetics/${v.modelId}` : null },
      sweep: c.sweep ?? null,
      sequence: c.sequence ?? [],
      totalVolume: c.totalVolume ?? null,
      totalCost: c.totalCost ?? null,
      stageTemperatures: (c.stages ?? []).map((s) => s.temperatureOut ?? NaN).filter(Number.isFinite),
      spec: p.spec,
      canReview: can(actor, "pin.review") && p.pinnedBy !== actor.userId,
      reportHref: `/projects/${project.id}/pins/${p.id}/report`,
    };
  });
  const canAuthor = can(actor, "kinetics.create");

  return (
    <div className="space-y-5">
      <nav aria-label="Breadcrumb" className="text-sm text-ink-soft">
        <Link href="/" className="hover:underline">
          Projects
        </Link>{" "}
        / <span aria-current="page">{project.name}</span>
      </nav>
      <div className="flex items-start justify-between gap-4">
        <div>
          <h1 data-testid="project-title">{project.name}</h1>
          <p className="mt-1 max-w-3xl text-ink-soft">{project.description || "No purpose written yet."}</p>
          <ProjectCostLinks projectId={project.id} canRate={can(actor, "train.rate")} />
        </div>
        {project.archivedAt ? <span className="badge border-line">archived</span> : null}
      </div>

      <div className="grid gap-5 lg:grid-cols-2">
        {readsKinetics ? (
          <section className="card overflow-hidden" aria-labelledby="kinetics-title">
            <div className="flex items-center justify-between border-b border-line px-3 py-2">
              <h2 id="kinetics-title">Kinetics</h2>
              {canAuthor ? (
                <Link href={`/projects/${project.id}/kinetics/new`} className="btn-primary py-1">
                  New kinetics
                </Link>
              ) : null}
            </div>
            {models.length === 0 ? (
              <p className="px-3 py-6 text-center text-ink-soft">No kinetics yet{canAuthor ? ": define the rate law, feed and thermal mode first." : "."}</p>
            ) : (
              <table className="table-dense" data-testid="kinetics-table">
                <thead>
                  <tr>
                    <th scope="col">Model</th>
                    <th scope="col">Latest</th>
                    <th scope="col">Saved (UTC)</th>
                    <th scope="col">
                      <span className="sr-only">Actions</span>
                    </th>
                  </tr>
                </thead>
                <tbody>
                  {models.map((m) => (
                    <tr key={m.id}>
                      <td className="font-medium">{m.name}</td>
                      <td className="num">v{m.latestVersion?.version ?? "—"}</td>
                      <td className="num whitespace-nowrap">{formatDateTime(m.latestVersion?.createdAt)}</td>
                      <td className="text-right">
                        <Link href={`/projects/${project.id}/kinetics/${m.id}`} className="btn-quiet py-1" aria-label={`Edit ${m.name} (saves a new version)`}>
                          {canAuthor ? "Edit / new version" : "Open"}
                        </Link>
                      </td>
                    </tr>
                  ))}
                </tbody>
              </table>
            )}
          </section>
        ) : null}
        {sweeps ? <SweepsList projectId={project.id} initial={wire<SweepRow[]>(sweeps)} canCreate={can(actor, "sweep.create") && models.length > 0} /> : null}
      </div>

      {datasets ? <DatasetsPanel projectId={project.id} datasets={wire<DatasetRow[]>(datasets)} canUpload={can(actor, "dataset.create")} /> : null}

      <PinsPanel pins={pinRows} viewerOnly={actor.role === "viewer"} />
      {pinRows.length ? <Cautions more={stageTypeCautions(pinRows.flatMap((p) => p.sequence))} /> : null}

      {audit ? (
        <section className="card overflow-hidden" aria-labelledby="audit-title">
          <h2 id="audit-title" className="border-b border-line px-3 py-2">
            Audit trail
          </h2>
          <AuditList entries={wire<AuditRow[]>(audit)} />
        </section>
      ) : null}
    </div>
  );
}
