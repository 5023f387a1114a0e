"use client";

import { useEffect, useRef, useState } from "react";
import { useFormContext, useWatch } from "react-hook-form";
import { ErrorText, messageAt } from "@/components/kinetics/quantity-field";
import { fetchJson } from "@/lib/client/fetch-json";
import type { BuilderValues } from "./builder-form-state";
import type { CostBasisAnswer } from "@/lib/services/views";
import { STAGE_TYPES } from "@/lib/stage-types";

interface CostsAnswer {
  costs: CostBasisAnswer;
}

/** Cost-objective extras of the sweep builder: prefill from the project's cost basis, installation factor, reuse of idle vessels. */
export function CostBasisOptions({ projectId }: { projectId: string }) {
  const { register, setValue, formState, control } = useFormContext<BuilderValues>();
  const reuse = useWatch({ control, name: "reuseInventory" });
  const [status, setStatus] = useState<string>();
  const err = (p: string) => messageAt(formState.errors, p);

  const fillFromProjectBasis = async () => {
    setStatus("Loading the project's cost basis…");
    try {
      const { costs } = await fetchJson<CostsAnswer>(`/api/projects/${projectId}/costs`);
      const opts = { shouldValidate: true, shouldDirty: true };
      for (const t of STAGE_TYPES) {
        const c = costs.basis.vessels[t];
        setValue(`vessel${t}`, { a: String(c.a), b: String(c.b), n: String(c.n) }, opts);
      }
      setValue("sizeUnit", "m3", opts);
      setValue("standardSizes", costs.standardSizes ? costs.standardSizes.join(", ") : "", opts);
      const max = (costs.basis as { maxVesselVolume?: number | null }).maxVesselVolume;
      setValue("maxVessel", max === null || max === undefined ? "" : String(max), opts);
      setValue("installationFactor", String(costs.basis.installationFactor.value), opts);
      setStatus(`Filled from the project's cost basis (${costs.basis.currency}, ${costs.basis.basisYear}${costs.isDefault ? ", defaults: not yet saved for this project" : ""}).`);
    } catch {
      setStatus("Could not read the project's cost basis.");
    }
  };

  // The cost objective starts from the project's own cost basis, never from made-up numbers: fill it
  // once when the options first show, unless the engineer has already typed vessel costs.
  const filled = useRef(false);
  const typed = formState.dirtyFields.vesselCSTR || formState.dirtyFields.vesselPFR;
  useEffect(() => {
    if (filled.current || typed) return;
    filled.current = true;
    void fillFromProjectBasis();
    // eslint-disable-next-line react-hooks/exhaustive-deps -- once, on first show
  }, []);

  return (
    <div className="space-y-3 rounded border border-line p-3">
      <div className="flex flex-wrap items-center gap-3">
        <button type="button" className="btn-quiet" onClick={fillFromProjectBasis} data-testid="use-project-costs">
          Use the project&apos;s cost basis
        </button>
        <p className="text-xs text-ink-soft" role="status">
          {status}
        </p>
      </div>
      <div className="flex flex-wrap items-start gap-4">
        <div>
          <label htmlFor="s-installationFactor" className="field-label">
            Installation factor (installed = purchase × factor)
          </label>
          <input id="s-installationFactor" className="input num w-24" inputMode="decimal" autoComplete="off" aria-invalid={!!err("installationFactor")} {...register("installationFactor")} />
          <ErrorText id="s-installationFactor" message={err("installationFactor")} />
        </div>
        <label className="mt-6 flex items-center gap-1.5 text-sm">
          <input type="checkbox" {...register("reuseInventory")} aria-describedby="s-reuse-hint" /> Reuse idle vessels from the inventory
        </label>
      </div>
      {reuse ? (
        <p id="s-reuse-hint" className="text-xs text-ink-soft">
          The team&apos;s available vessels are copied into the sweep when you submit; each feasible train is equipped at least installed cost from them and new vessels.
        </p>
      ) : null}
    </div>
  );
}
