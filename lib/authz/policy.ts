import type { Role } from "@/db/schema";
import { AppError } from "@/lib/errors";

/** The signed-in person acting within one team. */
export interface Actor {
  userId: string;
  email: string;
  name: string | null;
  teamId: string;
  teamName: string;
  role: Role;
}

export const ROLES = ["admin", "manager", "engineer", "viewer"] as const satisfies readonly Role[];

export type Action =
  | "project.list"
  | "project.read"
  | "project.create"
  | "project.update"
  | "project.archive"
  | "member.list"
  | "member.update"
  | "invitation.list"
  | "invitation.create"
  | "invitation.revoke"
  | "audit.read"
  | "kinetics.read"
  | "kinetics.create"
  | "dataset.read"
  | "dataset.create"
  | "sweep.read"
  | "sweep.create"
  | "sweep.cancel"
  | "pin.read"
  | "pin.create"
  | "pin.review"
  | "token.manage"
  | "cost.read"
  | "cost.update"
  | "inventory.read"
  | "inventory.manage"
  | "train.rate"
  | "robustness.create";

const EVERYONE = ROLES;
const AUTHORS: readonly Role[] = ["admin", "manager", "engineer"];
const ADMINS: readonly Role[] = ["admin"];

/**
 * Who may do what. The single table every route handler, server action and page
 * consults (through `assertCan`); docs/authorization.md renders it for people.
 */
export const POLICY: Record<Action, readonly Role[]> = {
  "project.list": EVERYONE,
  "project.read": EVERYONE,
  "project.create": AUTHORS,
  "project.update": AUTHORS,
  "project.archive": AUTHORS,
  "member.list": ADMINS,
  "member.update": ADMINS,
  "invitation.list": ADMINS,
  "invitation.create": ADMINS,
  "invitation.revoke": ADMINS,
  "audit.read": ["admin", "manager"],
  "kinetics.read": AUTHORS,
  "kinetics.create": AUTHORS,
  "dataset.read": AUTHORS,
  "dataset.create": AUTHORS,
  "sweep.read": AUTHORS,
  "sweep.create": AUTHORS,
  "sweep.cancel": AUTHORS,
  // Viewers read pinned designs, but the service shows them approved ones only.
  "pin.read": EVERYONE,
  "pin.create": AUTHORS,
  "pin.review": ["admin", "manager"],
  "token.manage": EVERYONE,
  "cost.read": EVERYONE,
  "cost.update": AUTHORS,
  "inventory.read": EVERYONE,
  "inventory.manage": AUTHORS,
  "train.rate": AUTHORS,
  // Reading a run follows its subject: sweep.read for a candidate's, pin.read for a pinned design's.
  "robustness.create": AUTHORS,
};

/** Actions an engineer may take only on records they created. */
const OWN_RECORDS_ONLY_FOR_ENGINEERS: ReadonlySet<Action> = new Set(["project.update", "project.archive", "sweep.cancel"]);

export interface ResourceRef {
  teamId: string;
  createdBy?: string;
}

export function can(actor: Actor, action: Action, resource?: ResourceRef): boolean {
  if (resource && resource.teamId !== actor.teamId) return false;
  if (!POLICY[action].includes(actor.role)) return false;
  if (actor.role === "engineer" && OWN_RECORDS_ONLY_FOR_ENGINEERS.has(action) && resource?.createdBy !== undefined) {
    return resource.createdBy === actor.userId;
  }
  return true;
}

/**
 * Throws unless the actor may act. A record of another team is reported as missing
 * (404), never as forbidden, so ids of other teams reveal nothing.
 */
export function assertCan(actor: Actor, action: Action, resource?: ResourceRef, what = "record"): void {
  if (resource && resource.teamId !== actor.teamId) throw new AppError("not_found", `No such ${what}`);
  if (!can(actor, action, resource)) {
    const article = /^[aeiou]/.test(actor.role) ? "An" : "A";
    throw new AppError("forbidden", `${article} ${actor.role} cannot ${describe(action)}`);
  }
}

function describe(action: Action): string {
  const [entity, verb] = action.split(".");
  const verbs: Record<string, string> = {
    list: "list",
    read: "read",
    create: "create",
    update: "change",
    archive: "archive",
    revoke: "revoke",
    cancel: "cancel",
    review: "review",
    manage: "manage",
    rate: "rate",
  };
  const plural = verb === "list" ? `${entity}s` : `this ${entity}`;
  return verb === "create" ? `create a ${entity}` : `${verbs[verb] ?? verb} ${plural}`;
}
