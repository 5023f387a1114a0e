import { notFound } from "next/navigation";
import { CandidateView } from "@/components/candidates/candidate-view";
import { TypedUnitsProvider } from "@/components/layout/display-units-context";
import { getDb } from "@/db/client";
import { sweepTypedUnits } from "@/lib/services/sweeps";
import { requirePageActor } from "@/lib/auth/session";
import { can } from "@/lib/authz/policy";
import { uuidSchema } from "@/lib/schemas/ids";
import { loadCandidateFirstPaint } from "./first-paint";

export const dynamic = "force-dynamic";

export default async function CandidatePage({ params }: { params: Promise<{ projectId: string; sweepId: string; candidateId: string }> }) {
  const { sweepId, candidateId } = await params;
  const actor = await requirePageActor();
  if (!uuidSchema.safeParse(candidateId).success || !uuidSchema.safeParse(sweepId).success) notFound();
  const db = getDb();
  // The typed units and the candidate with its sweep are read at once: the title, chart and stages
  // come with the page. The candidate's numbers may be shown in the units its kinetics was typed in.
  const [units, initial] = await Promise.all([sweepTypedUnits(db, actor, sweepId).catch(() => ({})), loadCandidateFirstPaint(db, actor, sweepId, candidateId)]);
  // No Suspense boundary of its own (the page is rendered per request, so the search params need
  // none): the content then arrives in one reveal with the page, as on the sweep page.
  return (
    <TypedUnitsProvider units={units}>
      <CandidateView candidateId={candidateId} canPin={can(actor, "pin.create")} typedUnits={units} initial={initial ?? undefined} />
    </TypedUnitsProvider>
  );
}
