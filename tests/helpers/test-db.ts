import { randomUUID } from "node:crypto";
import pg from "pg";
import { eq } from "drizzle-orm";
import { createDb, type Database } from "@/db/client";
import { users } from "@/db/schema";
import { loadActor } from "@/lib/authz/actor";
import type { Actor } from "@/lib/authz/policy";

export interface TestDatabase {
  db: Database;
  url: string;
  pool: pg.Pool;
  drop(): Promise<void>;
}

function serverUrl(): string {
  const url = process.env.TEST_PG_SERVER_URL;
  if (!url) throw new Error("TEST_PG_SERVER_URL is not set; run integration tests through `npm test`");
  return url;
}

async function admin<T>(fn: (c: pg.Client) => Promise<T>): Promise<T> {
  const client = new pg.Client({ connectionString: `${serverUrl()}postgres` });
  await client.connect();
  try {
    return await fn(client);
  } finally {
    await client.end();
  }
}

/** A fresh database for one test file: a clone of the migrated template, or empty. */
export async function createTestDatabase(opts: { empty?: boolean } = {}): Promise<TestDatabase> {
  const name = `t_${randomUUID().replace(/-/g, "").slice(0, 12)}`;
  const template = new URL(process.env.DATABASE_URL ?? "").pathname.slice(1);
  await admin((c) => c.query(opts.empty ? `create database ${name}` : `create database ${name} template "${template}"`));
  const url = `${serverUrl()}${name}`;
  const pool = new pg.Pool({ connectionString: url, max: 4 });
  // drop() ends sessions by force; a connection of this pool still open then must not crash the run.
  pool.on("error", () => {});
  pool.on("connect", (client) => client.on("error", () => {}));
  return {
    db: createDb(pool),
    url,
    pool,
    async drop() {
      await pool.end();
      await admin((c) => c.query(`drop database if exists ${name} with (force)`));
    },
  };
}

/** The actor of a seeded user, by e-mail, in their active team. */
export async function actorByEmail(db: Database, email: string): Promise<Actor> {
  const [user] = await db.select().from(users).where(eq(users.email, email));
  return (await loadActor(db, user.id))!;
}
