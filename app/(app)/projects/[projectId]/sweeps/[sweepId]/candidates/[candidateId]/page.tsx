import { notFound } from "next/navigation";
import { Suspense } from "react";
import { CandidateView } from "@/components/candidates/candidate-view";
import { requirePageActor } from "@/lib/auth/session";
import { can } from "@/lib/authz/policy";
import { uuidSchema } from "@/lib/schemas/foundation";

export const dynamic = "force-dynamic";

export default async function CandidatePage({ params }: { params: Promise<{ projectId: string; sweepId: string; candidateId: string }> }) {
  const { candidateId } = await params;
  const actor = await requirePageActor();
  if (!uuidSchema.safeParse(candidateId).success) notFound();
  return (
    <Suspense>
      <CandidateView candidateId={candidateId} canPin={can(actor, "pin.create")} />
    </Suspense>
  );
}
