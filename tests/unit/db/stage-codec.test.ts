import { readFileSync, readdirSync } from "node:fs";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { designNetwork, designTrains, type DesignSpec, type NetworkDesignSpec } from "@/lib/engine";
import { candidateRows } from "@/lib/sweeps/candidate-rows";
import { networkCandidateRows } from "@/lib/sweeps/network-candidate-rows";
import { decodeStages, encodeStages } from "@/db/stage-codec";

/** What a JSON column gave back before: the reference every stored stage list must come back as. */
const viaJson = (x: unknown) => JSON.parse(JSON.stringify(x)) as unknown;
const roundTrip = (stages: Record<string, unknown>[]) => decodeStages(encodeStages(stages));

const specs = readdirSync("tests/fixtures/specs")
  .filter((f) => !f.startsWith("error-") && !f.startsWith("rating-"))
  .map((f) => ({ name: f, spec: JSON.parse(readFileSync(`tests/fixtures/specs/${f}`, "utf8")) as Record<string, unknown> }));

describe("stored stages", () => {
  const oneReaction = specs.filter((s) => !("reactions" in s.spec));
  it.each(oneReaction.map((s) => [s.name, s.spec] as const))("come back exactly as designed: %s", (_name, spec) => {
    const result = designTrains({ ...(spec as unknown as DesignSpec), train: { maxStages: 3, types: ["CSTR", "PFR"] } } as DesignSpec);
    const rows = candidateRows("sweep", "scenario", result);
    expect(rows.length).toBeGreaterThan(1);
    for (const row of rows) {
      const bytes = encodeStages(row.stages);
      expect(decodeStages(bytes)).toEqual(viaJson(row.stages));
      // A designed one-reaction train always fits the compact form: at most 17 + 8 + 16 + 8 + 12 + 8
      // bytes a stage, against about 380 as JSON.
      if (row.stages.length) {
        expect(bytes[0]).toBe(1);
        expect(bytes.length).toBeLessThanOrEqual(19 + 69 * row.stages.length);
        expect(bytes.length).toBeLessThan(Buffer.byteLength(JSON.stringify(row.stages)) / 3);
      }
    }
  });

  it("keep an isothermal train bought as one vessel a stage in 17 bytes a stage", () => {
    const spec = oneReaction.find((s) => s.name === "second-order-five-stages.json")!.spec as unknown as DesignSpec;
    const result = designTrains(spec);
    const five = candidateRows("s", "c", result).find((r) => r.stages.length === 5 && r.feasible)!;
    expect(encodeStages(five.stages).length).toBe(3 + 16 + 5 * 17);
  });

  it("keep a tube with recycle compact, with its recycle ratio", () => {
    const spec = oneReaction.find((s) => s.name === "expression-autocatalytic.json")!.spec as unknown as DesignSpec;
    const result = designTrains({ ...spec, train: { maxStages: 2, types: ["CSTR", "PFR", "PFR-recycle"] } } as DesignSpec);
    const rows = candidateRows("s", "c", result).filter((r) => r.stages.some((st) => st.type === "PFR-recycle"));
    expect(rows.length).toBeGreaterThan(0);
    for (const row of rows) {
      const bytes = encodeStages(row.stages);
      expect(bytes[0]).toBe(1);
      const back = decodeStages(bytes);
      expect(back).toEqual(viaJson(row.stages));
      for (const st of back.filter((x) => x.type === "PFR-recycle")) expect(typeof st.recycleRatio).toBe("number");
    }
  });

  it("keep stages whose inlet temperature the design chose compact, with their mark", () => {
    const spec = oneReaction.find((s) => s.name === "adiabatic-reversible-cooling.json")!.spec as unknown as DesignSpec;
    const thermal = { ...(spec.reaction.thermal as object), interstageTemperature: { min: 300, max: 400 } };
    const result = designTrains({ ...spec, reaction: { ...spec.reaction, thermal }, train: { maxStages: 3, types: ["CSTR", "PFR"] } } as DesignSpec);
    const rows = candidateRows("s", "c", result).filter((r) => r.stages.some((st) => "temperatureChosen" in st));
    expect(rows.length).toBeGreaterThan(0);
    for (const row of rows) {
      const bytes = encodeStages(row.stages);
      expect(bytes[0]).toBe(1);
      expect(decodeStages(bytes)).toEqual(viaJson(row.stages));
    }
  });

  it("keep several reactions' stages as deflated JSON that reads back the same", () => {
    const spec = specs.find((s) => s.name === "network-three-reactions.json")!.spec as unknown as NetworkDesignSpec;
    const rows = networkCandidateRows("sweep", "scenario", designNetwork({ ...spec, train: { maxStages: 2, types: ["CSTR", "PFR"] } }));
    for (const row of rows) {
      const bytes = encodeStages(row.stages);
      expect([0, 2]).toContain(bytes[0]);
      expect(decodeStages(bytes)).toEqual(viaJson(row.stages));
    }
  });

  it("read rows written before the compact form (JSON text behind form byte 0)", () => {
    const old = [{ type: "PFR", volume: 0.5, conversionIn: 0, conversionOut: 0.9 }];
    expect(decodeStages(Buffer.concat([Buffer.of(0), Buffer.from(JSON.stringify(old))]))).toEqual(old);
  });

  it("refuse bytes of an unknown form or the wrong length rather than read nonsense", () => {
    expect(() => decodeStages(Buffer.of(7, 1, 2))).toThrow(/unknown form/);
    const good = encodeStages([{ type: "CSTR", conversionIn: 0, conversionOut: 0.5, temperatureIn: 300, temperatureOut: 300, volume: 1, residenceTime: 2, vessels: { count: 1, sizeEach: 1 }, cost: null }]);
    expect(() => decodeStages(good.subarray(0, good.length - 1))).toThrow();
    expect(() => decodeStages(Buffer.concat([good, Buffer.of(0)]))).toThrow(/length/);
  });

  // Any number the engine can produce, and shapes it does not produce, come back as JSON would give them.
  const num = fc.oneof(fc.double({ noNaN: true, noDefaultInfinity: true }), fc.integer(), fc.constant(0), fc.constant(-0));
  const stage = fc.record({
    type: fc.constantFrom("CSTR", "PFR", "PFR-recycle"),
    conversionIn: num,
    conversionOut: num,
    temperatureIn: num,
    temperatureOut: num,
    volume: num,
    residenceTime: num,
    vessels: fc.record({ count: fc.oneof(fc.nat(), fc.constant(1)), sizeEach: num }),
    cost: fc.option(num, { nil: null }),
  }).chain((st) => fc.constantFrom<boolean | undefined>(undefined, true, false).map((chosen) => (chosen === undefined ? st : { ...st, temperatureChosen: chosen }))).chain((st) => (st.type === "PFR-recycle" ? fc.option(num, { nil: undefined }).map((r) => (r === undefined ? st : { ...st, recycleRatio: r })) : fc.constant(st)));
  /** Trains as the engine shapes them: chained conversions, one temperature, tau = V / v0, one vessel each. */
  const designed = fc.tuple(fc.array(fc.tuple(fc.constantFrom("CSTR", "PFR"), fc.double({ min: 1e-9, max: 1e6, noNaN: true }), fc.double({ min: 0, max: 1, noNaN: true })), { minLength: 1, maxLength: 8 }), fc.double({ min: 1e-9, max: 1e3, noNaN: true }), fc.double({ min: 200, max: 900, noNaN: true })).map(([parts, v0, t]) => {
    let x = 0;
    return parts.map(([type, volume, step]) => {
      const conversionIn = x;
      x = x + (1 - x) * step;
      return { type, conversionIn, conversionOut: x, temperatureIn: t, temperatureOut: t, volume, residenceTime: volume / v0, vessels: { count: 1, sizeEach: volume }, cost: null };
    });
  });

  it("come back bit for bit for any stage list (fast-check)", () => {
    fc.assert(fc.property(fc.array(stage, { maxLength: 7 }), (stages) => {
      expect(roundTrip(stages)).toEqual(viaJson(stages));
    }), { numRuns: 400 });
    fc.assert(fc.property(designed, (stages) => {
      expect(roundTrip(stages)).toEqual(viaJson(stages));
    }), { numRuns: 400 });
    fc.assert(fc.property(fc.array(fc.dictionary(fc.string(), fc.jsonValue()), { maxLength: 5 }), (stages) => {
      expect(roundTrip(stages)).toEqual(viaJson(stages));
    }), { numRuns: 200 });
  });
});
