"use client";

import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import Link from "next/link";
import { useState } from "react";
import { FormMessage } from "@/components/ui/field";
import { ApiError, fetchJson } from "@/lib/client/fetch-json";
import { projectCreateSchema } from "@/lib/schemas/projects";
import type { ProjectListItem } from "@/lib/services/views";
import { ProjectCreateForm } from "./project-create-form";
import { formatDay } from "@/lib/format/dates";

export type ProjectRow = ProjectListItem;


export function ProjectsPanel({ initial, canCreate }: { initial: ProjectRow[]; canCreate: boolean }) {
  const queryClient = useQueryClient();
  const [showArchived, setShowArchived] = useState(false);
  const key = ["projects", showArchived ? "all" : "active"];
  const { data } = useQuery({
    queryKey: key,
    queryFn: () => fetchJson<{ projects: ProjectRow[] }>(`/api/projects${showArchived ? "?archived=include" : ""}`).then((r) => r.projects),
    initialData: showArchived ? undefined : initial,
  });
  const refresh = () => queryClient.invalidateQueries({ queryKey: ["projects"] });
  const projects = data ?? [];

  return (
    <div className="space-y-4">
      {canCreate ? <ProjectCreateForm onCreated={refresh} /> : null}
      <div className="card overflow-hidden">
        <div className="flex items-center justify-between border-b border-line px-3 py-2">
          <h2>Projects</h2>
          <label className="flex items-center gap-2 text-sm text-ink-soft">
            <input type="checkbox" checked={showArchived} onChange={(e) => setShowArchived(e.target.checked)} /> Show archived
          </label>
        </div>
        {projects.length === 0 ? (
          <p className="px-3 py-6 text-center text-ink-soft">No projects yet{canCreate ? ": create the first one above." : "."}</p>
        ) : (
          <table className="table-dense" data-testid="projects-table">
            <thead>
              <tr>
                <th>Name</th>
                <th>Purpose</th>
                <th>Owner</th>
                <th>Updated</th>
                <th className="w-48" />
              </tr>
            </thead>
            <tbody>
              {projects.map((p) => (
                <ProjectRowView key={p.id} project={p} onChanged={refresh} />
              ))}
            </tbody>
          </table>
        )}
      </div>
    </div>
  );
}

function ProjectRowView({ project, onChanged }: { project: ProjectRow; onChanged: () => void }) {
  const [editing, setEditing] = useState(false);
  const [name, setName] = useState(project.name);
  const [error, setError] = useState<string>();
  const mutation = useMutation({
    mutationFn: (body: { name?: string; archived?: boolean }) => fetchJson(`/api/projects/${project.id}`, { method: "PATCH", json: body }),
    onSuccess: () => {
      setEditing(false);
      setError(undefined);
      onChanged();
    },
    onError: (err) => setError(err instanceof ApiError ? (err.fields?.name?.join(" ") ?? err.message) : "Could not save."),
  });

  function saveName() {
    const parsed = projectCreateSchema.shape.name.safeParse(name);
    if (!parsed.success) return setError(parsed.error.issues[0]?.message);
    mutation.mutate({ name: parsed.data });
  }

  const archived = project.archivedAt !== null;
  return (
    <tr className={archived ? "text-ink-faint" : undefined}>
      <td>
        {editing ? (
          <div>
            <input
              aria-label="Project name"
              className="input"
              value={name}
              aria-invalid={!!error}
              onChange={(e) => setName(e.target.value)}
              onKeyDown={(e) => e.key === "Enter" && saveName()}
              autoFocus
            />
            {error ? <p className="field-error">{error}</p> : null}
          </div>
        ) : (
          <Link href={`/projects/${project.id}`} className="font-medium text-accent-700 hover:underline">
            {project.name}
          </Link>
        )}
        {archived ? <span className="badge ml-2 border-line">archived</span> : null}
      </td>
      <td className="text-ink-soft">{project.description}</td>
      <td>{project.createdByName}</td>
      <td className="tabular-nums">{formatDay(project.updatedAt)}</td>
      <td className="text-right">
        <div className="flex justify-end gap-2">
          {project.permissions.update && !archived ? (
            editing ? (
              <>
                <button type="button" className="btn-primary py-1" onClick={saveName} disabled={mutation.isPending}>
                  Save
                </button>
                <button type="button" className="btn-quiet py-1" onClick={() => (setEditing(false), setName(project.name), setError(undefined))}>
                  Cancel
                </button>
              </>
            ) : (
              <button type="button" className="btn-quiet py-1" onClick={() => setEditing(true)}>
                Rename
              </button>
            )
          ) : null}
          {project.permissions.archive && !editing ? (
            <button type="button" className="btn-quiet py-1" onClick={() => mutation.mutate({ archived: !archived })} disabled={mutation.isPending}>
              {archived ? "Restore" : "Archive"}
            </button>
          ) : null}
        </div>
        {error && !editing ? <FormMessage kind="error">{error}</FormMessage> : null}
      </td>
    </tr>
  );
}
