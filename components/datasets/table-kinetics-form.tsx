"use client";

import { useMutation } from "@tanstack/react-query";
import Link from "next/link";
import { useId, useState } from "react";
import { Field, FormMessage } from "@/components/ui/field";
import { UnitOptions } from "@/components/ui/unit-options";
import { ApiError, fetchJson } from "@/lib/client/fetch-json";
import type { TableKineticsInput } from "@/lib/schemas/datasets";
import { fromSI, toSI } from "@/lib/units/display";
import { formatNumber } from "@/lib/format/numbers";

interface Props {
  projectId: string;
  versionId: string;
  defaultName: string;
  /** SI, mol/m3. */
  feedConcA: number | null;
  /** Distinct temperatures of the rows, K. */
  temperatures: number[];
  models: { id: string; name: string }[];
}

/** Creates kinetics whose rate law is this version's measured table, for a feed the user gives. */
export function TableKineticsForm({ projectId, versionId, defaultName, feedConcA, temperatures, models }: Props) {
  const ids = useId();
  const [target, setTarget] = useState<"new" | "version">("new");
  const [modelName, setModelName] = useState(defaultName);
  const [modelId, setModelId] = useState(models[0]?.id ?? "");
  const [flow, setFlow] = useState("0.02");
  const [flowUnit, setFlowUnit] = useState("mol/s");
  const [conc, setConc] = useState(feedConcA ? formatNumber(fromSI("concentration", feedConcA, "mol/L"), 6) : "");
  const [concUnit, setConcUnit] = useState("mol/L");
  const [temperature, setTemperature] = useState(temperatures.length ? String(temperatures[0]) : "");

  const create = useMutation({
    mutationFn: () => {
      const body: TableKineticsInput = {
        ...(target === "new" ? { modelName } : { modelId }),
        feed: {
          flowA: toSI("molarFlow", Number(flow), flowUnit),
          concA: toSI("concentration", Number(conc), concUnit),
          ...(temperature ? { temperature: Number(temperature) } : {}),
        },
      };
      return fetchJson<{ model: { id: string; name: string }; version: { version: number } }>(`/api/dataset-versions/${versionId}/table-kinetics`, { method: "POST", json: body });
    },
  });
  const err = create.error instanceof ApiError ? create.error : null;
  const fieldError = (...keys: string[]) => keys.flatMap((k) => err?.fields[k] ?? []).join(" ") || undefined;

  return (
    <form
      aria-label="Use as measured rate table"
      className="space-y-3"
      onSubmit={(e) => {
        e.preventDefault();
        create.mutate();
      }}
    >
      <fieldset className="flex flex-wrap gap-4 text-sm">
        <legend className="field-label">Kinetics to create</legend>
        <label className="flex items-center gap-1.5">
          <input type="radio" name={`${ids}-target`} checked={target === "new"} onChange={() => setTarget("new")} /> A new kinetics model
        </label>
        {models.length ? (
          <label className="flex items-center gap-1.5">
            <input type="radio" name={`${ids}-target`} checked={target === "version"} onChange={() => setTarget("version")} /> A new version of an existing model
          </label>
        ) : null}
      </fieldset>
      <div className="grid gap-3 sm:grid-cols-2">
        {target === "new" ? (
          <Field id={`${ids}-name`} label="Model name" error={fieldError("modelName")}>
            <input id={`${ids}-name`} className="input" value={modelName} onChange={(e) => setModelName(e.target.value)} required minLength={2} maxLength={120} />
          </Field>
        ) : (
          <Field id={`${ids}-model`} label="Model" error={fieldError("modelId")}>
            <select id={`${ids}-model`} className="input" value={modelId} onChange={(e) => setModelId(e.target.value)}>
              {models.map((m) => (
                <option key={m.id} value={m.id}>
                  {m.name}
                </option>
              ))}
            </select>
          </Field>
        )}
        <Field id={`${ids}-flow`} label="Feed flow of A, FA0" error={fieldError("feed.flowA")}>
          <div className="flex gap-2">
            <input id={`${ids}-flow`} className="input num min-w-0 flex-1" inputMode="decimal" value={flow} onChange={(e) => setFlow(e.target.value)} required />
            <select aria-label="Feed flow of A, FA0 unit" className="input w-auto" value={flowUnit} onChange={(e) => setFlowUnit(e.target.value)}>
              <UnitOptions kind="molarFlow" />
            </select>
          </div>
        </Field>
        <Field id={`${ids}-conc`} label="Feed concentration of A, CA0" error={fieldError("feed.concA")}>
          <div className="flex gap-2">
            <input id={`${ids}-conc`} className="input num min-w-0 flex-1" inputMode="decimal" value={conc} onChange={(e) => setConc(e.target.value)} required />
            <select aria-label="Feed concentration of A, CA0 unit" className="input w-auto" value={concUnit} onChange={(e) => setConcUnit(e.target.value)}>
              <UnitOptions kind="concentration" />
            </select>
          </div>
        </Field>
        {temperatures.length ? (
          <Field id={`${ids}-t`} label="Rows at (feed temperature)" error={fieldError("feed.temperature")}>
            <select id={`${ids}-t`} className="input" value={temperature} onChange={(e) => setTemperature(e.target.value)}>
              {temperatures.map((t) => (
                <option key={t} value={String(t)}>
                  {formatNumber(t - 273.15, 5)} °C ({formatNumber(t, 5)} K)
                </option>
              ))}
            </select>
            <p className="mt-1 text-xs text-ink-soft">A rate table holds at the temperature it was measured at.</p>
          </Field>
        ) : null}
      </div>
      <p className="text-xs text-ink-soft">Liquid phase, isothermal. The table is interpolated between its points and never extrapolated beyond its highest conversion.</p>
      {err && !Object.keys(err.fields).some((k) => ["modelName", "modelId", "feed.flowA", "feed.concA", "feed.temperature"].includes(k)) ? <FormMessage kind="error">{err.message}</FormMessage> : null}
      {create.data ? (
        <FormMessage kind="info">
          Created{" "}
          <Link className="font-medium underline" href={`/projects/${projectId}/kinetics/${create.data.model.id}`}>
            {create.data.model.name} v{create.data.version.version}
          </Link>
          , a kinetics model on this measured table.
        </FormMessage>
      ) : null}
      <button type="submit" className="btn-primary" disabled={create.isPending}>
        Create kinetics from this table
      </button>
    </form>
  );
}
