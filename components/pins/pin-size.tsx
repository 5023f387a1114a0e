"use client";

import { useDisplayUnits } from "@/components/layout/display-units-context";
import { formatNumber, TABLE_NUMBERS } from "@/lib/format/numbers";
import { formatQuantity } from "@/lib/units/display";

/**
 * A pinned design's total volume, in the reader's volume unit, and its cost when one was
 * computed: the same line in the project's pins and in the review inbox.
 */
export function PinSize({ totalVolume, totalCost }: { totalVolume: number | null; totalCost: number | null }) {
  const units = useDisplayUnits(totalVolume);
  return (
    <span className="num text-sm">
      {formatQuantity("volume", totalVolume, units.volume)}
      {totalCost !== null ? ` · cost ${formatNumber(totalCost, 4, TABLE_NUMBERS)}` : ""}
    </span>
  );
}
