import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { auditEntries, kineticsModels, kineticsSources, kineticsVersions, rateDatasets, rateDatasetVersions } from "@/db/schema";
import type { Actor } from "@/lib/authz/policy";
import { parseWith } from "@/lib/http";
import { fitRequestSchema, fitSaveSchema } from "@/lib/schemas/fits";
import { fitDatasetVersion, saveFitAsKinetics } from "@/lib/services/fits";
import { createKineticsModel } from "@/lib/services/kinetics";
import { actorByEmail, type TestDatabase } from "../helpers/test-db";
import { refusal } from "../helpers/refusal";
import { DEMO_USERS } from "../helpers/demo-people";
import { ESTER_PROJECT, projectIdNamed, seededTestDatabase } from "./helpers/demo-team";

const R = 8.314462618; // J/(mol K), CODATA 2018 exact

let t: TestDatabase;
let engineer: Actor;
let otherTeam: Actor;
let projectId: string;
const versions = {} as Record<"concentration" | "conversion" | "arrhenius", string>;

async function insertVersion(name: string, rows: Record<string, number>[], feedConcA: number | null = null): Promise<string> {
  const [ds] = await t.db.insert(rateDatasets).values({ teamId: engineer.teamId, projectId, name, createdBy: engineer.userId }).returning();
  const [v] = await t.db
    .insert(rateDatasetVersions)
    .values({ datasetId: ds.id, version: 1, fileName: `${name}.csv`, format: "csv", mapping: {}, rows, rowCount: rows.length, feedConcA, createdBy: engineer.userId })
    .returning();
  return v.id;
}

beforeAll(async () => {
  t = await seededTestDatabase();
  engineer = await actorByEmail(t.db, DEMO_USERS.engineer);
  otherTeam = await actorByEmail(t.db, DEMO_USERS.otherTeam);
  projectId = await projectIdNamed(t.db, ESTER_PROJECT);
  // Noise-free demo data generated from the closed-form laws (invented parameters).
  const C = Array.from({ length: 15 }, (_, i) => 80 + i * 60);
  versions.concentration = await insertVersion("Closed-form power", C.map((c) => ({ concA: c, rate: 2.5e-5 * c ** 1.3 })));
  versions.conversion = await insertVersion(
    "Conversion only",
    C.map((c) => ({ conversion: 1 - c / 1000, rate: 3e-3 * c - 8e-4 * (1000 - c) })),
    1000,
  );
  versions.arrhenius = await insertVersion(
    "Four temperatures",
    [325, 340, 355, 370].flatMap((T) => C.slice(0, 6).map((c) => ({ concA: c, temperature: T, rate: 5e-5 * Math.exp((-55000 / R) * (1 / T - 1 / 345)) * c }))),
  );
});
afterAll(() => t.drop());

const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);
const FEED = { flowA: 0.4, concA: "1 mol/L", temperature: "70 degC" };

describe("fitting a stored dataset version", () => {
  // Self-consistency: data generated from the law itself must give back its parameters and R² = 1.
  it("recovers the parameters of noise-free data to ~1e-6 relative, with R² = 1", async () => {
    const res = await fitDatasetVersion(t.db, engineer, versions.concentration, parseWith(fitRequestSchema, { laws: ["power", "saturation"] }));
    const power = res.fits.find((f) => f.law === "power")!;
    if (!power.ok) throw new Error(power.error);
    const byName = Object.fromEntries(power.parameters.map((p) => [p.name, p.value]));
    expect(rel(byName.k, 2.5e-5)).toBeLessThan(1e-6);
    expect(rel(byName.n, 1.3)).toBeLessThan(1e-6);
    expect(power.rSquared).toBeCloseTo(1, 10);
    expect(power.points).toBe(15);
    expect(power.degreesOfFreedom).toBe(13);
    expect(power.parity).toHaveLength(15);
    expect(res.range.concA).toEqual([80, 920]);
    expect(res.cautions.join(" ")).toMatch(/only valid inside the measured range/);

    const arr = await fitDatasetVersion(t.db, engineer, versions.arrhenius, { laws: ["power-arrhenius"] });
    const f = arr.fits[0];
    if (!f.ok) throw new Error(f.error);
    const ea = f.parameters.find((p) => p.name === "Ea")!.value;
    expect(rel(ea, 55000)).toBeLessThan(1e-6);
    expect(f.rSquared).toBeCloseTo(1, 10);
  });

  it("uses C_A0 for conversion-only rows and states the assumptions", async () => {
    const res = await fitDatasetVersion(t.db, engineer, versions.conversion, { laws: ["reversible"] });
    const f = res.fits[0];
    if (!f.ok) throw new Error(f.error);
    expect(rel(f.parameters[0].value, 3e-3)).toBeLessThan(1e-6);
    expect(rel(f.parameters[1].value, 8e-4)).toBeLessThan(1e-6);
    expect(res.assumptions.join(" ")).toMatch(/C_A = C_A0·\(1 − X\).*liquid phase/);
    expect(res.assumptions.join(" ")).toMatch(/C_R = C_A0·X/);
  });

  it("a law the data cannot support is a per-law error, not a failure of the request", async () => {
    const res = await fitDatasetVersion(t.db, engineer, versions.concentration, { laws: ["power", "power-arrhenius", "saturation"] });
    expect(res.fits[0].ok).toBe(true);
    expect(res.fits[1]).toEqual({ law: "power-arrhenius", ok: false, error: "needs a temperature column with at least two temperatures" });
    // Order 1.3 data rise faster than linearly; a saturation curve cannot bend that way (km runs off).
    expect(res.fits[2]).toMatchObject({ law: "saturation", ok: false, error: expect.stringMatching(/do not support this law/) });
  });

  it("conversion-only rows without C_A0 anywhere: 400 naming feedConcA", async () => {
    const id = await insertVersion("No feed concentration", [0.1, 0.2, 0.3, 0.4].map((x) => ({ conversion: x, rate: 1 - x })));
    const err = await refusal(fitDatasetVersion(t.db, engineer, id, { laws: ["power"] }));
    expect(err.status).toBe(400);
    expect(Object.keys(err.fields ?? {})).toEqual(["feedConcA"]);
  });

  it("another team's version is not found", async () => {
    const err = await refusal(fitDatasetVersion(t.db, otherTeam, versions.concentration, { laws: ["power"] }));
    expect(err.status).toBe(404);
  });
});

