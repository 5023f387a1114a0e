"use client";

import { useMutation } from "@tanstack/react-query";
import { useState, type FormEvent } from "react";
import { Cautions } from "@/components/cautions/cautions";
import { CAUTIONS } from "@/lib/engine";
import { ErrorText } from "@/components/kinetics/quantity-field";
import { FormMessage } from "@/components/ui/field";
import { ApiError, fetchJson } from "@/lib/client/fetch-json";
import { FIT_LAW_INFO, FIT_LAWS, type FitLaw, type FitResponse, type LawFitOut } from "@/lib/schemas/fits";
import { FitComparison } from "./fit-comparison";
import { rangePhrases } from "./fit-format";
import { FitPlots } from "./fit-plots";
import { SaveFitForm } from "./save-fit-form";

interface Props {
  projectId: string;
  versionId: string;
  /** Columns the stored rows hold. */
  columns: string[];
  storedFeedConcA: number | null;
  models: { id: string; name: string }[];
  canSave: boolean;
}

/** Choose rate laws, fit them to the dataset version, compare, inspect, and save one as kinetics. */
export function FitWorkbench({ projectId, versionId, columns, storedFeedConcA, models, canSave }: Props) {
  const conversionOnly = !columns.includes("concA");
  const [laws, setLaws] = useState<FitLaw[]>(columns.includes("temperature") ? ["power", "power-arrhenius"] : ["power", "saturation"]);
  const [feedText, setFeedText] = useState(storedFeedConcA ? String(storedFeedConcA / 1000) : "");
  const [fieldErrors, setFieldErrors] = useState<Record<string, string>>({});
  const [shown, setShown] = useState<string | null>(null);

  const fit = useMutation({
    mutationFn: (body: { laws: FitLaw[]; feedConcA?: number }) => fetchJson<FitResponse>(`/api/dataset-versions/${versionId}/fits`, { method: "POST", json: body }),
    onSuccess: (res) => {
      const best = res.fits.filter((f): f is Extract<LawFitOut, { ok: true }> => f.ok).sort((a, b) => (a.aic ?? -Infinity) - (b.aic ?? -Infinity))[0];
      setShown(best?.law ?? null);
    },
    onError: (e) => {
      if (e instanceof ApiError) setFieldErrors(Object.fromEntries(Object.entries(e.fields).map(([k, v]) => [k, v.join(" ")])));
    },
  });

  const onFit = (e: FormEvent) => {
    e.preventDefault();
    const errors: Record<string, string> = {};
    if (!laws.length) errors.laws = "Choose at least one rate law";
    let feedConcA: number | undefined;
    if (feedText.trim() !== "") {
      const n = Number(feedText.trim());
      if (!(Number.isFinite(n) && n > 0)) errors.feedConcA = "Feed concentration must be a number above 0 (mol/L)";
      else feedConcA = n * 1000;
    } else if (conversionOnly) errors.feedConcA = "The rows hold conversion only: give C_A0 so C_A = C_A0·(1 − X) can be formed";
    setFieldErrors(errors);
    if (Object.keys(errors).length) return;
    fit.mutate({ laws, ...(feedConcA ? { feedConcA } : {}) });
  };

  const res = fit.data;
  const shownFit = res?.fits.find((f): f is Extract<LawFitOut, { ok: true }> => f.ok && f.law === shown);
  const meanT = res?.range.temperature ? (res.range.temperature[0] + res.range.temperature[1]) / 2 : 298.15;

  return (
    <div className="space-y-4">
      <form onSubmit={onFit} noValidate className="card space-y-3 p-4" aria-labelledby="fit-form-title">
        <h2 id="fit-form-title">Rate laws to fit</h2>
        <fieldset aria-describedby={fieldErrors.laws ? "f-laws-error" : undefined}>
          <legend className="sr-only">Rate laws</legend>
          <ul className="grid gap-2 sm:grid-cols-2">
            {FIT_LAWS.map((law) => (
              <li key={law}>
                <label className="flex items-start gap-2 rounded border border-line p-2 text-sm">
                  <input
                    type="checkbox"
                    className="mt-1"
                    checked={laws.includes(law)}
                    onChange={(e) => setLaws((cur) => (e.target.checked ? [...cur, law] : cur.filter((l) => l !== law)))}
                  />
                  <span>
                    <span className="font-medium">{FIT_LAW_INFO[law].label}</span>
                    <span className="block font-mono text-xs text-ink-soft">{FIT_LAW_INFO[law].formula}</span>
                  </span>
                </label>
              </li>
            ))}
          </ul>
          <ErrorText id="f-laws" message={fieldErrors.laws} />
        </fieldset>
        <div className="max-w-xs">
          <label htmlFor="f-feedConcA" className="field-label">
            Feed concentration C_A0, mol/L {conversionOnly ? null : <span className="ml-1 normal-case tracking-normal text-ink-soft">(optional)</span>}
          </label>
          <input
            id="f-feedConcA"
            className="input num"
            inputMode="decimal"
            value={feedText}
            onChange={(e) => setFeedText(e.target.value)}
            aria-invalid={!!fieldErrors.feedConcA}
            aria-describedby={fieldErrors.feedConcA ? "f-feedConcA-error" : "f-feedConcA-hint"}
          />
          {!fieldErrors.feedConcA ? (
            <p id="f-feedConcA-hint" className="mt-1 text-xs text-ink-soft">
              {conversionOnly
                ? "Needed: the rows hold conversion, and C_A = C_A0·(1 − X) (liquid phase)."
                : "Used for the product concentration of the reversible law when there is no C_R column: C_R = C_A0·X."}
            </p>
          ) : null}
          <ErrorText id="f-feedConcA" message={fieldErrors.feedConcA} />
        </div>
        {fit.error && !(fit.error instanceof ApiError && Object.keys(fit.error.fields).length) ? (
          <FormMessage kind="error">{fit.error instanceof ApiError ? fit.error.message : "Could not reach the server."}</FormMessage>
        ) : null}
        <button type="submit" className="btn-primary" disabled={fit.isPending}>
          {fit.isPending ? "Fitting…" : "Fit"}
        </button>
      </form>

      {res ? (
        <>
          <section className="card space-y-1 p-4 text-sm" aria-labelledby="fit-range-title" data-testid="fit-range">
            <h2 id="fit-range-title">Valid only inside the measured range</h2>
            <p>
              The fitted laws describe these {res.range.points} points: {rangePhrases(res.range).join("; ")}. A reactor that runs outside this range
              extrapolates the law.
            </p>
            {res.assumptions.length ? (
              <ul className="list-disc pl-5 text-ink-soft" aria-label="Assumptions">
                {res.assumptions.map((a) => (
                  <li key={a}>{a}</li>
                ))}
              </ul>
            ) : null}
          </section>
          <FitComparison fits={res.fits} selected={shown} onSelect={setShown} criterion={res.criterion} />
          {shownFit ? <FitPlots key={shownFit.law} fit={shownFit} /> : null}
          {shownFit && canSave ? (
            <SaveFitForm
              key={`save-${shownFit.law}`}
              projectId={projectId}
              versionId={versionId}
              law={shownFit.law}
              feedConcA={res.feedConcA}
              defaultTemperature={meanT}
              models={models}
            />
          ) : null}
          <Cautions warnings={[]} />
          <ul className="list-disc pl-5 text-xs text-ink-soft" aria-label="Cautions on fitted laws">
            {/* The general cautions are in the box above; here only what is particular to a fit. */}
            {res.cautions.filter((c) => !CAUTIONS.includes(c)).map((c) => (
              <li key={c}>{c}</li>
            ))}
          </ul>
        </>
      ) : null}
    </div>
  );
}
