import { notFound } from "next/navigation";
import { getDb } from "@/db/client";
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
