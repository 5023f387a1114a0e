import { notFound } from "next/navigation";
import { Suspense } from "react";
import { SweepView } from "@/components/sweeps/sweep-view";
import { getDb } from "@/db/client";
import { requirePageActor } from "@/lib/auth/session";
import { can } from "@/lib/authz/policy";
import { AppError } from "@/lib/errors";
import { uuidSchema } from "@/lib/schemas/ids";
import { getProjectById } from "@/lib/services/projects";
import { sweepTypedUnits } from "@/lib/services/sweeps";

export const dynamic = "force-dynamic";

export default async function SweepPage({ params }: { params: Promise<{ projectId: string; sweepId: string }> }) {
  const { projectId, sweepId } = await params;
  const actor = await requirePageActor();
  if (!uuidSchema.safeParse(projectId).success || !uuidSchema.safeParse(sweepId).success) notFound();
  let projectName: string;
  try {
    projectName = (await getProjectById(getDb(), actor, projectId)).name;
  } catch (err) {
    if (err instanceof AppError && err.code === "not_found") notFound();
    throw err;
  }
  // The grid axis speaks the units the kinetics was typed in; a sweep the actor cannot read shows its own message.
  const units = await sweepTypedUnits(getDb(), actor, sweepId).catch(() => ({}));
  return (
    <Suspense>
      <SweepView sweepId={sweepId} projectId={projectId} projectName={projectName} canSubmit={can(actor, "sweep.create")} typedUnits={units} />
    </Suspense>
  );
}
