import Link from "next/link";
import { ProjectCrumbs } from "@/components/layout/breadcrumbs";
import { notFound } from "next/navigation";
import { specToForm } from "@/components/kinetics/kinetics-form-state";
import { KineticsEditor } from "@/components/kinetics/kinetics-editor";
import { networkSpecToForm } from "@/components/kinetics/network-form-state";
import { NetworkEditor } from "@/components/kinetics/network-editor";
import { loadProjectPage, orNotFound } from "../../project-data";
import { FormMessage } from "@/components/ui/field";
import { getDb } from "@/db/client";
import { normaliseKinetics } from "@/lib/engine";
import { can } from "@/lib/authz/policy";
import { uuidSchema } from "@/lib/schemas/ids";
import type { KineticsSpec } from "@/lib/schemas/sweeps";
import { isNetworkSpec, networkKineticsSpecSchema } from "@/lib/schemas/network-spec";
import { networkKineticsInSI } from "@/lib/units/network-kinetics-si";
import { getKineticsModel } from "@/lib/services/kinetics";
import { FitSourceLine } from "@/components/fitting/fit-source-line";
import { listKineticsSources } from "@/lib/services/fits";
import { formatDateTime } from "@/lib/format/dates";

export const dynamic = "force-dynamic";
export const metadata = { title: "Kinetics" };


export default async function KineticsModelPage({
  params,
  searchParams,
}: {
  params: Promise<{ projectId: string; modelId: string }>;
  searchParams: Promise<{ saved?: string }>;
}) {
  const { projectId, modelId } = await params;
  const { saved } = await searchParams;
  const { actor, project } = await loadProjectPage(projectId);
  if (!uuidSchema.safeParse(modelId).success || !can(actor, "kinetics.read")) notFound();
  const model = await orNotFound(getKineticsModel(getDb(), actor, modelId));
  if (model.projectId !== project.id) notFound();
  const latest = model.versions[0];
  const sources = new Map((await listKineticsSources(getDb(), actor, model.versions.map((v) => v.id))).map((s) => [s.kineticsVersionId, s]));
  // A model's kind never changes between versions: the latest tells which editor opens.
  const several = isNetworkSpec(latest.spec);
  let initial;
  let networkInitial;
  try {
    if (several) networkInitial = networkSpecToForm(networkKineticsInSI(networkKineticsSpecSchema.parse(latest.spec)), { note: "" });
    else initial = specToForm(normaliseKinetics(latest.spec as KineticsSpec), { note: "" });
  } catch {
    initial = null;
    networkInitial = null;
  }
  const mode = { kind: "version" as const, projectId: project.id, modelId: model.id, modelName: model.name, latestVersion: latest.version };

  return (
    <div className="space-y-4">
      <ProjectCrumbs project={project} here={model.name} />
      <div className="flex flex-wrap items-start justify-between gap-3">
        <div>
          <h1 data-testid="kinetics-title">{model.name}</h1>
          <p className="text-ink-soft">
            Latest: version {latest.version}, {formatDateTime(latest.createdAt)}{latest.note ? ` · ${latest.note}` : ""}
          </p>
          {sources.has(latest.id) ? <FitSourceLine projectId={project.id} source={sources.get(latest.id)!} testId="latest-source" /> : null}
        </div>
        {can(actor, "sweep.create") ? (
          <Link href={`/projects/${project.id}/sweeps/new?version=${latest.id}`} className="btn-primary">
            Build a sweep on version {latest.version}
          </Link>
        ) : null}
      </div>
      {saved ? <FormMessage kind="info">Saved as version {latest.version}. Edit below to make the next version, or build a sweep on it.</FormMessage> : null}
      {networkInitial && can(actor, "kinetics.create") ? (
        <NetworkEditor key={latest.id} mode={mode} initial={networkInitial} />
      ) : initial && can(actor, "kinetics.create") ? (
        <KineticsEditor key={latest.id} mode={mode} initial={initial} />
      ) : (
        <pre className="card overflow-auto p-4 text-xs">{JSON.stringify(latest.spec, null, 2)}</pre>
      )}
      <section className="card overflow-hidden" aria-labelledby="versions-title">
        <h2 id="versions-title" className="border-b border-line px-3 py-2">
          Versions
        </h2>
        <table className="table-dense" data-testid="versions-table">
          <thead>
            <tr>
              <th scope="col">Version</th>
              <th scope="col">Saved (UTC)</th>
              <th scope="col">{several ? "Reactions" : "Rate law"}</th>
              <th scope="col">Note</th>
            </tr>
          </thead>
          <tbody>
            {model.versions.map((v) => (
              <tr key={v.id}>
                <td className="num">v{v.version}</td>
                <td className="num whitespace-nowrap">{formatDateTime(v.createdAt)}</td>
                <td>{several ? reactionsSummary(v.spec) : ((v.spec as KineticsSpec).reaction?.rate?.law ?? "—").toString()}</td>
                <td className="text-ink-soft">
                  {v.note || (sources.has(v.id) ? null : "—")}
                  {sources.has(v.id) ? <FitSourceLine projectId={project.id} source={sources.get(v.id)!} /> : null}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </section>
    </div>
  );
}

/** "3 reactions, key reactant A, wanted product B" for a version's row. */
function reactionsSummary(spec: unknown): string {
  const s = spec as { reactions?: unknown[]; keyReactant?: string; product?: string };
  const n = s.reactions?.length ?? 0;
  return [`${n} reaction${n === 1 ? "" : "s"}`, s.keyReactant ? `key reactant ${s.keyReactant}` : "", s.product ? `wanted product ${s.product}` : ""].filter(Boolean).join(", ");
}
