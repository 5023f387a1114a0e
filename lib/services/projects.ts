import { and, asc, eq, isNull, ne, sql } from "drizzle-orm";
import type { Database } from "@/db/client";
import { projects, users, type Project } from "@/db/schema";
import { assertCan, can, type Actor } from "@/lib/authz/policy";
import { AppError, notFound } from "@/lib/errors";
import type { ProjectCreate, ProjectUpdate } from "@/lib/schemas/projects";
import { recordAudit } from "./audit";

export type ProjectView = Pick<Project, "id" | "name" | "description" | "archivedAt" | "createdAt" | "updatedAt" | "createdBy"> & {
  createdByName: string | null;
  /** What the current actor may do with this project, for the screens to show or hide controls. */
  permissions: { update: boolean; archive: boolean };
};

const projectColumns = {
  id: projects.id,
  teamId: projects.teamId,
  name: projects.name,
  description: projects.description,
  archivedAt: projects.archivedAt,
  createdAt: projects.createdAt,
  updatedAt: projects.updatedAt,
  createdBy: projects.createdBy,
  createdByName: users.name,
};

export async function listProjects(db: Database, actor: Actor, opts: { includeArchived?: boolean } = {}): Promise<ProjectView[]> {
  assertCan(actor, "project.list");
  const filters = [eq(projects.teamId, actor.teamId)];
  if (!opts.includeArchived) filters.push(isNull(projects.archivedAt));
  const rows = await db
    .select(projectColumns)
    .from(projects)
    .leftJoin(users, eq(users.id, projects.createdBy))
    .where(and(...filters))
    .orderBy(asc(projects.name));
  return rows.map((row) => toView(actor, row));
}

function toView(actor: Actor, row: Omit<ProjectView, "permissions"> & { teamId: string }): ProjectView {
  const { teamId, ...rest } = row;
  const ref = { teamId, createdBy: row.createdBy };
  return { ...rest, permissions: { update: can(actor, "project.update", ref), archive: can(actor, "project.archive", ref) } };
}

/** Reads a project of the actor's team; any other id, guessed or real, is "not found". */
export async function getProjectById(db: Database, actor: Actor, id: string): Promise<ProjectView> {
  const [row] = await db
    .select(projectColumns)
    .from(projects)
    .leftJoin(users, eq(users.id, projects.createdBy))
    .where(and(eq(projects.id, id), eq(projects.teamId, actor.teamId)));
  if (!row) throw notFound("project");
  assertCan(actor, "project.read", row, "project");
  return toView(actor, row);
}

/**
 * Two projects of one team may not share a name, compared without case and with runs of spaces
 * folded, archived ones included (restoring one would bring the clash back). Checked inside the
 * create or rename transaction after locking the team's project rows, so two people typing the
 * same name at once cannot both get through; no unique index, to keep the migration path free.
 */
async function assertNameFree(tx: Pick<Database, "select">, teamId: string, name: string, exceptId?: string) {
  const folded = (col: unknown) => sql`lower(regexp_replace(btrim(${col}), '[[:space:]]+', ' ', 'g'))`;
  const filters = [eq(projects.teamId, teamId), sql`${folded(projects.name)} = ${folded(sql`${name}::text`)}`];
  if (exceptId) filters.push(ne(projects.id, exceptId));
  const [clash] = await tx.select({ name: projects.name }).from(projects).where(and(...filters)).limit(1);
  if (clash) {
    const text = `A project named ${clash.name} already exists`;
    // The message names the field by its label on screen; the form shows the field's own line.
    throw new AppError("conflict", `Project name: ${text}`, { fields: { name: [text] } });
  }
}

/** Serialises name checks within one team: a transaction-scoped advisory lock keyed on the team. */
async function lockTeamNames(tx: Pick<Database, "execute">, teamId: string) {
  await tx.execute(sql`select pg_advisory_xact_lock(hashtext(${"project-names:" + teamId}))`);
}

export async function createProject(db: Database, actor: Actor, input: ProjectCreate): Promise<Project> {
  assertCan(actor, "project.create");
  return db.transaction(async (tx) => {
    await lockTeamNames(tx, actor.teamId);
    await assertNameFree(tx, actor.teamId, input.name);
    const [row] = await tx
      .insert(projects)
      .values({ teamId: actor.teamId, name: input.name, description: input.description, createdBy: actor.userId })
      .returning();
    await recordAudit(tx, {
      teamId: actor.teamId,
      actorId: actor.userId,
      action: "project.created",
      entityType: "project",
      entityId: row.id,
      details: { name: row.name },
    });
    return row;
  });
}

export async function updateProject(db: Database, actor: Actor, id: string, input: ProjectUpdate): Promise<Project> {
  return db.transaction(async (tx) => {
    const [current] = await tx
      .select()
      .from(projects)
      .where(and(eq(projects.id, id), eq(projects.teamId, actor.teamId)))
      .for("update");
    if (!current) throw notFound("project");
    const archiving = input.archived !== undefined && input.archived !== (current.archivedAt !== null);
    if (input.name !== undefined || input.description !== undefined) assertCan(actor, "project.update", current, "project");
    if (archiving) assertCan(actor, "project.archive", current, "project");

    if (input.name !== undefined) {
      await lockTeamNames(tx, actor.teamId);
      await assertNameFree(tx, actor.teamId, input.name, id);
    }
    const changes: Partial<Project> = { updatedAt: new Date() };
    if (input.name !== undefined) changes.name = input.name;
    if (input.description !== undefined) changes.description = input.description;
    if (archiving) changes.archivedAt = input.archived ? new Date() : null;
    const [row] = await tx.update(projects).set(changes).where(eq(projects.id, id)).returning();

    const before: Record<string, unknown> = {};
    const after: Record<string, unknown> = {};
    if (input.name !== undefined && input.name !== current.name) {
      before.name = current.name;
      after.name = row.name;
    }
    if (input.description !== undefined && input.description !== current.description) {
      before.description = current.description;
      after.description = row.description;
    }
    if (Object.keys(after).length) {
      await recordAudit(tx, { teamId: actor.teamId, actorId: actor.userId, action: "project.updated", entityType: "project", entityId: id, details: { before, after } });
    }
    if (archiving) {
      await recordAudit(tx, {
        teamId: actor.teamId,
        actorId: actor.userId,
        action: input.archived ? "project.archived" : "project.restored",
        entityType: "project",
        entityId: id,
        details: { name: row.name },
      });
    }
    return row;
  });
}
