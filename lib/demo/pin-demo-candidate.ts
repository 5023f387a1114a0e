import { eq } from "drizzle-orm";
import type { Executor } from "@/db/client";
import { candidates, pinnedDesigns, scenarios, type Sweep } from "@/db/schema";
import { freezeCandidate } from "@/lib/sweeps/freeze-candidate";
import { applyOverrides } from "@/lib/sweeps/grid";

/**
 * Pins one seeded candidate the way pinning it on screen would: its frozen copy (the sweep's spec tells
 * the kind) and its scenario's spec. Both demo seeds pin their best train through here.
 */
export async function pinDemoCandidate(
  tx: Executor,
  opts: { teamId: string; projectId: string; sweep: Sweep; kineticsVersionId: string; candidateId: string; baseSpec: Record<string, unknown>; note: string; pinnedBy: string; at: Date },
) {
  const [c] = await tx.select().from(candidates).where(eq(candidates.id, opts.candidateId));
  const [sc] = await tx.select().from(scenarios).where(eq(scenarios.id, c.scenarioId));
  const [pin] = await tx
    .insert(pinnedDesigns)
    .values({
      teamId: opts.teamId,
      projectId: opts.projectId,
      sweepId: opts.sweep.id,
      candidateId: c.id,
      kineticsVersionId: opts.kineticsVersionId,
      candidate: freezeCandidate(c, sc, { ...opts.sweep, baseSpec: opts.baseSpec }),
      spec: applyOverrides(opts.baseSpec, sc.overrides),
      note: opts.note,
      pinnedBy: opts.pinnedBy,
      pinnedAt: opts.at,
    })
    .returning();
  return { pin, candidate: c, scenario: sc };
}
