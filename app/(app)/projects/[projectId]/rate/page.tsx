import Link from "next/link";
import { ProjectCrumbs } from "@/components/layout/breadcrumbs";
import { RateTrainForm } from "@/components/rating/rate-train-form";
import { getDb } from "@/db/client";
import { can } from "@/lib/authz/policy";
import { listKineticsModels } from "@/lib/services/kinetics";
import { typedUnits } from "@/lib/units/typed-units";
import { loadProjectPage } from "../project-data";

export const dynamic = "force-dynamic";
export const metadata = { title: "Rate a fixed train" };

export default async function RatePage({ params }: { params: Promise<{ projectId: string }> }) {
  const { projectId } = await params;
  const { actor, project } = await loadProjectPage(projectId);
  const allowed = can(actor, "train.rate");
  const models = allowed ? await listKineticsModels(getDb(), actor, project.id) : [];
  const versions = models.filter((m) => m.latestVersion).map((m) => ({ id: m.latestVersion.id, label: `${m.name} · v${m.latestVersion.version}`, units: typedUnits(m.latestVersion.spec) }));
  return (
    <div className="space-y-4">
      <ProjectCrumbs project={project} here="Rate a fixed train" />
      <div>
        <h1>Rate a fixed train</h1>
        <p className="text-ink-soft">Given vessels, what conversion does the train reach, and how much feed can it take before it misses the target?</p>
      </div>
      {!allowed ? (
        <p className="card p-4 text-ink-soft">Your role does not rate trains.</p>
      ) : versions.length === 0 ? (
        <div className="card p-6 text-center">
          <p className="font-medium">No kinetics in this project yet</p>
          <Link href={`/projects/${project.id}/kinetics/new`} className="btn-primary mt-3">
            Define kinetics
          </Link>
        </div>
      ) : (
        <RateTrainForm projectId={project.id} versions={versions} />
      )}
    </div>
  );
}
