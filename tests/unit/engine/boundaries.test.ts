import { readdirSync, readFileSync } from "node:fs";
import { dirname, join, resolve, sep } from "node:path";
import { describe, expect, it } from "vitest";
import * as engine from "../../../lib/engine/index";

const dir = join(__dirname, "../../../lib/engine");

describe("engine boundaries", () => {
  it("imports only relative engine files, mathjs or ml-matrix", () => {
    const offenders: string[] = [];
    for (const f of readdirSync(dir, { recursive: true }) as string[]) {
      if (!f.endsWith(".ts")) continue;
      const text = readFileSync(join(dir, f), "utf8");
      for (const m of text.matchAll(/(?:import|export)\s[^;]*?from\s+["']([^"']+)["']|import\(\s*["']([^"']+)["']\s*\)|require\(\s*["']([^"']+)["']\s*\)/g)) {
        const spec = m[1] ?? m[2] ?? m[3];
        // A relative import may climb out of a subfolder (network/) but never out of the engine.
        const inside = (spec.startsWith("./") || spec.startsWith("../")) && resolve(dir, dirname(f), spec).startsWith(dir + sep);
        const ok = spec === "mathjs" || spec === "ml-matrix" || inside;
        if (!ok) offenders.push(`${f}: ${spec}`);
      }
      if (/process\.env|Date\.now|new Date\(|\beval\(|new Function/.test(text)) offenders.push(`${f}: forbidden global`);
    }
    expect(offenders).toEqual([]);
  });

  it("index.ts exports exactly the public API", () => {
    expect(Object.keys(engine).sort()).toEqual(["CAUTIONS", "DIM", "EMPTY_STAGE_STEP", "EngineError", "GAS_CONSTANT", "MAX_RATED_VESSEL", "MAX_STAGES", "MODEL_ASSUMPTIONS", "RECYCLE_RATIO_MAX", "VOLUME_LIMITS", "designNetwork", "designTrains", "networkPaths", "networkTrainProfiles", "normaliseKinetics", "normaliseRatingSpec", "rateNetworkTrain", "rateTrain", "rateTrainOutlet", "stagePlots", "thermalWarnings", "toSI"]);
  });
});
