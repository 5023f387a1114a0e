import fc from "fast-check";

/**
 * The reference the vessel-reuse planners are checked against, by exhaustive search: each slot
 * (a stage, or one of its parallel vessels) is either bought at its price or given a distinct
 * inventory vessel that fits it, at that vessel's reuse cost. Returns the least total.
 */
export function cheapestByBruteForce<S, V extends { reuseCost?: number | null }>(slots: S[], inventory: V[], price: (s: S) => number, fits: (s: S, v: V) => boolean): number {
  let best = Infinity;
  const used = new Set<number>();
  const walk = (i: number, cost: number) => {
    if (cost >= best) return;
    if (i === slots.length) {
      best = cost;
      return;
    }
    walk(i + 1, cost + price(slots[i]));
    inventory.forEach((v, k) => {
      if (used.has(k) || !fits(slots[i], v)) return;
      used.add(k);
      walk(i + 1, cost + (v.reuseCost ?? 0));
      used.delete(k);
    });
  };
  walk(0, 0);
  return best;
}

/** An idle-vessel record of either type, available or not, with a reuse cost. */
export const inventoryVesselArb = fc.record({
  id: fc.uuid(),
  tag: fc.string({ minLength: 1, maxLength: 6 }),
  type: fc.constantFrom<"CSTR" | "PFR">("CSTR", "PFR"),
  volume: fc.double({ min: 0.5, max: 25, noNaN: true }),
  available: fc.boolean(),
  reuseCost: fc.double({ min: 0, max: 2e5, noNaN: true }),
});
