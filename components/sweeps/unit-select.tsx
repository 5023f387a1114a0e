"use client";

import { usePathname, useRouter, useSearchParams } from "next/navigation";
import { useDisplayUnits } from "@/components/layout/display-units-context";
import { isVolumeUnit, VOLUME_LABEL, VOLUME_UNITS, type VolumeUnit } from "@/lib/charts/volume-units";

/** The volume unit picker; `onChange` defaults to keeping the choice in the URL's ?unit=. */
export function UnitSelect({ id, value, onChange, testId }: { id: string; value: VolumeUnit; onChange: (u: VolumeUnit) => void; testId?: string }) {
  return (
    <div>
      <label htmlFor={id} className="field-label">
        Volume unit
      </label>
      <select id={id} className="input w-28" value={value} onChange={(e) => onChange(e.target.value as VolumeUnit)} data-testid={testId}>
        {VOLUME_UNITS.map((u) => (
          <option key={u} value={u}>
            {VOLUME_LABEL[u]}
          </option>
        ))}
      </select>
    </div>
  );
}

/**
 * The ?unit= of the current URL (a per-page override) and a setter that replaces it; without one,
 * the volume unit of the user's display-unit setting for the largest volume the page shows.
 */
export function useUrlUnit(largestVolume?: number | null): [VolumeUnit, (u: VolumeUnit) => void] {
  const shown = useDisplayUnits(largestVolume);
  const params = useSearchParams();
  const router = useRouter();
  const pathname = usePathname();
  const raw = params.get("unit");
  const unit: VolumeUnit = isVolumeUnit(raw) ? raw : shown.volume;
  const set = (u: VolumeUnit) => {
    const next = new URLSearchParams(params.toString());
    next.set("unit", u);
    router.replace(`${pathname}?${next}`, { scroll: false });
  };
  return [unit, set];
}
