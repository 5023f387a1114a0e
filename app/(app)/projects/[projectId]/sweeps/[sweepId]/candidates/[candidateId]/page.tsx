import { notFound } from "next/navigation";
import { Suspense } from "react";
import { CandidateView } from "@/components/candidates/candidate-view";
import { TypedUnitsProvider } from "@/components/layout/display-units-context";
import { getDb } from "@/db/client";
import { sweepTypedUnits } from "@/lib/services/sweeps";
import { requirePageActor } from "@/lib/auth/session";
import { can } from "@/lib/authz/policy";
import { uuidSchema } from "@/lib/schemas/ids";

export const dynamic = "force-dynamic";

export default async function CandidatePage({ params }: { params: Promise<{ projectId: string; sweepId: string; candidateId: string }> }) {
  const { sweepId, candidateId } = await params;
  const actor = await requirePageActor();
  if (!uuidSchema.safeParse(candidateId).success || !uuidSchema.safeParse(sweepId).success) notFound();
  // The candidate's numbers may be shown in the units its kinetics was typed in.
  const units = await sweepTypedUnits(getDb(), actor, sweepId).catch(() => ({}));
  return (
    <Suspense>
      <TypedUnitsProvider units={units}>
        <CandidateView candidateId={candidateId} canPin={can(actor, "pin.create")} typedUnits={units} />
      </TypedUnitsProvider>
    </Suspense>
  );
}
