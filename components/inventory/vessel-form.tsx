"use client";

import { useState } from "react";
import { Field, FormMessage } from "@/components/ui/field";
import { UnitOptions } from "@/components/ui/unit-options";
import { ApiError, fetchJson } from "@/lib/client/fetch-json";
import { toSI } from "@/lib/units/display";

const EMPTY = { tag: "", type: "CSTR", volume: "", unit: "m3", reuseCost: "0", location: "" };

/** Adds one idle vessel; the volume is sent in m3 whatever unit it was typed in. */
export function VesselForm({ onSaved }: { onSaved: (tag: string) => void }) {
  const [f, setF] = useState(EMPTY);
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [message, setMessage] = useState<{ kind: "error" | "info"; text: string }>();
  const set = (k: keyof typeof EMPTY) => (e: { target: { value: string } }) => setF((x) => ({ ...x, [k]: e.target.value }));
  const num = (s: string) => (s.trim() !== "" && Number.isFinite(Number(s)) ? Number(s) : s);

  async function submit(e: React.FormEvent) {
    e.preventDefault();
    setMessage(undefined);
    const volume = num(f.volume);
    try {
      await fetchJson("/api/inventory", {
        method: "POST",
        json: { tag: f.tag, type: f.type, volume: typeof volume === "number" ? toSI("volume", volume, f.unit) : volume, reuseCost: num(f.reuseCost), location: f.location },
      });
      setErrors({});
      setF(EMPTY);
      // The screen announces "Added …" beside the table, where later removals are announced too.
      onSaved(f.tag);
    } catch (err) {
      if (!(err instanceof ApiError)) return setMessage({ kind: "error", text: "Could not reach the server; nothing was saved." });
      setErrors(Object.fromEntries(Object.entries(err.fields).map(([k, m]) => [k, m.join(" ")])));
      setMessage({ kind: "error", text: err.message });
    }
  }

  return (
    <form className="card space-y-3 p-4" onSubmit={submit} noValidate aria-labelledby="add-vessel-title">
      <h2 id="add-vessel-title">Add a vessel</h2>
      <div className="flex flex-wrap gap-3">
        <Field id="v-tag" label="Tag" error={errors.tag}>
          <input id="v-tag" className="input w-32" value={f.tag} onChange={set("tag")} aria-invalid={!!errors.tag} />
        </Field>
        <Field id="v-type" label="Type" error={errors.type}>
          <select id="v-type" className="input w-auto" value={f.type} onChange={set("type")}>
            <option value="CSTR">CSTR (stirred tank)</option>
            <option value="PFR">PFR (tube)</option>
          </select>
        </Field>
        <Field id="v-volume" label="Volume" error={errors.volume}>
          <input id="v-volume" className="input num w-24" inputMode="decimal" value={f.volume} onChange={set("volume")} aria-invalid={!!errors.volume} />
        </Field>
        <Field id="v-unit" label="Unit">
          <select id="v-unit" className="input w-auto" value={f.unit} onChange={set("unit")}>
            <UnitOptions kind="volume" />
          </select>
        </Field>
        <Field id="v-reuseCost" label="Reuse cost (moving, inspection, re-piping)" error={errors.reuseCost}>
          <input id="v-reuseCost" className="input num w-28" inputMode="decimal" value={f.reuseCost} onChange={set("reuseCost")} aria-invalid={!!errors.reuseCost} />
        </Field>
        <Field id="v-location" label="Location" error={errors.location}>
          <input id="v-location" className="input w-40" value={f.location} onChange={set("location")} />
        </Field>
      </div>
      {message ? <FormMessage kind={message.kind}>{message.text}</FormMessage> : null}
      <button type="submit" className="btn-primary">
        Add vessel
      </button>
    </form>
  );
}
