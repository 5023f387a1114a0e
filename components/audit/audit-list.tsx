import { formatDateTime } from "@/lib/format/dates";
import type { AuditEntryView } from "@/lib/services/views";

/** One entry of the audit trail, as the audit endpoint and the project page give it. */
export type AuditRow = AuditEntryView;


function summarise(details: Record<string, unknown>): string {
  return Object.entries(details)
    .map(([k, v]) => `${k}: ${typeof v === "object" ? JSON.stringify(v) : String(v)}`)
    .join(" · ");
}

export function AuditList({ entries }: { entries: AuditRow[] }) {
  if (entries.length === 0) return <p className="px-3 py-4 text-ink-soft">Nothing recorded yet.</p>;
  return (
    <table className="table-dense" data-testid="audit-table">
      <thead>
        <tr>
          <th>When (UTC)</th>
          <th>Who</th>
          <th>What</th>
          <th>Details</th>
        </tr>
      </thead>
      <tbody>
        {entries.map((e) => (
          <tr key={e.id}>
            <td className="num whitespace-nowrap">{formatDateTime(e.at)}</td>
            <td>{e.actorName ?? e.actorEmail ?? "—"}</td>
            <td className="font-mono text-xs">{e.action}</td>
            <td className="text-ink-soft">{summarise(e.details)}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
