import { getDb, type Database } from "@/db/client";
import { requireActor } from "@/lib/auth/session";
import type { Actor } from "@/lib/authz/policy";
import { AppError } from "@/lib/errors";
import { route, uuidParam } from "../http";

/** What a handler for a signed-in user is given; the database handle is passed on to the service. */
export interface SignedIn {
  req: Request;
  actor: Actor;
  db: Database;
}

type Handler<T> = (s: T) => Promise<Response>;

/**
 * A route for a signed-in user: who is asking is settled first, so a visitor gets 401 before
 * anything else is read. `ctx` is the route's context, for a handler that reads its path itself.
 */
export function signedInRoute<C = unknown>(fn: Handler<SignedIn & { ctx: C }>) {
  return route<C>(async (req, ctx) => fn({ req, actor: await requireActor(), db: getDb(), ctx }));
}

/**
 * Routes on one record named in the path (`recordRoute("projectId", "project")`). The order is
 * the API's promise and the authorisation and fuzz tests hold it: signed in (401), then the id
 * (404 when it is not a uuid, named as `what`), then the handler, which reads the body, so a
 * wrong id is "not found" before a bad body is named.
 */
export function recordRoute<K extends string>(key: K, what: string) {
  return (fn: Handler<SignedIn & { id: string }>) =>
    route<{ params: Promise<Record<K, string>> }>(async (req, ctx) => {
      const actor = await requireActor();
      const id = await uuidParam(ctx, key, what);
      return fn({ req, actor, db: getDb(), id });
    });
}

/**
 * Routes on one scenario of a sweep (`/sweeps/{sweepId}/scenarios/{index}/...`): signed in,
 * then the sweep id, then the scenario number (0-based as stored; anything but a short run of
 * digits is "not found").
 */
export function scenarioRoute(fn: Handler<SignedIn & { sweepId: string; index: number }>) {
  return route<{ params: Promise<{ sweepId: string; index: string }> }>(async (req, ctx) => {
    const actor = await requireActor();
    const sweepId = await uuidParam(ctx, "sweepId", "sweep");
    const { index } = await ctx.params;
    if (!/^\d{1,6}$/.test(index)) throw new AppError("not_found", "No such scenario");
    return fn({ req, actor, db: getDb(), sweepId, index: Number(index) });
  });
}
