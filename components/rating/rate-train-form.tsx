"use client";

import { useQuery } from "@tanstack/react-query";
import { useState } from "react";
import { Cautions } from "@/components/cautions/cautions";
import { FormMessage } from "@/components/ui/field";
import { UnitOptions } from "@/components/ui/unit-options";
import { ApiError, fetchJson } from "@/lib/client/fetch-json";
import { toSI, type UnitKind } from "@/lib/units/display";
import { RatingResultView } from "./rating-result";
import type { TrainStageType } from "@/lib/engine";
import { STAGE_TYPE_NAME, TRAIN_STAGE_TYPES } from "@/lib/stage-types";
import type { InventoryList, RatingAnswer } from "@/lib/services/views";

/** `recycleRatio`: the recycle ratio typed for a tube with recycle (sent for that type only). */
type StageRow = { key: number; source: "new" | "inventory"; type: TrainStageType; volume: string; unit: string; vesselId: string; recycleRatio: string };

let next = 1;
const newRow = (type: TrainStageType = "CSTR"): StageRow => ({ key: next++, source: "new", type, volume: "", unit: "m3", vesselId: "", recycleRatio: "" });

/** The recycle ratio as sent: a number when it reads as one, else the text as typed (the server names what is wrong), nothing when blank. */
function recycleRatioOf(r: StageRow): { recycleRatio?: number | string } {
  if (r.type !== "PFR-recycle" || r.recycleRatio.trim() === "") return {};
  const n = Number(r.recycleRatio);
  return { recycleRatio: Number.isFinite(n) ? n : r.recycleRatio };
}

/**
 * Largest vessel the engine rates, m3 (its MAX_RATED_VESSEL; components may not import engine values).
 * Checked here too so a slip like 1e30 m3 is named at the field before anything is sent.
 */
const MAX_VESSEL_M3 = 1e9;

