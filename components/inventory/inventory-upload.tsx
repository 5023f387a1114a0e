"use client";

import { useState } from "react";
import { FormMessage } from "@/components/ui/field";
import { ApiError } from "@/lib/client/fetch-json";
import { formatNumber, TABLE_NUMBERS } from "@/lib/format/numbers";

interface Preview {
  vessels: { row: number; tag: string; type: string; volume: number; available: boolean; reuseCost: number; location: string }[];
  problems: { row: number; field: string; message: string }[];
  updates: string[];
  accepted: boolean;
  created: number;
  updated: number;
}

async function send(file: File, accept: boolean): Promise<Preview> {
  const body = new FormData();
  body.set("file", file);
  body.set("accept", String(accept));
  const res = await fetch("/api/inventory/import", { method: "POST", body });
  const json = await res.json().catch(() => null);
  if (!res.ok) throw new ApiError(res.status, json?.error?.code ?? "internal", json?.error?.message ?? `Request failed (${res.status})`, json?.error?.fields);
  return json.import as Preview;
}

/** Upload of a CSV or XLSX of vessels: a preview with every row's problems, then accept. */
export function InventoryUpload({ onImported }: { onImported: () => void }) {
  const [file, setFile] = useState<File | null>(null);
  const [preview, setPreview] = useState<Preview>();
  const [message, setMessage] = useState<{ kind: "error" | "info"; text: string }>();

  async function run(accept: boolean) {
    if (!file) return setMessage({ kind: "error", text: "Choose a file first." });
    setMessage(undefined);
    try {
      const r = await send(file, accept);
      if (accept) {
        setPreview(undefined);
        setFile(null);
        setMessage({ kind: "info", text: `Imported: ${r.created} added, ${r.updated} updated.` });
        onImported();
      } else setPreview(r);
    } catch (e) {
      setMessage({ kind: "error", text: e instanceof ApiError ? e.message : "Could not reach the server; nothing was imported." });
    }
  }

  return (
    <section className="card space-y-3 p-4" aria-labelledby="upload-title">
      <h2 id="upload-title">Import from a file</h2>
      <p className="text-sm text-ink-soft">
        A CSV or XLSX with a header row: <code>tag, type, volume, unit, available, reuse cost, location</code>. Type is CSTR or PFR; unit m3, L, gal or ft3 (or written with the volume); available yes or no.
        A tag already in the inventory is updated.
      </p>
      <div>
        <label htmlFor="inv-file" className="field-label">
          Inventory file
        </label>
        <input
          id="inv-file"
          type="file"
          accept=".csv,.xlsx"
          className="text-sm"
          onChange={(e) => {
            setFile(e.target.files?.[0] ?? null);
            setPreview(undefined);
          }}
        />
      </div>
      <button type="button" className="btn-quiet" onClick={() => run(false)} disabled={!file}>
        Preview
      </button>
      {preview ? (
        <div className="space-y-2" data-testid="import-preview">
          <p className="text-sm">
            {preview.vessels.length} vessel{preview.vessels.length === 1 ? "" : "s"} read{preview.updates.length ? `, ${preview.updates.length} of them already in the inventory (updated on import)` : ""};{" "}
            {preview.problems.length} problem{preview.problems.length === 1 ? "" : "s"}.
          </p>
          {preview.problems.length ? (
            <table className="table-dense" data-testid="import-problems">
              <caption className="text-left text-sm font-medium">Rows to fix before importing</caption>
              <thead>
                <tr>
                  <th scope="col">Row</th>
                  <th scope="col">Column</th>
                  <th scope="col">Problem</th>
                </tr>
              </thead>
              <tbody>
                {preview.problems.map((p, i) => (
                  <tr key={i}>
                    <td className="num">{p.row}</td>
                    <td>{p.field}</td>
                    <td>{p.message}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          ) : (
            <>
              <ul className="text-sm">
                {preview.vessels.map((v) => (
                  <li key={v.row}>
                    {v.tag}: {v.type}, <span className="num">{formatNumber(v.volume, 4, TABLE_NUMBERS)}</span> m³{v.available ? "" : " (in use)"}
                  </li>
                ))}
              </ul>
              <button type="button" className="btn-primary" onClick={() => run(true)}>
                Accept and import
              </button>
            </>
          )}
        </div>
      ) : null}
      {message ? <FormMessage kind={message.kind}>{message.text}</FormMessage> : null}
    </section>
  );
}
