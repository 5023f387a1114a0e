"use client";

import { useState } from "react";
import { ApiError, fetchJson } from "@/lib/client/fetch-json";
import { useHydrated } from "@/components/ui/use-hydrated";
import { useSetDisplayPreference } from "@/components/layout/display-units-context";
import { DISPLAY_PREFERENCE_LABEL, DISPLAY_PREFERENCES, type DisplayPreference } from "@/lib/units/display-preference";

/** The one place a user chooses the units results are shown in. */
export function DisplayUnitsForm({ current }: { current: DisplayPreference }) {
  const setShared = useSetDisplayPreference();
  const hydrated = useHydrated();
  const [choice, setChoice] = useState<DisplayPreference>(current);
  const [saved, setSaved] = useState<DisplayPreference>(current);
  const [status, setStatus] = useState<"idle" | "saving" | "saved" | "error">("idle");
  const [error, setError] = useState("");

  async function save(e: React.FormEvent) {
    e.preventDefault();
    setStatus("saving");
    setError("");
    try {
      const r = await fetchJson<{ displayUnits: DisplayPreference }>("/api/me/display-units", { method: "PUT", json: { displayUnits: choice } });
      setSaved(r.displayUnits);
      setStatus("saved");
      // Client screens follow at once; server-rendered pages read the saved choice on their next load.
      setShared(r.displayUnits);
    } catch (err) {
      setStatus("error");
      setError(err instanceof ApiError ? err.message : "The choice was not saved; try again.");
    }
  }

  return (
    <form className="card space-y-3 p-4" onSubmit={(e) => void save(e)}>
      <fieldset>
        <legend className="font-medium">Show results in</legend>
        <p className="text-sm text-ink-soft">
          Ranked tables, candidate pages, charts, the design report, its PDF and the exports use these units. Values are stored unchanged; only how they are shown
          changes. Volumes read in litres (or US gallons) while the largest volume on the page is below 1 m³.
        </p>
        <div className="mt-2 space-y-1">
          {DISPLAY_PREFERENCES.map((p) => (
            <label key={p} className="flex items-center gap-2 text-sm">
              <input type="radio" name="displayUnits" value={p} checked={choice === p} onChange={() => setChoice(p)} />
              {DISPLAY_PREFERENCE_LABEL[p]}
            </label>
          ))}
        </div>
      </fieldset>
      <div className="flex items-center gap-3">
        <button type="submit" className="btn-primary" disabled={!hydrated || status === "saving" || choice === saved}>
          Save units
        </button>
        <p role="status" className="text-sm text-ink-soft" data-testid="display-units-status">
          {status === "saved" ? `Saved: results now show in ${DISPLAY_PREFERENCE_LABEL[saved]}.` : status === "saving" ? "Saving…" : ""}
        </p>
      </div>
      {status === "error" ? (
        <p role="alert" className="field-error">
          {error}
        </p>
      ) : null}
    </form>
  );
}