/** Rate a fixed train: stages by type and volume or from the inventory, a target, and the results with cautions. */
export function RateTrainForm({ projectId, versions }: { projectId: string; versions: { id: string; label: string; units?: Partial<Record<UnitKind, string>> }[] }) {
  const inventory = useQuery({ queryKey: ["inventory"], queryFn: () => fetchJson<InventoryList>("/api/inventory") });
  const [versionId, setVersionId] = useState(versions[0]?.id ?? "");
  const [rows, setRows] = useState<StageRow[]>([newRow()]);
  const [target, setTarget] = useState("0.9");
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [message, setMessage] = useState<string>();
  const [result, setResult] = useState<RatingAnswer>();
  const [busy, setBusy] = useState(false);
  const update = (key: number, patch: Partial<StageRow>) => setRows((rs) => rs.map((r) => (r.key === key ? { ...r, ...patch } : r)));

  async function submit(e: React.FormEvent) {
    e.preventDefault();
    setMessage(undefined);
    setBusy(true);
    const stages = rows.map((r) => {
      if (r.source === "inventory") return { inventoryVesselId: r.vesselId };
      const n = Number(r.volume);
      return { type: r.type, volume: r.volume.trim() !== "" && Number.isFinite(n) ? toSI("volume", n, r.unit) : r.volume, ...recycleRatioOf(r) };
    });
    const tooLarge = stages.flatMap((s, i) => ("volume" in s && typeof s.volume === "number" && s.volume > MAX_VESSEL_M3 ? [i] : []));
    if (tooLarge.length) {
      setResult(undefined);
      setErrors(Object.fromEntries(tooLarge.map((i) => [`stages.${i}.volume`, `Stage ${i + 1} volume: at most 1e9 m³ (1 km³); check the number and its unit.`])));
      setMessage("Nothing was rated: a vessel volume is beyond any plausible vessel.");
      setBusy(false);
      return;
    }
    try {
      const res = await fetchJson<{ rating: RatingAnswer }>(`/api/projects/${projectId}/rate`, {
        method: "POST",
        json: { kineticsVersionId: versionId, stages, target: target.trim() !== "" && Number.isFinite(Number(target)) ? Number(target) : target },
      });
      setErrors({});
      setResult(res.rating);
    } catch (err) {
      setResult(undefined);
      if (!(err instanceof ApiError)) return setMessage("Could not reach the server.");
      setErrors(Object.fromEntries(Object.entries(err.fields).map(([k, m]) => [k, m.join(" ")])));
      setMessage(err.message);
    } finally {
      setBusy(false);
    }
  }

  const err = (k: string) => (errors[k] ? <p className="field-error" id={`${k}-error`} role="alert">{errors[k]}</p> : null);
  const vessels = inventory.data?.vessels ?? [];

  return (
    <div className="space-y-5">
      <form className="card space-y-4 p-4" onSubmit={submit} noValidate aria-label="Rate a fixed train">
        <div className="flex flex-wrap gap-4">
          <div>
            <label htmlFor="r-version" className="field-label">
              Kinetics version
            </label>
            <select id="r-version" className="input w-auto" value={versionId} onChange={(e) => setVersionId(e.target.value)}>
              {versions.map((v) => (
                <option key={v.id} value={v.id}>
                  {v.label}
                </option>
              ))}
            </select>
            {err("kineticsVersionId")}
          </div>
          <div>
            <label htmlFor="r-target" className="field-label">
              Target conversion
            </label>
            <input id="r-target" className="input num w-24" inputMode="decimal" value={target} onChange={(e) => setTarget(e.target.value)} aria-invalid={!!errors.target} />
            {err("target")}
          </div>
        </div>
        <fieldset className="space-y-2">
          <legend className="field-label">Stages, in flow order</legend>
          {rows.map((r, i) => (
            <div key={r.key} className="flex flex-wrap items-end gap-2 rounded border border-line p-2" role="group" aria-label={`Stage ${i + 1}`} data-testid="rate-stage">
              <span className="num w-6 pb-2 font-medium">{i + 1}</span>
              <div>
                <label htmlFor={`r-src-${r.key}`} className="field-label">
                  Vessel
                </label>
                <select id={`r-src-${r.key}`} className="input w-auto" value={r.source} onChange={(e) => update(r.key, { source: e.target.value as StageRow["source"] })}>
                  <option value="new">By type and volume</option>
                  <option value="inventory">From the inventory</option>
                </select>
              </div>
              {r.source === "new" ? (
                <>
                  <div>
                    <label htmlFor={`r-type-${r.key}`} className="field-label">
                      Type
                    </label>
                    <select id={`r-type-${r.key}`} className="input w-auto" value={r.type} onChange={(e) => update(r.key, { type: e.target.value as StageRow["type"] })}>
                      {TRAIN_STAGE_TYPES.map((t) => (
                        <option key={t} value={t}>
                          {STAGE_TYPE_NAME[t]}
                        </option>
                      ))}
                    </select>
                  </div>
                  {r.type === "PFR-recycle" ? (
                    <div>
                      <label htmlFor={`r-recycle-${r.key}`} className="field-label">
                        Recycle ratio R
                      </label>
                      <input id={`r-recycle-${r.key}`} className="input num w-24" inputMode="decimal" value={r.recycleRatio} onChange={(e) => update(r.key, { recycleRatio: e.target.value })} aria-invalid={!!errors[`stages.${i}.recycleRatio`]} />
                    </div>
                  ) : null}
                  <div>
                    <label htmlFor={`r-volume-${r.key}`} className="field-label">
                      Volume
                    </label>
                    <input id={`r-volume-${r.key}`} className="input num w-24" inputMode="decimal" value={r.volume} onChange={(e) => update(r.key, { volume: e.target.value })} aria-invalid={!!errors[`stages.${i}.volume`]} />
                  </div>
                  <div>
                    <label htmlFor={`r-unit-${r.key}`} className="field-label">
                      Unit
                    </label>
                    <select id={`r-unit-${r.key}`} className="input w-auto" value={r.unit} onChange={(e) => update(r.key, { unit: e.target.value })}>
                      <UnitOptions kind="volume" />
                    </select>
                  </div>
                </>
              ) : (
                <div>
                  <label htmlFor={`r-vessel-${r.key}`} className="field-label">
                    Inventory vessel
                  </label>
                  <select id={`r-vessel-${r.key}`} className="input w-auto" value={r.vesselId} onChange={(e) => update(r.key, { vesselId: e.target.value })}>
                    <option value="">Choose…</option>
                    {vessels.map((v) => (
                      <option key={v.id} value={v.id}>
                        {v.tag} · {v.type} · {v.volume} m³{v.available ? "" : " (in use)"}
                      </option>
                    ))}
                  </select>
                </div>
              )}
              <button type="button" className="btn-quiet" onClick={() => setRows((rs) => rs.filter((x) => x.key !== r.key))} disabled={rows.length === 1} aria-label={`Remove stage ${i + 1}`}>
                Remove
              </button>
              <div className="w-full">{err(`stages.${i}.volume`) ?? err(`stages.${i}.recycleRatio`) ?? err(`stages.${i}.inventoryVesselId`) ?? err(`stages.${i}`)}</div>
            </div>
          ))}
          {err("stages")}
          <button type="button" className="btn-quiet" onClick={() => setRows((rs) => [...rs, newRow()])} disabled={rows.length >= 8}>
            Add a stage
          </button>
        </fieldset>
        {message ? <FormMessage kind="error">{message}</FormMessage> : null}
        <button type="submit" className="btn-primary" disabled={busy || !versionId}>
          Rate the train
        </button>
      </form>
      {result ? <RatingResultView result={result} typedUnits={versions.find((v) => v.id === result.kineticsVersion.id)?.units} /> : null}
      {!result ? <Cautions warnings={[]} /> : null}
    </div>
  );
}
