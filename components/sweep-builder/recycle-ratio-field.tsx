"use client";

import { useFormContext } from "react-hook-form";
import { DecimalField } from "./decimal-field";

/**
 * The recycle ratio of the sweep's tubes with recycle: chosen by the design with the stage conversions
 * (the default: the ratio of least volume for each train), or one ratio the user types for every tube
 * with recycle. Shown only while a tube with recycle is among the stage types or listed trains.
 */
export function RecycleRatioField({ mode }: { mode: "optimised" | "fixed" }) {
  const { register } = useFormContext();
  return (
    <fieldset className="flex flex-wrap items-start gap-4 rounded border border-line p-3">
      <legend className="field-label px-1">Recycle ratio of each tube with recycle</legend>
      <div className="space-y-1 text-sm">
        <label className="flex items-center gap-1.5">
          <input type="radio" value="optimised" {...register("recycleMode")} /> Chosen for the least volume
        </label>
        <label className="flex items-center gap-1.5">
          <input type="radio" value="fixed" {...register("recycleMode")} /> Fixed
        </label>
      </div>
      {mode === "fixed" ? <DecimalField prefix="s" path="recycleRatio" label="Recycle ratio R (recycled flow / flow leaving)" extra="w-28" /> : null}
    </fieldset>
  );
}
