import { and, eq, inArray } from "drizzle-orm";
import { notFound } from "next/navigation";
import { getDb } from "@/db/client";
import { kineticsModels, kineticsVersions, users } from "@/db/schema";
import { requirePageActor } from "@/lib/auth/session";
import { AppError } from "@/lib/errors";
import { uuidSchema } from "@/lib/schemas/ids";
import { getProjectById } from "@/lib/services/projects";

/** For server pages under a project: the actor and the project, or the 404 page. */
export async function loadProjectPage(projectId: string) {
  const actor = await requirePageActor();
  if (!uuidSchema.safeParse(projectId).success) notFound();
  try {
    return { actor, project: await getProjectById(getDb(), actor, projectId) };
  } catch (err) {
    if (err instanceof AppError && err.code === "not_found") notFound();
    throw err;
  }
}

/** Turns a service's not-found or forbidden into the 404 page; anything else propagates. */
export async function orNotFound<T>(p: Promise<T>): Promise<T> {
  try {
    return await p;
  } catch (err) {
    if (err instanceof AppError && (err.code === "not_found" || err.code === "forbidden")) notFound();
    throw err;
  }
}

/** Display names of users (pinners and reviewers of the team's pins), by id. */
export async function userNames(ids: string[]): Promise<Record<string, string>> {
  const unique = [...new Set(ids.filter(Boolean))];
  if (!unique.length) return {};
  const rows = await getDb().select({ id: users.id, name: users.name, email: users.email }).from(users).where(inArray(users.id, unique));
  return Object.fromEntries(rows.map((r) => [r.id, r.name ?? r.email]));
}

/** "Model name v3" for kinetics versions of the actor's team, by version id. */
export async function kineticsVersionLabels(teamId: string, ids: string[]): Promise<Record<string, { label: string; modelId: string }>> {
  const unique = [...new Set(ids)];
  if (!unique.length) return {};
  const rows = await getDb()
    .select({ id: kineticsVersions.id, version: kineticsVersions.version, name: kineticsModels.name, modelId: kineticsModels.id })
    .from(kineticsVersions)
    .innerJoin(kineticsModels, eq(kineticsModels.id, kineticsVersions.modelId))
    .where(and(inArray(kineticsVersions.id, unique), eq(kineticsModels.teamId, teamId)));
  return Object.fromEntries(rows.map((r) => [r.id, { label: `${r.name} v${r.version}`, modelId: r.modelId }]));
}
