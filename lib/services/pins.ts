import { and, desc, eq, inArray } from "drizzle-orm";
import type { Database } from "@/db/client";
import { memberships, pinnedDesigns, users, type PinnedDesign } from "@/db/schema";
import { teamCandidateWithScenario } from "@/db/queries/team-candidates";
import { assertCan, type Actor } from "@/lib/authz/policy";
import { AppError, notFound } from "@/lib/errors";
import { appLink, sendMail } from "@/lib/mail";
import { freezeCandidate } from "@/lib/sweeps/freeze-candidate";
import type { PinnedCandidate, PinnedNetworkCandidate, WithShapes } from "@/lib/sweeps/stored-json";
import { applyOverrides } from "@/lib/sweeps/grid";
import { recordAudit } from "./audit";
import { requireTeamProject } from "./kinetics";
import { stageTypeName } from "@/lib/stage-types";

async function mailQuietly(to: string[], subject: string, text: string) {
  for (const address of to) {
    try {
      await sendMail({ to: address, subject, text });
    } catch (err) {
      console.error("pin mail failed", { to: address, err });
    }
  }
}

/**
 * Pins a candidate to its project: a frozen copy of the candidate and of its scenario's
 * spec, so later edits of the kinetics model change nothing here. The project's earlier
 * proposed or approved pins become superseded.
 */
export async function pinCandidate(db: Database, actor: Actor, candidateId: string, input: { note: string }): Promise<PinnedDesign> {
  const row = await teamCandidateWithScenario(db, actor.teamId, candidateId);
  if (!row) throw notFound("candidate");
  assertCan(actor, "pin.create", { teamId: row.sweep.teamId }, "candidate");
  if (!row.candidate.feasible) throw new AppError("conflict", "An infeasible candidate cannot be pinned", { fields: { candidateId: [row.candidate.reason ?? "infeasible"] } });

  const { candidate: c, scenario, sweep } = row;
  const frozen = freezeCandidate(c, scenario, sweep);
  const pin = await db.transaction(async (tx) => {
    const superseded = await tx
      .update(pinnedDesigns)
      .set({ state: "superseded" })
      .where(and(eq(pinnedDesigns.projectId, sweep.projectId), inArray(pinnedDesigns.state, ["proposed", "approved"])))
      .returning({ id: pinnedDesigns.id });
    const [p] = await tx
      .insert(pinnedDesigns)
      .values({
        teamId: actor.teamId,
        projectId: sweep.projectId,
        sweepId: sweep.id,
        candidateId: c.id,
        kineticsVersionId: sweep.kineticsVersionId,
        candidate: frozen,
        spec: applyOverrides(sweep.baseSpec, scenario.overrides),
        note: input.note,
        pinnedBy: actor.userId,
      })
      .returning();
    await recordAudit(tx, {
      teamId: actor.teamId,
      actorId: actor.userId,
      action: "design.pinned",
      entityType: "project",
      entityId: sweep.projectId,
      details: { pinId: p.id, sequence: frozen.sequence.join("-"), totalVolume: c.totalVolume, superseded: superseded.map((s) => s.id) },
    });
    return p;
  });
  const managers = await db
    .select({ email: users.email })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(and(eq(memberships.teamId, actor.teamId), eq(memberships.role, "manager")));
  await mailQuietly(
    managers.map((m) => m.email),
    `Design pinned for review: ${frozen.sequence.map(stageTypeName).join(" → ")}`,
    `${actor.name ?? actor.email} pinned a ${frozen.sequence.map(stageTypeName).join(" → ")} train (total ${c.totalVolume?.toPrecision(4)} m3) for review.\n\nNote: ${input.note || "—"}\n\nReview it: ${appLink(`/projects/${sweep.projectId}`)}`,
  );
  return pin;
}

/** The project's pinned designs, newest first; viewers see approved ones only. */
export async function listPins(db: Database, actor: Actor, projectId: string) {
  const project = await requireTeamProject(db, actor, projectId);
  assertCan(actor, "pin.read", project, "project");
  const filters = [eq(pinnedDesigns.projectId, projectId)];
  if (actor.role === "viewer") filters.push(eq(pinnedDesigns.state, "approved"));
  const rows = await db.select().from(pinnedDesigns).where(and(...filters)).orderBy(desc(pinnedDesigns.pinnedAt));
  return rows as unknown as WithShapes<PinnedDesign, { candidate: PinnedCandidate | PinnedNetworkCandidate }>[];
}

export async function getPin(db: Database, actor: Actor, pinId: string) {
  const [p] = await db.select().from(pinnedDesigns).where(and(eq(pinnedDesigns.id, pinId), eq(pinnedDesigns.teamId, actor.teamId)));
  if (!p || (actor.role === "viewer" && p.state !== "approved")) throw notFound("pinned design");
  assertCan(actor, "pin.read", p, "pinned design");
  return p;
}

/** A manager approves or rejects a proposed pin, with a comment; nobody reviews their own pin. */
export async function reviewPin(db: Database, actor: Actor, pinId: string, input: { decision: "approve" | "reject"; comment: string }) {
  const [current] = await db.select().from(pinnedDesigns).where(and(eq(pinnedDesigns.id, pinId), eq(pinnedDesigns.teamId, actor.teamId)));
  if (!current) throw notFound("pinned design");
  assertCan(actor, "pin.review", current, "pinned design");
  if (current.pinnedBy === actor.userId) throw new AppError("forbidden", "A design is reviewed by someone other than the person who pinned it");
  const state = input.decision === "approve" ? "approved" : "rejected";
  const updated = await db.transaction(async (tx) => {
    const rows = await tx
      .update(pinnedDesigns)
      .set({ state, reviewerId: actor.userId, reviewComment: input.comment, reviewedAt: new Date() })
      .where(and(eq(pinnedDesigns.id, pinId), eq(pinnedDesigns.state, "proposed")))
      .returning();
    if (!rows.length) throw new AppError("conflict", `Only a proposed design can be reviewed; this one is ${current.state}`);
    await recordAudit(tx, { teamId: actor.teamId, actorId: actor.userId, action: `design.${state}`, entityType: "project", entityId: current.projectId, details: { pinId, comment: input.comment } });
    return rows[0];
  });
  const [pinner] = await db.select({ email: users.email }).from(users).where(eq(users.id, current.pinnedBy));
  if (pinner) {
    await mailQuietly([pinner.email], `Design ${state}: ${(current.candidate.sequence as string[]).map(stageTypeName).join(" → ")}`, `${actor.name ?? actor.email} ${state} your pinned design.\n\nComment: ${input.comment}\n\n${appLink(`/projects/${current.projectId}`)}`);
  }
  return updated;
}
