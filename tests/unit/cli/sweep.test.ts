import { spawnSync } from "node:child_process";
import { writeFileSync, mkdtempSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { describe, expect, it } from "vitest";

const root = join(__dirname, "../../..");
const spec = (name: string) => join(root, "tests/fixtures/specs", name);

function sweep(...files: string[]) {
  const out = spawnSync("npm", ["run", "--silent", "sweep", "--", ...files], { cwd: root, encoding: "utf8", timeout: 60000 });
  return { code: out.status, lines: out.stdout.trim().split("\n").map((l) => JSON.parse(l)) };
}

describe("sweep command line", { timeout: 60000 }, () => {
  it("prints one result and exits 0 for a valid spec", () => {
    const { code, lines } = sweep(spec("first-order-liquid.json"));
    expect(code).toBe(0);
    expect(lines).toHaveLength(1);
    const r = lines[0];
    expect(r.candidates[0].rank).toBe(1);
    // closed form, Levenspiel, ch. 5: first-order PFR V = v0 ln(1/(1-X))/k, v0 = 0.05/1500 m3/s
    expect(Math.abs(r.reference.singlePFR - ((0.05 / 1500) * Math.log(10)) / 0.002)).toBeLessThan(1e-12);
    expect(r.cautions.length).toBeGreaterThan(0);
  });

  it("prints JSON Lines in file order, an error object on a failing spec's line, and exits 1", () => {
    const files = ["second-order-five-stages.json", "error-negative-k.json", "gas-expansion.json", "error-unit.json", "rating-adiabatic-cstr.json"];
    const { code, lines } = sweep(...files.map(spec));
    expect(code).toBe(1);
    expect(lines).toHaveLength(5);
    expect(lines[0].candidates).toHaveLength(62);
    expect(lines[1]).toEqual({ error: "rate constant k must be > 0", path: "reaction.rate.k" });
    expect(lines[2].candidates.length).toBe(3);
    expect(lines[3].path).toBe("feed.flowA");
    expect(lines[4].stages[0].multiple).toBe(true);
  });

  it("reports schema errors with the JSON path", () => {
    const dir = mkdtempSync(join(tmpdir(), "sweep-"));
    const bad = join(dir, "bad.json");
    writeFileSync(bad, JSON.stringify({ feed: { flowA: 1, concA: 1 }, reaction: { rate: { law: "power", k: true, orders: { A: 1 } } }, target: { conversion: 0.5 }, train: { maxStages: 1 } }));
    const notJson = join(dir, "nope.json");
    writeFileSync(notJson, "{ not json");
    const { code, lines } = sweep(bad, notJson);
    expect(code).toBe(1);
    expect(lines[0].path).toBe("reaction.rate.k");
    expect(lines[1].error).toMatch(/JSON/);
  });

  it("every fixture spec gives a result or an error object", () => {
    const names = ["adiabatic-reversible-cooling.json", "cost-standard-sizes.json", "saturation-inhibition.json", "expression-autocatalytic.json", "rate-table.json", "error-equilibrium.json"];
    const { lines } = sweep(...names.map(spec));
    for (const l of lines.slice(0, 5)) expect(l.candidates[0].feasible).toBe(true);
    expect(lines[1].candidates[0].totalCost).toBeGreaterThan(0);
    // The spec's target (0.95): with standard sizes every vessel is full, so the train reaches it or passes it,
    // and each stage's volume is what was bought (count x size).
    expect(lines[1].candidates[0].conversionReached).toBeGreaterThanOrEqual(0.95);
    for (const s of lines[1].candidates[0].stages) expect(s.volume).toBeCloseTo(s.vessels.count * s.vessels.sizeEach, 12);
    expect(lines[5].path).toBe("target.conversion");
  });
});
