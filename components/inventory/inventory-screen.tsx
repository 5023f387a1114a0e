"use client";

import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { useState } from "react";
import { ConfirmDialog } from "@/components/ui/confirm-dialog";
import { FormMessage } from "@/components/ui/field";
import { ApiError, fetchJson } from "@/lib/client/fetch-json";
import { InventoryUpload } from "./inventory-upload";
import { VesselForm } from "./vessel-form";
import { formatNumber, TABLE_NUMBERS } from "@/lib/format/numbers";
import type { InventoryList, InventoryVesselView as Vessel } from "@/lib/services/views";

/** The team's idle vessels: list, add, mark in use or available, remove, and import from a file. */
export function InventoryScreen() {
  const client = useQueryClient();
  const q = useQuery({ queryKey: ["inventory"], queryFn: () => fetchJson<InventoryList>("/api/inventory") });
  const [error, setError] = useState<string>();
  // One notice for the whole screen, so "Added R-402." never outlives R-402 being removed.
  const [notice, setNotice] = useState<string>();
  const [removing, setRemoving] = useState<Vessel>();
  const refresh = () => client.invalidateQueries({ queryKey: ["inventory"] });
  const change = useMutation({
    mutationFn: (a: { id: string; tag: string; body?: Partial<Vessel>; remove?: boolean }) =>
      a.remove ? fetchJson(`/api/inventory/${a.id}`, { method: "DELETE" }) : fetchJson(`/api/inventory/${a.id}`, { method: "PATCH", json: a.body }),
    onSuccess: (_r, a) => {
      setError(undefined);
      setNotice(a.remove ? `Removed ${a.tag}.` : `${a.tag} marked ${a.body?.available ? "available" : "in use"}.`);
      setRemoving(undefined);
      return refresh();
    },
    onError: (e) => {
      setRemoving(undefined);
      setNotice(undefined);
      setError(e instanceof ApiError ? e.message : "Could not reach the server.");
    },
  });

  if (q.isPending) return <p className="text-ink-soft">Loading the inventory…</p>;
  if (q.isError) return <FormMessage kind="error">Could not load the inventory.</FormMessage>;
  const { vessels, permissions } = q.data;
  return (
    <div className="space-y-5">
      <section className="card overflow-hidden" aria-labelledby="inv-title">
        <h2 id="inv-title" className="border-b border-line px-3 py-2">
          {/* The count in the title is of idle vessels only; the ones in use are named apart. */}
          Idle vessels{" "}
          <span className="text-sm font-normal text-ink-soft" data-testid="inventory-count">
            ({vessels.filter((v) => v.available).length}
            {vessels.some((v) => !v.available) ? `; ${vessels.filter((v) => !v.available).length} more in use` : ""})
          </span>
        </h2>
        {vessels.length === 0 ? (
          <p className="px-3 py-4 text-ink-soft">No vessels yet.</p>
        ) : (
          <div className="overflow-x-auto" tabIndex={0} role="region" aria-label="Idle vessels table">
            <table className="table-dense" data-testid="inventory-table">
              <caption className="sr-only">The team&apos;s idle vessels</caption>
              <thead>
                <tr>
                  <th scope="col">Tag</th>
                  <th scope="col">Type</th>
                  <th scope="col">Volume, m³</th>
                  <th scope="col">Status</th>
                  <th scope="col">Reuse cost</th>
                  <th scope="col">Location</th>
                  {permissions.manage ? <th scope="col">Actions</th> : null}
                </tr>
              </thead>
              <tbody>
                {vessels.map((v) => (
                  <tr key={v.id} data-testid="inventory-row">
                    <td className="font-medium">{v.tag}</td>
                    <td>{v.type}</td>
                    <td className="num">{formatNumber(v.volume, 4, TABLE_NUMBERS)}</td>
                    <td>{v.available ? <span className="badge border-accent-200 bg-accent-50 text-accent-800">✓ available</span> : <span className="badge border-line">in use</span>}</td>
                    <td className="num">{formatNumber(v.reuseCost, 4, TABLE_NUMBERS)}</td>
                    <td>{v.location || <span className="text-ink-soft">—</span>}</td>
                    {permissions.manage ? (
                      <td className="whitespace-nowrap">
                        <button type="button" className="btn-quiet py-0.5" onClick={() => change.mutate({ id: v.id, tag: v.tag, body: { available: !v.available } })} aria-label={`Mark ${v.tag} ${v.available ? "in use" : "available"}`}>
                          {v.available ? "Mark in use" : "Mark available"}
                        </button>{" "}
                        <button type="button" className="btn-danger py-0.5" onClick={() => setRemoving(v)} aria-label={`Remove ${v.tag}`}>
                          Remove
                        </button>
                      </td>
                    ) : null}
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        )}
        {notice ? (
          <div className="p-3" data-testid="inventory-notice">
            <FormMessage kind="info">{notice}</FormMessage>
          </div>
        ) : null}
        {error ? (
          <div className="p-3">
            <FormMessage kind="error">{error}</FormMessage>
          </div>
        ) : null}
      </section>
      {permissions.manage ? (
        <div className="grid gap-5 lg:grid-cols-2">
          <VesselForm
            onSaved={(tag) => {
              setNotice(`Added ${tag}.`);
              return refresh();
            }}
          />
          <InventoryUpload onImported={refresh} />
        </div>
      ) : (
        <p className="text-sm text-ink-soft">Your role reads the inventory but does not change it.</p>
      )}
      <ConfirmDialog
        open={!!removing}
        title={`Remove ${removing?.tag ?? "this vessel"}?`}
        confirmLabel="Remove vessel"
        busy={change.isPending}
        onConfirm={() => removing && change.mutate({ id: removing.id, tag: removing.tag, remove: true })}
        onCancel={() => setRemoving(undefined)}
      >
        {removing ? `${removing.tag} (${removing.type}, ${formatNumber(removing.volume, 4, TABLE_NUMBERS)} m³) leaves the idle-vessel inventory and is no longer offered for reuse in sweeps.` : null}
      </ConfirmDialog>
    </div>
  );
}
