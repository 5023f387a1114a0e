/**
 * The sweep page's server-side read: what the sweep page needs
 * for its first paint — the sweep, its scenarios and the first page of the ranked table the URL asks
 * for — read through the same services the API answers from, so the screen shows rows with the page
 * instead of after three round trips. Each answer goes through JSON as the API's does, so the client
 * cache holds the same shape whether it was seeded here or fetched.
 */
import type { Database } from "@/db/client";
import type { Actor } from "@/lib/authz/policy";
import { candidateQuerySchema } from "@/lib/schemas/sweeps";
import { listCandidates } from "@/lib/services/candidates";
import { getSweep, listScenarios } from "@/lib/services/sweeps";
import type { CandidatePage, Jsonify, ScenarioRow, SweepView } from "@/lib/services/views";
import { isNetworkSweep } from "@/components/sweeps/network-sweep";
import { candidateQuery, candidatesKey, chartsRideAlong, parseViewState, type FirstPage } from "@/components/sweeps/view-query";

const ACTIVE = new Set(["queued", "running"]);
const asJson = <T>(value: T): Jsonify<T> => JSON.parse(JSON.stringify(value)) as Jsonify<T>;

/**
 * Null when the sweep cannot be read (not found, another team): the client then asks the API and
 * shows the API's own message, as before. A failed scenario or page read only leaves that part
 * to the client.
 */
export async function loadFirstPage(db: Database, actor: Actor, sweepId: string, search: URLSearchParams): Promise<FirstPage | null> {
  const view = parseViewState(search);
  const sweep = await getSweep(db, actor, sweepId).catch(() => null);
  if (!sweep) return null;
  const shown = asJson(sweep) as SweepView;
  // A running sweep shows no table yet: the client polls and reads the results when it ends.
  if (ACTIVE.has(sweep.status) || sweep.done <= 0) return { sweep: shown };
  const network = isNetworkSweep(shown);
  const query = candidateQuerySchema.parse(Object.fromEntries(new URLSearchParams(candidateQuery(view, { levenspiel: chartsRideAlong(view, network) }))));
  const [scenarios, page] = await Promise.all([listScenarios(db, actor, sweepId).catch(() => undefined), listCandidates(db, actor, sweepId, view.scenario, query).catch(() => undefined)]);
  return {
    sweep: shown,
    ...(scenarios ? { scenarios: asJson(scenarios) as ScenarioRow[] } : {}),
    ...(page ? { candidates: { key: candidatesKey(sweepId, view, network), page: asJson(page) as CandidatePage } } : {}),
  };
}
