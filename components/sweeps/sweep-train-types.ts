import type { DesignSpec } from "@/lib/engine";

/** Whether a one-reaction sweep's trains can hold a tube with recycle: among its types, or in a listed train. */
export function trainsWithRecycle(spec: Pick<DesignSpec, "train"> | undefined): boolean {
  const train = spec?.train;
  if (!train) return false;
  if ("types" in train) return !!train.types?.includes("PFR-recycle");
  if ("candidates" in train) return train.candidates.some((c) => c.includes("PFR-recycle"));
  return false;
}
