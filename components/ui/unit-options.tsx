import { unitOptions } from "@/lib/units/display";

/** The <option>s of a unit picker for one kind of quantity. */
export function UnitOptions({ kind }: { kind: Parameters<typeof unitOptions>[0] }) {
  return (
    <>
      {unitOptions(kind).map((o) => (
        <option key={o.value} value={o.value}>
          {o.label}
        </option>
      ))}
    </>
  );
}
