import { and, eq } from "drizzle-orm";
import { fileURLToPath } from "node:url";
import type { Database } from "./client";
import { memberships, projects, teams, users, type Role } from "./schema";
import { hashPassword } from "@/lib/auth/password";

/** The demo scenario: an invented fine-chemicals company and a second, unrelated team. */
export const DEMO_PASSWORD = "seriatim-demo-2026";

export const DEMO_USERS: { email: string; name: string; team: string; role: Role }[] = [
  { email: "ada.admin@brightwater.example", name: "Ada Okafor", team: "brightwater", role: "admin" },
  { email: "marta.manager@brightwater.example", name: "Marta Lindqvist", team: "brightwater", role: "manager" },
  { email: "eli.engineer@brightwater.example", name: "Eli Nakamura", team: "brightwater", role: "engineer" },
  { email: "vic.viewer@brightwater.example", name: "Vic Moreau", team: "brightwater", role: "viewer" },
  { email: "kai.admin@kestrel.example", name: "Kai Brennan", team: "kestrel", role: "admin" },
];

const DEMO_TEAMS = [
  { slug: "brightwater", name: "Brightwater Fine Chemicals" },
  { slug: "kestrel", name: "Kestrel Resins" },
];

const DEMO_PROJECTS = [
  {
    team: "brightwater",
    name: "Ester line 3 revamp",
    description: "Liquid-phase esterification, 40 kt/a: replace the single stirred tank by a train.",
    owner: "eli.engineer@brightwater.example",
  },
  {
    team: "brightwater",
    name: "Lactone pilot unit",
    description: "Ring-opening step for the pilot plant; autocatalytic kinetics from the bench.",
    owner: "eli.engineer@brightwater.example",
  },
  {
    team: "kestrel",
    name: "Resin dryer feed",
    description: "Kestrel's own project; never visible to Brightwater.",
    owner: "kai.admin@kestrel.example",
  },
];

/** Inserts the demo teams, users, memberships and projects; a second run changes nothing. */
export async function seedDemoData(db: Database): Promise<void> {
  await db.transaction(async (tx) => {
    for (const t of DEMO_TEAMS) {
      await tx.insert(teams).values(t).onConflictDoNothing({ target: teams.slug });
    }
    const teamRows = await tx.select().from(teams);
    const teamId = (slug: string) => teamRows.find((t) => t.slug === slug)!.id;

    const passwordHash = await hashPassword(DEMO_PASSWORD);
    for (const u of DEMO_USERS) {
      await tx
        .insert(users)
        .values({ email: u.email, name: u.name, passwordHash, emailVerified: new Date("2026-01-05T09:00:00Z") })
        .onConflictDoNothing({ target: users.email });
    }
    const userRows = await tx.select().from(users);
    const userId = (email: string) => userRows.find((u) => u.email === email)!.id;

    for (const u of DEMO_USERS) {
      await tx
        .insert(memberships)
        .values({ teamId: teamId(u.team), userId: userId(u.email), role: u.role })
        .onConflictDoNothing();
    }
    for (const p of DEMO_PROJECTS) {
      const existing = await tx
        .select({ id: projects.id })
        .from(projects)
        .where(and(eq(projects.teamId, teamId(p.team)), eq(projects.name, p.name)));
      if (existing.length === 0) {
        await tx.insert(projects).values({
          teamId: teamId(p.team),
          name: p.name,
          description: p.description,
          createdBy: userId(p.owner),
        });
      }
    }
  });
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  const { getDb, closeDb } = await import("./client");
  await seedDemoData(getDb());
  await closeDb();
  console.log("demo data seeded");
}
