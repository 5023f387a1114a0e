import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { pinnedDesigns, users } from "@/db/schema";
import type { Actor } from "@/lib/authz/policy";
import { DEMO_USERS, seedDemoData } from "@/lib/demo/seed";
import { pinLabels } from "@/lib/services/pin-labels";
import { actorByEmail, createTestDatabase, type TestDatabase } from "../helpers/test-db";

let t: TestDatabase;
let engineer: Actor;
let outsider: Actor;

beforeAll(async () => {
  t = await createTestDatabase();
  await seedDemoData(t.db);
  engineer = await actorByEmail(t.db, "eli.engineer@brightwater.example");
  outsider = await actorByEmail(t.db, "kai.admin@kestrel.example");
}, 60_000);

afterAll(async () => {
  await t.drop();
});

describe("the names and kinetics labels beside a list of pins", () => {
  it("names the team's pinners and labels the team's kinetics versions", async () => {
    const pins = await t.db.select().from(pinnedDesigns);
    expect(pins.length).toBeGreaterThan(0);
    const { names, versions } = await pinLabels(t.db, engineer, pins);
    const [pinner] = await t.db.select().from(users).where(eq(users.id, pins[0].pinnedBy));
    expect(names[pins[0].pinnedBy]).toBe(pinner.name ?? pinner.email);
    expect(DEMO_USERS.find((u) => u.email === pinner.email)?.team).toBe("brightwater");
    expect(versions[pins[0].kineticsVersionId].label).toMatch(/ v\d+$/);
  });

  it("never names a user outside the actor's team, even when asked by id", async () => {
    const pins = await t.db.select().from(pinnedDesigns);
    const asked = [{ pinnedBy: outsider.userId, reviewerId: pins[0].pinnedBy, kineticsVersionId: pins[0].kineticsVersionId }];
    const { names } = await pinLabels(t.db, engineer, asked);
    expect(Object.keys(names)).toEqual([pins[0].pinnedBy]);
    expect(names[outsider.userId]).toBeUndefined();
  });

  it("gives another team nothing of this team's pins", async () => {
    const pins = await t.db.select().from(pinnedDesigns);
    const { names, versions } = await pinLabels(t.db, outsider, pins);
    expect(names).toEqual({});
    expect(versions).toEqual({});
  });
});
