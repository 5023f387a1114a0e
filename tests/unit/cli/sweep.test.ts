import { spawnSync } from "node:child_process";
import { writeFileSync, mkdtempSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { describe, expect, it } from "vitest";

const root = join(__dirname, "../../..");
const spec = (name: string) => join(root, "tests/fixtures/specs", name);

function sweep(...args: string[]) {
  const out = spawnSync("npm", ["run", "--silent", "sweep", "--", ...args], { cwd: root, encoding: "utf8", timeout: 60000 });
  return { code: out.status, lines: out.stdout.trim().split("\n").map((l) => JSON.parse(l)) };
}

interface Stage {
  type: string;
  conversionIn: number;
  conversionOut: number;
  volume: number;
  levenspiel?: { curve: [number, number][]; area: [number, number][] };
}
const stagesOf = (r: { candidates: { stages: Stage[] }[] }) => r.candidates.flatMap((c) => c.stages);

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

  it("leaves the Levenspiel plot points out by default and gives them back with --plot, anywhere among the files", () => {
    const plain = sweep(spec("first-order-liquid.json"), spec("rating-adiabatic-cstr.json"));
    const plotted = sweep(spec("first-order-liquid.json"), "--plot", spec("rating-adiabatic-cstr.json"));
    expect(plain.code).toBe(0);
    expect(plotted.code).toBe(0);
    expect(JSON.stringify(plain.lines)).not.toContain("levenspiel");
    for (const s of stagesOf(plain.lines[0])) expect(Object.keys(s)).not.toContain("levenspiel");
    // Apart from the plot points, the two outputs are the same numbers.
    const stripped = {
      ...plotted.lines[0],
      candidates: plotted.lines[0].candidates.map((c: { stages: Stage[] }) => ({ ...c, stages: c.stages.map(({ levenspiel: _p, ...s }) => s) })),
    };
    expect(stripped).toEqual(plain.lines[0]);
    expect(plotted.lines[1]).toEqual(plain.lines[1]);
    // The points are those of the first-order curve FA0/(-rA) = FA0/(k CA0 (1 - X)) (closed form, common
    // practice), FA0 = 0.05 mol/s, CA0 = 1500 mol/m3, k = 0.002 1/s, printed to 6 significant digits.
    const pfr: Stage = plotted.lines[0].candidates[0].stages[0];
    expect(pfr.type).toBe("PFR");
    expect(pfr.levenspiel?.curve).toHaveLength(25);
    for (const [x, h] of pfr.levenspiel?.curve ?? []) expect(Math.abs(h - 0.05 / (0.002 * 1500 * (1 - x))) / h).toBeLessThan(1e-5);
    expect(pfr.levenspiel?.curve[0]).toEqual([0, 0.0166667]);
    // The PFR's outline closes the area under the curve: by the trapezoid rule close to its volume.
    const area = pfr.levenspiel?.area ?? [];
    let under = 0;
    for (let i = 1; i < area.length; i++) under += ((area[i][0] - area[i - 1][0]) * (area[i][1] + area[i - 1][1])) / 2;
    expect(Math.abs(under - pfr.volume) / pfr.volume).toBeLessThan(0.02);
    // Every stage of every design gets its plot with --plot: a CSTR's is the rectangle X_in..X_out under its outlet height.
    for (const s of stagesOf(plotted.lines[0])) {
      expect(s.levenspiel?.curve.length).toBeGreaterThan(0);
      if (s.type === "CSTR" && s.conversionOut > s.conversionIn) {
        const h = 0.05 / (0.002 * 1500 * (1 - s.conversionOut));
        expect(Math.abs((s.conversionOut - s.conversionIn) * h - s.volume) / s.volume).toBeLessThan(1e-5);
        expect(s.levenspiel?.area).toHaveLength(4);
      }
    }
  });

  it("refuses an unknown option with one error line naming what it accepts, and exit code 2", () => {
    for (const args of [["--plots", spec("first-order-liquid.json")], [spec("first-order-liquid.json"), "-p"]]) {
      const { code, lines } = sweep(...args);
      expect(code).toBe(2);
      expect(lines).toHaveLength(1);
      expect(lines[0].error).toBe(
        `unknown option "${args.find((a) => a.startsWith("-"))}": the command line accepts --plot (adds each stage's Levenspiel plot points to a design) and one or more design or rating files (FILE.json); a file whose name starts with - is given as ./-name.json`,
      );
      expect(lines[0].path).toBe("");
    }
    const none = sweep("--plot");
    expect(none.code).toBe(2);
    expect(none.lines[0].error).toMatch(/^no design or rating file given; usage: npm run --silent sweep -- \[--plot\] FILE\.json/);
  });

  it("takes the tube with recycle and train.recycleRatio, and prints each such stage's recycleRatio", () => {
    const dir = mkdtempSync(join(tmpdir(), "sweep-recycle-"));
    const base = {
      feed: { flowA: 1, concA: 1, ratios: { R: 0 } },
      reaction: { stoichiometry: { A: -1, R: 1 }, rate: { law: "power", k: 1, orders: { A: 1, R: 1 } } },
      target: { conversion: 0.9 },
    };
    const chosen = join(dir, "chosen.json");
    writeFileSync(chosen, JSON.stringify({ ...base, train: { maxStages: 2, types: ["CSTR", "PFR", "PFR-recycle"] } }));
    const fixed = join(dir, "fixed.json");
    writeFileSync(fixed, JSON.stringify({ ...base, train: { candidates: [["PFR-recycle"]], recycleRatio: "2" } }));
    const rating = join(dir, "rating.json");
    writeFileSync(rating, JSON.stringify({ ...base, target: undefined, stages: [{ type: "PFR-recycle", volume: 4.5597785603, recycleRatio: 0.4299449860 }] }));
    const wrong = join(dir, "wrong.json");
    writeFileSync(wrong, JSON.stringify({ ...base, train: { candidates: [["PFR-recycle"]], recycleRatio: "a lot" } }));
    const { code, lines } = sweep("--plot", chosen, fixed, rating, wrong);
    expect(code).toBe(1);
    expect(lines[0].candidates).toHaveLength(3 + 9);
    const single = lines[0].candidates.find((c: { sequence: string[] }) => c.sequence.join() === "PFR-recycle");
    // independent bisection and Simpson in tests/unit/engine/recycle.test.ts: R = 0.429945, k tau C_A0 = 4.55978
    expect(single.stages[0].recycleRatio).toBeCloseTo(0.429945, 5);
    expect(single.stages[0].residenceTime).toBeCloseTo(4.55978, 4);
    expect(single.stages[0].levenspiel.recycle.inletConversion).toBeCloseTo((0.429945 * 0.9) / 1.429945, 5);
    for (const c of lines[0].candidates) for (const st of c.stages) expect("recycleRatio" in st).toBe(st.type === "PFR-recycle");
    // fixed R = 2 from pure A: (R + 1) ln[X (1 - X1)/((1 - X) X1)], X1 = 0.6 (Levenspiel, ch. 6, integrated)
    expect(lines[1].candidates[0].stages[0].recycleRatio).toBe(2);
    expect(lines[1].candidates[0].totalVolume).toBeCloseTo(3 * Math.log((0.9 * 0.4) / (0.1 * 0.6)), 9);
    expect(lines[2].stages[0].recycleRatio).toBeCloseTo(0.429945, 6);
    expect(lines[2].conversionOut).toBeCloseTo(0.9, 8);
    expect(lines[3]).toEqual({ error: expect.stringContaining("Recycle ratio"), path: "train.recycleRatio" });
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
