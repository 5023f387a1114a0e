import { datasetUnitOptions, type DatasetUnitKind } from "@/lib/datasets/units";

/** The <option>s of a unit picker for rate data (the units an upload may be in, one kind of quantity). */
export function DatasetUnitOptions({ kind }: { kind: DatasetUnitKind }) {
  return (
    <>
      {datasetUnitOptions(kind).map((o) => (
        <option key={o.value} value={o.value}>
          {o.label}
        </option>
      ))}
    </>
  );
}
