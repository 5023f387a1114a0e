import Link from "next/link";
import { formatDateTime } from "@/lib/format/dates";
import type { DatasetListItem } from "@/lib/services/views";

/** One dataset of the project, with its latest version, as the project page gives it. */
export type DatasetRow = DatasetListItem;


/** The "Rate data" section of a project page: its measured-rate datasets and the way to upload one. */
export function DatasetsPanel({ projectId, datasets, canUpload }: { projectId: string; datasets: DatasetRow[]; canUpload: boolean }) {
  return (
    <section className="card overflow-hidden" aria-labelledby="datasets-title">
      <div className="flex items-center justify-between border-b border-line px-3 py-2">
        <h2 id="datasets-title">Rate data</h2>
        {canUpload ? (
          <Link href={`/projects/${projectId}/datasets/new`} className="btn-primary py-1">
            Upload rate data
          </Link>
        ) : null}
      </div>
      {datasets.length === 0 ? (
        <p className="px-3 py-6 text-center text-ink-soft">No measured rates yet{canUpload ? ": upload a CSV or XLSX file from the bench." : "."}</p>
      ) : (
        <table className="table-dense" data-testid="datasets-table">
          <thead>
            <tr>
              <th scope="col">Dataset</th>
              <th scope="col">Latest</th>
              <th scope="col">Rows</th>
              <th scope="col">Uploaded (UTC)</th>
            </tr>
          </thead>
          <tbody>
            {datasets.map((d) => (
              <tr key={d.id}>
                <td className="font-medium">
                  <Link href={`/projects/${projectId}/datasets/${d.id}`} className="hover:underline">
                    {d.name}
                  </Link>
                </td>
                <td className="num">v{d.latestVersion?.version ?? "—"}</td>
                <td className="num">{d.latestVersion?.rowCount ?? "—"}</td>
                <td className="num whitespace-nowrap">{formatDateTime(d.latestVersion?.createdAt)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
    </section>
  );
}