describe("saving a fit as kinetics", () => {
  const counts = async () => ({
    versions: (await t.db.select().from(kineticsVersions)).length,
    sources: (await t.db.select().from(kineticsSources)).length,
    audit: (await t.db.select().from(auditEntries)).length,
  });

  it("creates the model, its version and the source row together, with an audit entry", async () => {
    const before = await counts();
    const body = parseWith(fitSaveSchema, { law: "power", modelName: "Fitted ester rate", feed: FEED, note: "from bench data" });
    const saved = await saveFitAsKinetics(t.db, engineer, versions.concentration, body);
    const [source] = await t.db.select().from(kineticsSources).where(eq(kineticsSources.kineticsVersionId, saved.version.id));
    expect(source).toMatchObject({ kind: "fit", datasetVersionId: versions.concentration });
    const fit = source.fit as { law: string; parameters: { name: string; value: number }[] };
    expect(fit.law).toBe("power");
    // Refitted server-side: the stored rate law holds the fitted numbers.
    const rate = (saved.version.spec as { reaction: { rate: { law: string; k: number; orders: { A: number } } } }).reaction.rate;
    expect(rate.law).toBe("power");
    expect(rel(rate.k, 2.5e-5)).toBeLessThan(1e-6);
    expect(rel(rate.orders.A, 1.3)).toBeLessThan(1e-6);
    const after = await counts();
    expect(after).toEqual({ versions: before.versions + 1, sources: before.sources + 1, audit: before.audit + 1 });
    const [entry] = await t.db.select().from(auditEntries).where(eq(auditEntries.action, "kinetics.created")).orderBy(auditEntries.at);
    expect(entry).toBeDefined();

    // A second save as a new version of the same model.
    const again = await saveFitAsKinetics(t.db, engineer, versions.concentration, parseWith(fitSaveSchema, { law: "power", modelId: saved.model.id, feed: FEED, note: "second save" }));
    expect(again.version.version).toBe(2);
    expect((await counts()).sources).toBe(before.sources + 2);
  });

  it("the version and its source are one transaction: a source that cannot be written leaves no model or version", async () => {
    const before = await counts();
    const spec = { feed: { flowA: 0.4, concA: 1000 }, reaction: { rate: { law: "power" as const, k: 1e-3, orders: { A: 1 } } } };
    // A dataset version id that does not exist: the source row's foreign key fails inside the transaction.
    const source = { datasetVersionId: "00000000-0000-4000-8000-000000000000", kind: "fit" as const, fit: {} };
    await expect(createKineticsModel(t.db, engineer, projectId, { name: "Orphan source", spec, note: "", source })).rejects.toThrow();
    expect(await counts()).toEqual(before);
    expect((await t.db.select().from(kineticsModels).where(eq(kineticsModels.name, "Orphan source"))).length).toBe(0);
  });

  it("bad input: 400 naming the field, nothing written", async () => {
    const before = await counts();
    const parsed = fitSaveSchema.safeParse({ law: "cubic", feed: FEED });
    expect(parsed.success).toBe(false);
    const paths = parsed.error!.issues.map((i) => i.path.join("."));
    expect(paths).toContain("law");
    // A feed the engine refuses (negative flow) is a 400 on feed.flowA after the refit.
    const err = await refusal(saveFitAsKinetics(t.db, engineer, versions.concentration, parseWith(fitSaveSchema, { law: "power", modelName: "Bad feed", feed: { ...FEED, flowA: -1 } })));
    expect(err.status).toBe(400);
    expect(Object.keys(err.fields ?? {})).toEqual(["feed.flowA"]);
    // A law the data cannot support is a 400 on law.
    const err2 = await refusal(saveFitAsKinetics(t.db, engineer, versions.concentration, parseWith(fitSaveSchema, { law: "power-arrhenius", modelName: "No T", feed: FEED })));
    expect(Object.keys(err2.fields ?? {})).toEqual(["law"]);
    expect(await counts()).toEqual(before);
    expect((await t.db.select().from(kineticsModels).where(eq(kineticsModels.name, "Bad feed"))).length).toBe(0);
  });

  it("another team's version is not found, and nothing is written", async () => {
    const before = await counts();
    const err = await refusal(saveFitAsKinetics(t.db, otherTeam, versions.concentration, parseWith(fitSaveSchema, { law: "power", modelName: "Theirs", feed: FEED })));
    expect(err.status).toBe(404);
    expect(await counts()).toEqual(before);
  });
});
