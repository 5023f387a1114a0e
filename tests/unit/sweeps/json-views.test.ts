import { describe, expect, expectTypeOf, it } from "vitest";
import type { Jsonify } from "@/lib/services/views";

// The screens' views are the services' results after JSON: the type must say what JSON.parse gives.
describe("views as JSON carries them", () => {
  const stored = {
    createdAt: new Date("2026-03-01T08:30:00Z"),
    finishedAt: null as Date | null,
    note: undefined as string | undefined,
    stages: [{ type: "CSTR" as const, volume: 1.5 }],
    area: [[0, 0], [0.9, 2.5]] as [number, number][],
  };

  it("dates arrive as ISO text, nulls and tuples as they were, undefined fields not at all", () => {
    const wire: Jsonify<typeof stored> = JSON.parse(JSON.stringify(stored));
    expect(wire.createdAt).toBe("2026-03-01T08:30:00.000Z");
    expect(wire.finishedAt).toBeNull();
    expect("note" in wire).toBe(false);
    expect(wire.stages).toEqual([{ type: "CSTR", volume: 1.5 }]);
    expect(wire.area[1]).toEqual([0.9, 2.5]);
  });

  it("the type follows: a Date field becomes a string, the rest keep their types", () => {
    expectTypeOf<Jsonify<typeof stored>>().toEqualTypeOf<{
      createdAt: string;
      finishedAt: string | null;
      note: string | undefined;
      stages: { type: "CSTR"; volume: number }[];
      area: [number, number][];
    }>();
  });
});
