import { notFound } from "next/navigation";
import { SweepView } from "@/components/sweeps/sweep-view";
import { getDb } from "@/db/client";
import { requirePageActor } from "@/lib/auth/session";
import { can } from "@/lib/authz/policy";
import { AppError } from "@/lib/errors";
import { uuidSchema } from "@/lib/schemas/ids";
import { getProjectById } from "@/lib/services/projects";
import { sweepTypedUnits } from "@/lib/services/sweeps";
import { loadFirstPage } from "./first-page";

export const dynamic = "force-dynamic";

type Search = Record<string, string | string[] | undefined>;

/** The URL's query as the client's useSearchParams reads it (a repeated key keeps its first value). */
function searchOf(raw: Search): URLSearchParams {
  const q = new URLSearchParams();
  for (const [k, v] of Object.entries(raw)) {
    const first = Array.isArray(v) ? v[0] : v;
    if (first !== undefined) q.set(k, first);
  }
  return q;
}

export default async function SweepPage({ params, searchParams }: { params: Promise<{ projectId: string; sweepId: string }>; searchParams: Promise<Search> }) {
  const { projectId, sweepId } = await params;
  const actor = await requirePageActor();
  if (!uuidSchema.safeParse(projectId).success || !uuidSchema.safeParse(sweepId).success) notFound();
  const db = getDb();
  // The project, the typed units and the first table page are read at once: the rows come with the page.
  const [project, units, first] = await Promise.all([
    getProjectById(db, actor, projectId).catch((err: unknown) => {
      if (err instanceof AppError && err.code === "not_found") return null;
      throw err;
    }),
    // The grid axis speaks the units the kinetics was typed in; a sweep the actor cannot read shows its own message.
    sweepTypedUnits(db, actor, sweepId).catch(() => ({})),
    loadFirstPage(db, actor, sweepId, searchOf(await searchParams)),
  ]);
  if (!project) notFound();
  // No Suspense boundary of its own around the view (the page is rendered per request, so the
  // search params need none): the rows then arrive with the header in one reveal, instead of in a
  // boundary that React holds back up to 300 ms after the header was painted.
  return <SweepView sweepId={sweepId} projectId={projectId} projectName={project.name} canSubmit={can(actor, "sweep.create")} typedUnits={units} initial={first ?? undefined} />;
}
