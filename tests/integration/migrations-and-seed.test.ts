import { readFileSync } from "node:fs";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { runMigrations } from "@/db/migrate";
import { DEMO_KINETICS, DEMO_USERS, seedDemoData } from "@/lib/demo/seed";
import { DEMO_NETWORK } from "@/lib/demo/network-demo";
import { networkKineticsSpecSchema } from "@/lib/schemas/network-spec";
import { checkKinetics } from "@/lib/services/kinetics-checks";
import { auditEntries } from "@/db/schema";
import { createTestDatabase, type TestDatabase } from "../helpers/test-db";

const journal = JSON.parse(readFileSync("drizzle/meta/_journal.json", "utf8")) as { entries: { tag: string }[] };
const TABLES = [
  ...["users", "accounts", "sessions", "verification_tokens", "teams", "memberships", "projects", "invitations", "audit_entries", "sign_in_attempts", "sign_in_sessions"],
  ...["kinetics_models", "kinetics_versions", "sweeps", "scenarios", "candidates", "pinned_designs", "api_tokens"],
  ...["rate_datasets", "rate_dataset_versions", "kinetics_sources", "project_cost_settings", "inventory_vessels", "robustness_runs"],
];

describe("migrations on an empty database", () => {
  let t: TestDatabase;
  beforeAll(async () => {
    t = await createTestDatabase({ empty: true });
  });
  afterAll(() => t.drop());

  it("apply every migration in drizzle/ and create every table", async () => {
    await runMigrations(t.url);
    const applied = await t.pool.query("select count(*)::int as n from drizzle.__drizzle_migrations");
    expect(applied.rows[0].n).toBe(journal.entries.length);
    const tables = await t.pool.query("select table_name from information_schema.tables where table_schema = 'public'");
    expect(tables.rows.map((r) => r.table_name).sort()).toEqual([...TABLES].sort());
  });

  it("are idempotent: a second run applies nothing", async () => {
    await runMigrations(t.url);
    const applied = await t.pool.query("select count(*)::int as n from drizzle.__drizzle_migrations");
    expect(applied.rows[0].n).toBe(journal.entries.length);
  });
});

describe("demo seed", () => {
  let t: TestDatabase;
  beforeAll(async () => {
    t = await createTestDatabase();
  });
  afterAll(() => t.drop());

  async function snapshot(): Promise<Record<string, unknown[]>> {
    const out: Record<string, unknown[]> = {};
    for (const table of TABLES) {
      const r = await t.pool.query(`select * from ${table} order by 1, 2`);
      out[table] = r.rows;
    }
    return out;
  }

  it("creates one user per role and a second team", async () => {
    await seedDemoData(t.db);
    const roles = await t.pool.query("select role::text, count(*)::int as n from memberships group by role order by role");
    expect(Object.fromEntries(roles.rows.map((r) => [r.role, r.n]))).toEqual({ admin: 2, manager: 1, engineer: 1, viewer: 1 });
    const users = await t.pool.query("select email from users order by email");
    expect(users.rows.map((r) => r.email)).toEqual(DEMO_USERS.map((u) => u.email).sort());
  });

  it("holds demo kinetics the engine accepts", async () => {
    for (const k of DEMO_KINETICS) expect(() => checkKinetics(k.spec)).not.toThrow();
    expect(networkKineticsSpecSchema.safeParse(DEMO_NETWORK.model.spec).success).toBe(true);
    expect(() => checkKinetics(DEMO_NETWORK.model.spec as unknown as Parameters<typeof checkKinetics>[0])).not.toThrow();
    const r = await t.pool.query("select count(*)::int n from kinetics_versions");
    expect(r.rows[0].n).toBe(DEMO_KINETICS.length + 1);
  });

  it("holds a finished yield-ranked sweep of several reactions and its best train pinned", async () => {
    const sweep = await t.pool.query("select id, status, total, done from sweeps where name = $1", [DEMO_NETWORK.sweep.name]);
    expect(sweep.rows).toEqual([expect.objectContaining({ status: "succeeded", total: 3, done: 3 })]);
    const ranked = await t.pool.query(
      "select c.rank, c.yield, c.objective_value, c.feasible from candidates c join scenarios s on s.id = c.scenario_id where c.sweep_id = $1 and s.index = 1 order by c.rank",
      [sweep.rows[0].id],
    );
    expect(ranked.rows).toHaveLength(14); // every sequence of 1..3 stages of two types: 2 + 4 + 8
    const feasible = ranked.rows.filter((c) => c.feasible);
    // Ranked best first by the yield of B (the ranked value is the yield itself); yields within 1e-9
    // relative are a tie, ranked by fewer stages in use (docs/engine.md).
    for (let i = 1; i < feasible.length; i++) expect(feasible[i].yield).toBeLessThanOrEqual(feasible[i - 1].yield * (1 + 1e-9));
    for (const c of feasible) expect(c.objective_value).toBe(c.yield);
    const pin = await t.pool.query("select candidate from pinned_designs p join sweeps s on s.id = p.sweep_id where s.name = $1", [DEMO_NETWORK.sweep.name]);
    expect(pin.rows).toHaveLength(1);
    const pinned = pin.rows[0].candidate;
    expect(pinned.kind).toBe("network");
    expect(pinned.rank).toBe(1);
    expect(pinned.yield).toBe(feasible[0].yield);
    expect(Object.keys(pinned.outlet).sort()).toEqual(["A", "B", "C", "D"]);
  });

  it("changes nothing when run a second time", async () => {
    const before = await snapshot();
    await seedDemoData(t.db);
    expect(await snapshot()).toEqual(before);
  });
});

describe("audit log", () => {
  let t: TestDatabase;
  beforeAll(async () => {
    t = await createTestDatabase();
  });
  afterAll(() => t.drop());

  it("accepts inserts and refuses updates and deletes", async () => {
    await t.db.insert(auditEntries).values({ action: "test.recorded", entityType: "test", entityId: "1" });
    await expect(t.pool.query("update audit_entries set action = 'tampered'")).rejects.toThrow(/append-only/);
    await expect(t.pool.query("delete from audit_entries")).rejects.toThrow(/append-only/);
    await expect(t.pool.query("truncate audit_entries")).rejects.toThrow(/append-only/);
    const rows = await t.pool.query("select action from audit_entries");
    expect(rows.rows).toEqual([{ action: "test.recorded" }]);
  });
});
