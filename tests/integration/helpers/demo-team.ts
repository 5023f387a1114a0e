import { eq } from "drizzle-orm";
import type { Database } from "@/db/client";
import { projects } from "@/db/schema";
import { seedDemoData } from "@/lib/demo/seed";
import type { Actor } from "@/lib/authz/policy";
import { AppError } from "@/lib/errors";
import { DEMO_USERS, type DemoPerson } from "../../helpers/demo-people";
import { actorByEmail, createTestDatabase, type TestDatabase } from "../../helpers/test-db";

/** The seeded project most tests work in. */
export const ESTER_PROJECT = "Ester line 3 revamp";

/** A throwaway database with the demo data seeded. */
export async function seededTestDatabase(): Promise<TestDatabase> {
  const t = await createTestDatabase();
  await seedDemoData(t.db);
  return t;
}

/** Each demo person as an actor in their active team. */
export async function demoActors(db: Database): Promise<Record<DemoPerson, Actor>> {
  const people = Object.keys(DEMO_USERS) as DemoPerson[];
  const actors = await Promise.all(people.map((who) => actorByEmail(db, DEMO_USERS[who])));
  return Object.fromEntries(people.map((who, i) => [who, actors[i]])) as Record<DemoPerson, Actor>;
}

/** The id of a seeded project, by its name. */
export async function projectIdNamed(db: Database, name: string): Promise<string> {
  const [p] = await db.select({ id: projects.id }).from(projects).where(eq(projects.name, name));
  return p.id;
}

/**
 * What an authorisation check gives: "ok", or the refusal the service answers with (another
 * team's record is "not_found", never "forbidden"). Any other failure fails the test.
 */
export async function accessOutcome(fn: () => Promise<unknown>): Promise<"ok" | "forbidden" | "not_found"> {
  try {
    await fn();
    return "ok";
  } catch (err) {
    if (err instanceof AppError && (err.code === "forbidden" || err.code === "not_found")) return err.code;
    throw err;
  }
}
