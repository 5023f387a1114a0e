import { mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { dirname, join } from "node:path";
import { ESLint } from "eslint";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { readImportGraph } from "./import-graph";
import { RULES, violations } from "./rules";

const root = join(__dirname, "../../..");

describe("layer boundaries of the source tree", () => {
  it("no import breaks a rule of docs/architecture.md", () => {
    expect(violations(readImportGraph(root))).toEqual([]);
  });

  it("no file switches the boundary lint rule off", () => {
    const files = [...new Set(readImportGraph(root).map((e) => e.from))];
    const disabled = files.filter((f) => /eslint-disable[^\n]*no-restricted-imports/.test(readFileSync(join(root, f), "utf8")));
    expect(disabled).toEqual([]);
  });
});

/** A small tree with one wrong import of each kind, and the allowed forms beside them. */
const PROBE: Record<string, string> = {
  "lib/engine/index.ts": `export { run } from "./core";\n`,
  "lib/engine/core.ts": `import { z } from "zod";\nexport const run = () => z;\n`,
  "lib/engine/types.ts": `export type StageType = "CSTR" | "PFR";\n`,
  "lib/reports/report.ts": [
    `import { Cautions } from "@/components/cautions/cautions";`,
    `import type { StageType } from "@/lib/engine/types";`,
    `import { run } from "@/lib/engine";`,
    `import { type StageType as S2 } from "../engine/types";`,
    `import { NextResponse } from "next/server";`,
    `import { readJson } from "@/lib/http";`,
    `export const x = [Cautions, run, NextResponse, readJson];`,
  ].join("\n"),
  "lib/sweeps/grid.ts": `export * from "../engine/core";\nconst later = () => import("@/app/page");\n`,
  "lib/http.ts": `import { NextResponse } from "next/server";\nexport const readJson = NextResponse;\n`,
  "db/seed.ts": `import { run } from "@/lib/engine";\nimport { getEnv } from "@/lib/env";\n`,
  "lib/env.ts": `export const getEnv = () => 1;\n`,
  "app/page.tsx": `import { eq } from "drizzle-orm";\nimport { getDb } from "@/db/client";\nimport { users } from "@/db/schema";\n`,
  "db/client.ts": `export const getDb = () => 1;\n`,
  "db/schema/index.ts": `export const users = 1;\n`,
  "components/view.tsx": `import { listSweeps } from "@/lib/services/sweeps";\nimport type { SweepRow } from "@/lib/services/sweeps";\n`,
  "lib/services/sweeps.ts": `export type SweepRow = { id: string };\nexport const listSweeps = () => [];\n`,
  "worker/index.ts": `const m = require("react");\n`,
};

describe("the boundary checks catch a wrong import", () => {
  let dir: string;
  beforeAll(() => {
    dir = mkdtempSync(join(tmpdir(), "seriatim-probe-"));
    for (const [file, text] of Object.entries(PROBE)) {
      mkdirSync(dirname(join(dir, file)), { recursive: true });
      writeFileSync(join(dir, file), text);
    }
  });
  afterAll(() => rmSync(dir, { recursive: true, force: true }));

  it("finds exactly the wrong imports of the probe tree, each under its rule", () => {
    const found = violations(readImportGraph(dir)).map((v) => v.replace(/ \(.*\)$/, ""));
    expect(found.sort()).toEqual(
      [
        "app/page.tsx:1 imports drizzle-orm: a page or route queries the database itself",
        "app/page.tsx:3 imports @/db/schema: a page or route queries the database itself",
        "components/view.tsx:1 imports @/lib/services/sweeps: a component imports server code at run time",
        "db/seed.ts:1 imports @/lib/engine: db imports upwards",
        "lib/engine/core.ts:1 imports zod: the engine imports a package",
        "lib/reports/report.ts:1 imports @/components/cautions/cautions: lib imports a screen or route",
        "lib/reports/report.ts:5 imports next/server: domain code imports Next.js or React",
        "lib/reports/report.ts:6 imports @/lib/http: domain code imports the web edge",
        "lib/sweeps/grid.ts:1 imports ../engine/core: an engine internal imported at run time",
        "lib/sweeps/grid.ts:2 imports @/app/page: lib imports a screen or route",
        "worker/index.ts:1 imports react: domain code imports Next.js or React",
      ].sort(),
    );
  });

  it("has a rule for every kind of wrong import it reports", () => {
    expect(RULES.length).toBeGreaterThanOrEqual(7);
  });
});

/** The same rules in ESLint: a wrong import in each folder is an error there, a right one is not. */
describe("the lint rules catch a wrong import", () => {
  const eslint = new ESLint({ cwd: root });
  const restricted = async (filePath: string, code: string) => {
    const [result] = await eslint.lintText(code, { filePath: join(root, filePath) });
    return result.messages.filter((m) => m.ruleId === "no-restricted-imports").length;
  };

  it.each([
    ["lib/reports/probe.ts", `import { Cautions } from "@/components/cautions/cautions";\nexport const c = Cautions;\n`],
    ["lib/reports/probe.ts", `import { toSI } from "@/lib/engine/units";\nexport const c = toSI;\n`],
    ["lib/sweeps/probe.ts", `import { NextResponse } from "next/server";\nexport const c = NextResponse;\n`],
    ["lib/datasets/probe.ts", `import { readJson } from "@/lib/http";\nexport const c = readJson;\n`],
    ["db/probe.ts", `import { designTrains } from "@/lib/engine";\nexport const c = designTrains;\n`],
    ["lib/engine/probe.ts", `import { z } from "zod";\nexport const c = z;\n`],
    ["app/(app)/probe/page.tsx", `import { users } from "@/db/schema";\nexport const c = users;\n`],
    ["app/api/probe/route.ts", `import { sql } from "drizzle-orm";\nexport const c = sql;\n`],
    ["components/probe/view.tsx", `import { listSweeps } from "@/lib/services/sweeps";\nexport const c = listSweeps;\n`],
    ["worker/probe.ts", `import { useState } from "react";\nexport const c = useState;\n`],
  ])("%s: %s is an error", async (file, code) => {
    expect(await restricted(file, code)).toBeGreaterThan(0);
  });

  it.each([
    ["lib/reports/probe.ts", `import type { StageType } from "@/lib/engine/types";\nimport { designTrains } from "@/lib/engine";\nexport const c = designTrains;\nexport type T = StageType;\n`],
    ["db/probe.ts", `import { getEnv } from "@/lib/env";\nexport const c = getEnv;\n`],
    ["app/api/probe/route.ts", `import { getDb } from "@/db/client";\nexport const c = getDb;\n`],
    ["components/probe/view.tsx", `import type { Database } from "@/db/client";\nexport type T = Database;\n`],
  ])("%s: %s is allowed", async (file, code) => {
    expect(await restricted(file, code)).toBe(0);
  });
});
