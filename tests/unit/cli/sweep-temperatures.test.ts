import { spawnSync } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { describe, expect, it } from "vitest";

const root = join(__dirname, "../../..");

function sweep(...args: string[]) {
  const out = spawnSync("npm", ["run", "--silent", "sweep", "--", ...args], { cwd: root, encoding: "utf8", timeout: 120000 });
  return { code: out.status, lines: out.stdout.trim().split("\n").map((l) => JSON.parse(l)) };
}

interface Stage {
  type: string;
  conversionIn: number;
  conversionOut: number;
  temperatureIn: number;
  temperatureOut: number;
  volume: number;
  temperatureChosen?: boolean;
}

// A <=> R, first order both ways, exothermic (reverse activation energy above the forward one).
const R = 8.314462618;
const k1 = (t: number) => 0.004 * Math.exp((-60000 / R) * (1 / t - 1 / 330));
const k2 = (t: number) => 4e-5 * Math.exp((-120000 / R) * (1 / t - 1 / 330));
/** -rA = C_A0 (k1 (1 - X) - k2 X), pure A (common practice). */
const rate = (x: number, t: number) => 1200 * (k1(t) * (1 - x) - k2(t) * x);

const reaction = (thermal: unknown) => ({
  stoichiometry: { A: -1, R: 1 },
  rate: { law: "power", k: 0.004, orders: { A: 1 }, activationEnergy: 60000, reverse: { k: 4e-5, orders: { R: 1 }, activationEnergy: 120000 }, referenceTemperature: 330 },
  thermal,
});
const feed = { flowA: 0.5, concA: 1200, temperature: 330, ratios: { R: 0 } };

describe("sweep command line with chosen stage temperatures", { timeout: 120000 }, () => {
  it("takes temperature ranges, prints each stage's chosen inlet temperature and the best temperature path", () => {
    const dir = mkdtempSync(join(tmpdir(), "sweep-temperatures-"));
    const adiabatic = join(dir, "adiabatic.json");
    // Ranges in degC as a user types them: 26.85 degC = 300 K, 146.85 degC = 420 K.
    writeFileSync(
      adiabatic,
      JSON.stringify({
        feed,
        reaction: reaction({
          mode: "adiabatic",
          adiabaticRise: 100,
          maxTemperature: 420,
          interstageTemperature: { min: "26.85 degC", max: "146.85 degC" },
          feedTemperature: { min: 300, max: 420 },
        }),
        target: { conversion: 0.9 },
        train: { maxStages: 3, types: ["CSTR", "PFR"] },
      }),
    );
    const isothermal = join(dir, "stage-temperature.json");
    writeFileSync(isothermal, JSON.stringify({ feed, reaction: reaction({ mode: "stageTemperature", min: 300, max: 400 }), target: { conversion: 0.8 }, train: { candidates: [["CSTR"], ["CSTR", "PFR"]] } }));
    const reversed = join(dir, "reversed-range.json");
    writeFileSync(reversed, JSON.stringify({ feed, reaction: reaction({ mode: "stageTemperature", min: 400, max: 300 }), target: { conversion: 0.8 }, train: { maxStages: 1 } }));
    const rating = join(dir, "rating.json");
    writeFileSync(rating, JSON.stringify({ feed, reaction: reaction({ mode: "adiabatic", adiabaticRise: 100, interstageTemperature: { min: 300, max: 400 } }), stages: [{ type: "PFR", volume: 0.01 }] }));

    const { code, lines } = sweep(adiabatic, isothermal, reversed, rating);
    expect(code).toBe(1);
    expect(lines).toHaveLength(4);

    const first = lines[0];
    const path = first.reference.bestTemperaturePath;
    expect(path.points).toHaveLength(41);
    expect(path.lowestTemperature).toBeCloseTo(300, 9);
    expect(path.highestTemperature).toBe(420);
    expect(path.points[0]).toEqual({ conversion: 0, temperature: 420 });
    for (const p of path.points.slice(1)) expect(p.temperature).toBeLessThan(p.equilibriumTemperature);
    const feasible = first.candidates.filter((c: { feasible: boolean }) => c.feasible);
    expect(feasible.length).toBeGreaterThan(3);
    for (const c of feasible) {
      // No train beats the best temperature path.
      expect(c.volumeOverBestPath).toBeGreaterThan(1);
      expect(c.volumeOverBestPath).toBeCloseTo(c.totalVolume / path.volume, 12);
      for (const s of c.stages as Stage[]) {
        expect(s.temperatureChosen).toBe(true);
        expect(s.temperatureIn).toBeGreaterThanOrEqual(300 - 1e-9);
        expect(Math.max(s.temperatureIn, s.temperatureOut)).toBeLessThanOrEqual(420 + 1e-9);
        // A stirred tank's volume from its design equation at the chosen temperature (closed form, common practice).
        if (s.type === "CSTR" && s.conversionOut > s.conversionIn) {
          expect(Math.abs((0.5 * (s.conversionOut - s.conversionIn)) / rate(s.conversionOut, s.temperatureOut) - s.volume) / s.volume).toBeLessThan(1e-10);
        }
      }
    }

    // A single tank at X = 0.8 runs near the temperature of the highest rate there, about 373 K (inside the
    // range); the tank of the two-stage train, at low conversion, at the top of the range.
    const byName = (seq: string) => lines[1].candidates.find((c: { sequence: string[] }) => c.sequence.join(" ") === seq);
    const tank = byName("CSTR").stages[0] as Stage;
    expect(tank.temperatureIn).toBe(tank.temperatureOut);
    expect(tank.temperatureIn).toBeGreaterThan(360);
    expect(tank.temperatureIn).toBeLessThan(390);
    expect(byName("CSTR PFR").stages[0].temperatureIn).toBe(400);
    expect(lines[1].reference.bestTemperaturePath.highestTemperature).toBe(400);

    expect(lines[2]).toEqual({ error: expect.stringContaining("lowest stage temperature"), path: "reaction.thermal.min" });
    expect(lines[3]).toEqual({ error: expect.stringContaining("fixed temperatures"), path: "reaction.thermal.interstageTemperature" });
  });
});
