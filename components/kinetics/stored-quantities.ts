import { fromSI, isUnit, type UnitKind } from "@/lib/units/display";

/** A stored number back as the engineer typed it: 12 significant digits undo the unit round trip. */
export const show = (n: number) => String(Number(n.toPrecision(12)));

/** A stored number that may have come back from JSON as text. */
export const asNumber = (x: unknown): number => (typeof x === "number" ? x : Number(x));

/**
 * Reads stored quantities (SI numbers) back into form boxes, each in the unit it was typed in when
 * that unit was kept, else the field's usual one. Kinetics of one reaction and of several keep their
 * typed units the same way.
 */
export function storedQuantities(shown: Record<string, string>) {
  const unitAt = (kind: UnitKind, path: string, fallback: string) => (shown[path] && isUnit(kind, shown[path]) ? shown[path] : fallback);
  const qAt = (kind: UnitKind, path: string, si: unknown, fallback: string): { value: string; unit: string } => {
    const unit = unitAt(kind, path, fallback);
    return si === undefined || si === null ? { value: "", unit } : { value: show(fromSI(kind, asNumber(si), unit)), unit };
  };
  return { unitAt, qAt };
}
