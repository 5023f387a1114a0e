import Link from "next/link";
import { ProjectCrumbs } from "@/components/layout/breadcrumbs";
import { SweepBuilderByKind } from "@/components/sweep-builder/builder-by-kind";
import type { NetworkVersionInfo } from "@/components/sweep-builder/network-builder-form-state";
import { getDb } from "@/db/client";
import { can } from "@/lib/authz/policy";
import { listKineticsModels } from "@/lib/services/kinetics";
import { isNetworkSpec, type NetworkKineticsSpec } from "@/lib/schemas/network-spec";
import { typedUnits } from "@/lib/units/typed-units";
import { loadProjectPage } from "../../project-data";

export const dynamic = "force-dynamic";
export const metadata = { title: "New sweep" };

/** What the network sweep form needs of a model of several reactions: species, key reactant, wanted product, its reactions' rate terms. */
function networkInfo(id: string, label: string, spec: NetworkKineticsSpec, units: NetworkVersionInfo["units"]): NetworkVersionInfo {
  return {
    id,
    label,
    kind: "network",
    species: Object.keys(spec.feed.concentrations),
    keyReactant: spec.keyReactant,
    ...(spec.product ? { product: spec.product } : {}),
    reactions: spec.reactions.map((r) => ({ power: r.rate.law === "power", reverse: r.rate.law === "power" && !!r.rate.reverse, arrhenius: r.rate.law === "power" && r.rate.activationEnergy !== undefined })),
    units,
  };
}

export default async function NewSweepPage({ params, searchParams }: { params: Promise<{ projectId: string }>; searchParams: Promise<{ version?: string }> }) {
  const { projectId } = await params;
  const { version } = await searchParams;
  const { actor, project } = await loadProjectPage(projectId);
  const allowed = can(actor, "sweep.create");
  const models = allowed ? await listKineticsModels(getDb(), actor, project.id) : [];
  const versions = models
    .filter((m) => m.latestVersion)
    .map((m) => {
      const id = m.latestVersion.id;
      const label = `${m.name} · v${m.latestVersion.version}`;
      const units = typedUnits(m.latestVersion.spec);
      return { id, label, units, ...(isNetworkSpec(m.latestVersion.spec) ? { label: `${label} · several reactions`, network: networkInfo(id, label, m.latestVersion.spec as unknown as NetworkKineticsSpec, units) } : {}) };
    });
  const chosen = versions.find((o) => o.id === version)?.id ?? versions[0]?.id ?? "";
  return (
    <div className="space-y-4">
      <ProjectCrumbs project={project} here="New sweep" />
      <div>
        <h1>New sweep</h1>
        <p className="text-ink-soft">Rank every candidate train against a target or, for several reactions, by yield, selectivity or volume, over one scenario or a grid of them.</p>
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
        <SweepBuilderByKind projectId={project.id} versions={versions} initialVersionId={chosen} />
      )}
    </div>
  );
}
