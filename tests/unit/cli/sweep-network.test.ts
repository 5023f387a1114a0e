import { spawnSync } from "node:child_process";
import { mkdtempSync, readFileSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { describe, expect, it } from "vitest";

const root = join(__dirname, "../../..");
const example = join(root, "tests/fixtures/specs/network-three-reactions.json");

function sweep(...files: string[]) {
  const out = spawnSync("npm", ["run", "--silent", "sweep", "--", ...files], { cwd: root, encoding: "utf8", timeout: 240000 });
  return { code: out.status, lines: out.stdout.trim().split("\n").map((l) => JSON.parse(l)) };
}

describe("sweep command line, several reactions", { timeout: 240000 }, () => {
  it("designs the contract's example: every sequence of 1..3 stages, ranked, within the limits", () => {
    const { code, lines } = sweep(example);
    expect(code).toBe(0);
    const r = lines[0];
    expect(r.candidates).toHaveLength(2 + 4 + 8);
    expect(new Set(r.candidates.map((c: { sequence: string[] }) => c.sequence.join(" "))).size).toBe(14);
    expect(r.candidates.map((c: { rank: number }) => c.rank)).toEqual(Array.from({ length: 14 }, (_, i) => i + 1));
    for (let i = 1; i < r.candidates.length; i++) expect(r.candidates[i].objective).toBeLessThanOrEqual(r.candidates[i - 1].objective * (1 + 1e-9));
    for (const c of r.candidates) {
      expect(c.feasible).toBe(true);
      expect(c.conversion).toBeGreaterThanOrEqual(0.5 - 1e-9);
      expect(c.totalVolume).toBeLessThanOrEqual(2 * (1 + 1e-12));
      // yield from the definition Y = (F_B - F_B0)/F_A0 on the outlet printed
      expect(Math.abs(c.yield - c.outlet.B / 580)).toBeLessThan(1e-12);
    }
    // A -> B -> C favours plug flow (Levenspiel, ch. 8): the best train is no worse than one tube, which beats one tank.
    expect(r.candidates[0].objective).toBeGreaterThanOrEqual(r.reference.singlePFR.objective - 1e-12);
    expect(r.reference.singlePFR.objective).toBeGreaterThan(r.reference.singleCSTR.objective);
  });

  it("reports a network spec's errors as { error, path } and exits 1", () => {
    const dir = mkdtempSync(join(tmpdir(), "sweep-network-"));
    const base = JSON.parse(readFileSync(example, "utf8"));
    const write = (name: string, spec: unknown) => {
      const file = join(dir, name);
      writeFileSync(file, JSON.stringify(spec));
      return file;
    };
    const missing = write("missing.json", { ...base, reactions: [...base.reactions, { stoichiometry: { A: -1, E: 1 }, rate: { law: "power", k: 1, orders: { A: 1 } } }] });
    const unreachable = write("unreachable.json", { ...base, constraints: { minConversion: 0.999, maxTotalVolume: 0.01 } });
    const { code, lines } = sweep(missing, unreachable, example);
    expect(code).toBe(1);
    expect(lines).toHaveLength(3);
    expect(Object.keys(lines[0]).sort()).toEqual(["error", "path"]);
    expect(lines[0].path).toMatch(/^reactions\.3\.stoichiometry/);
    // first order k = 10 1/s, tau at most 0.1 s: even a tube reaches only 1 - e^-1 < 0.999 (closed form)
    expect(lines[1].path).toBe("constraints.minConversion");
    expect(lines[2].candidates.length).toBe(14);
  });
});
