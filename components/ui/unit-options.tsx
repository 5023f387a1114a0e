import { unitOptions } from "@/lib/units/display";

/** The <option>s of a picker, each a value and the words shown for it. */
export function OptionList({ options }: { options: readonly { value: string; label: string }[] }) {
  return (
    <>
      {options.map((o) => (
        <option key={o.value} value={o.value}>
          {o.label}
        </option>
      ))}
    </>
  );
}

/** The <option>s of a unit picker for one kind of quantity. */
export function UnitOptions({ kind }: { kind: Parameters<typeof unitOptions>[0] }) {
  return <OptionList options={unitOptions(kind)} />;
}
