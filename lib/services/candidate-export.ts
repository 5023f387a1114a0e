import type { Database } from "@/db/client";
import type { Actor } from "@/lib/authz/policy";
import type { CandidateExportQuery } from "@/lib/schemas/report-exports";
import { listCandidates } from "./candidates";

const PAGE = 500;

/**
 * Every candidate of one scenario, in the ranked table's order and filters, read page by page
 * through listCandidates (so the same authorisation and team scoping apply).
 */
export async function exportCandidates(db: Database, actor: Actor, sweepId: string, scenarioIndex: number, q: Omit<CandidateExportQuery, "format">) {
  const first = await listCandidates(db, actor, sweepId, scenarioIndex, { ...q, page: 1, pageSize: PAGE });
  const items = [...first.items];
  for (let page = 2; items.length < first.total; page++) {
    const next = await listCandidates(db, actor, sweepId, scenarioIndex, { ...q, page, pageSize: PAGE });
    if (!next.items.length) break;
    items.push(...next.items);
  }
  return { scenario: first.scenario, total: first.total, items };
}
