import { createHash } from "node:crypto";
import { and, eq } from "drizzle-orm";
import type { Database } from "@/db/client";
import { scenarios, sweeps, type SweepStatus } from "@/db/schema";
import { assertCan, type Actor } from "@/lib/authz/policy";
import { notFound } from "@/lib/errors";
import type { CandidateQuery } from "@/lib/schemas/sweeps";
import { listCandidates } from "./candidates";

/**
 * The candidates endpoint's read path with its caches. A sweep whose status is final (succeeded,
 * failed, cancelled) never changes again: the worker writes results only inside a transaction that
 * locks the sweep row and refuses once the sweep is no longer queued or running
 * (lib/services/sweep-chunks.ts), and sweeps are never deleted by the app. So for such a sweep
 *   - its team and final state are kept in process (no query to find them again),
 *   - each answer gets a strong ETag from what determines it (sweep, scenario, final state and
 *     time, the normalised query, the answer's format) and is kept in a small LRU by that tag,
 *   - a request naming the tag in If-None-Match gets 304 with no body.
 * The access check runs before any of it on every request (the caller's actor, read fresh, must be
 * of the sweep's team and may read sweeps), so a tag or a cached body never reaches anyone else.
 * A running sweep's scenario that is already stored (succeeded or failed) is final too, and is served
 * the same way: the worker moves a scenario out of "pending" exactly once, in the transaction that
 * writes its candidates (costing and robustness figures included, computed before the insert), only
 * while the sweep is active, and nothing updates a scenario or its candidates afterwards; cancelling
 * leaves stored scenarios as they are and a re-run is a new sweep. Its answer carries nothing about
 * the sweep's progress (only the scenario's own status, reference and rows), so it is immutable.
 * A running sweep's scenario not yet stored is read from the database each time and marked no-store.
 * The actor is deliberately not cached: it is one query (session row or token, with membership),
 * and reading it fresh keeps a sign-out, a removal or a revoked token effective at once in every
 * web process. With the answers kept, a repeat costs that one query and no other.
 */

/** Bumped whenever the answer's shape changes, so a browser's copy from an older build is not reused. */
const FORMAT = "c1";
/**
 * A final answer (a finished sweep's, or a stored scenario's of a running sweep) is immutable; a day
 * is long enough to matter and short enough to bound a format change.
 */
export const FINAL_CACHE_CONTROL = "private, max-age=86400, immutable";
export const RUNNING_CACHE_CONTROL = "no-store";

const FINAL: ReadonlySet<SweepStatus> = new Set(["succeeded", "failed", "cancelled"]);

interface SweepState {
  teamId: string;
  status: SweepStatus;
  finishedAt: Date | null;
}

/** Final sweeps' team and state; small records, a few thousand at most. */
const finalSweeps = new Map<string, SweepState>();
const MAX_FINAL_SWEEPS = 5000;

/**
 * Sweeps seen queued or running, for a second: a repeat within it skips the state query. Safe
 * because believing a sweep still runs only means answering from the database, uncached (correct,
 * merely not yet cacheable); the team, which the access check compares, never changes.
 */
const activeSweeps = new Map<string, { state: SweepState; until: number }>();
const ACTIVE_STATE_MS = 1_000;

async function sweepState(db: Database, sweepId: string): Promise<SweepState | null> {
  const known = finalSweeps.get(sweepId);
  if (known) return known;
  const active = activeSweeps.get(sweepId);
  if (active && active.until > Date.now()) return active.state;
  const [row] = await db.select({ teamId: sweeps.teamId, status: sweeps.status, finishedAt: sweeps.finishedAt }).from(sweeps).where(eq(sweeps.id, sweepId));
  if (!row) return null;
  if (FINAL.has(row.status)) {
    activeSweeps.delete(sweepId);
    if (finalSweeps.size >= MAX_FINAL_SWEEPS) finalSweeps.delete(finalSweeps.keys().next().value!);
    finalSweeps.set(sweepId, row);
  } else {
    if (activeSweeps.size >= MAX_FINAL_SWEEPS) activeSweeps.clear();
    activeSweeps.set(sweepId, { state: row, until: Date.now() + ACTIVE_STATE_MS });
  }
  return row;
}

/**
 * Scenarios of running sweeps seen stored, with the time they were computed. Once stored a scenario
 * never changes, so the entry never goes stale; only the bound evicts (oldest first).
 */
const storedScenarios = new Map<string, Date>();
const MAX_STORED_SCENARIOS = 50_000;

/**
 * When the scenario was stored, or null while it is pending (or does not exist). Read before the
 * page, never alongside it: the page's own read then starts after the commit that stored the rows,
 * so it cannot miss them, and an answer is only ever kept when it was read after that commit.
 */
async function storedAt(db: Database, sweepId: string, index: number): Promise<Date | null> {
  const key = `${sweepId}/${index}`;
  const known = storedScenarios.get(key);
  if (known) return known;
  const [row] = await db.select({ status: scenarios.status, computedAt: scenarios.computedAt }).from(scenarios).where(and(eq(scenarios.sweepId, sweepId), eq(scenarios.index, index)));
  if (!row || row.status === "pending" || !row.computedAt) return null;
  if (storedScenarios.size >= MAX_STORED_SCENARIOS) storedScenarios.delete(storedScenarios.keys().next().value!);
  storedScenarios.set(key, row.computedAt);
  return row.computedAt;
}

/** Least recently used answers of final scenarios, bounded by their total size. */
class AnswerCache {
  private readonly entries = new Map<string, string>();
  private bytes = 0;
  constructor(private readonly maxBytes: number) {}

  get(key: string): string | undefined {
    const v = this.entries.get(key);
    if (v !== undefined) {
      this.entries.delete(key);
      this.entries.set(key, v);
    }
    return v;
  }

  set(key: string, body: string): void {
    // An answer bigger than an eighth of the cache (a page of 500 with plot points) is not kept.
    if (body.length > this.maxBytes / 8 || this.entries.has(key)) return;
    this.entries.set(key, body);
    this.bytes += body.length;
    for (const [k, v] of this.entries) {
      if (this.bytes <= this.maxBytes) break;
      this.entries.delete(k);
      this.bytes -= v.length;
    }
  }
}

const answers = new AnswerCache(Number(process.env.CANDIDATE_CACHE_MB ?? 32) * 1024 * 1024);

/** The query in one fixed order with its defaults filled in, so equal questions give equal tags. */
function normalisedQuery(q: CandidateQuery): string {
  return [q.sort, q.dir, q.feasible ?? "", q.contains ?? "", q.stages ?? "", q.page, q.pageSize, q.include ?? ""].join("|");
}

function etagOf(sweepId: string, index: number, state: SweepState, q: CandidateQuery): string {
  return tagOf([FORMAT, sweepId, index, state.status, state.finishedAt?.toISOString() ?? "", normalisedQuery(q)]);
}

/** A stored scenario of a running sweep: its tag names the scenario's own computation, not the sweep's state. */
function storedEtagOf(sweepId: string, index: number, computedAt: Date, q: CandidateQuery): string {
  return tagOf([FORMAT, sweepId, index, "stored", computedAt.toISOString(), normalisedQuery(q)]);
}

function tagOf(basis: (string | number)[]): string {
  return `"${FORMAT}-${createHash("sha256").update(basis.join("\n")).digest("base64url").slice(0, 32)}"`;
}

/**
 * If-None-Match holds this tag (weak comparison, as the header's rules ask). `*` is not honoured:
 * it would answer 304 for a scenario number that does not exist; such a request gets the full answer.
 */
export function matchesTag(ifNoneMatch: string | null, etag: string): boolean {
  if (!ifNoneMatch) return false;
  return ifNoneMatch.split(",").some((t) => t.trim().replace(/^W\//, "") === etag);
}

export type CandidatesAnswer =
  | { status: 304; etag: string; cacheControl: string }
  | { status: 200; body: string; etag: string | null; cacheControl: string };

/**
 * One scenario's ranked candidates as the endpoint answers them. The refusals are listCandidates':
 * 403 for a role that may not read sweeps, 404 for a sweep of another team or a missing scenario.
 */
export async function readCandidates(db: Database, actor: Actor, sweepId: string, index: number, q: CandidateQuery, ifNoneMatch: string | null): Promise<CandidatesAnswer> {
  assertCan(actor, "sweep.read");
  // The sweep's state is read before, never alongside, the page: a page read while the last chunk
  // commits could miss its rows, and with a state read after that commit it would be kept as final.
  const state = await sweepState(db, sweepId);
  // Another team's sweep is "no such scenario", as listCandidates says it, before any tag is compared.
  if (!state || state.teamId !== actor.teamId) throw notFound("scenario");
  let etag: string;
  if (FINAL.has(state.status)) etag = etagOf(sweepId, index, state, q);
  else {
    const stored = await storedAt(db, sweepId, index);
    if (!stored) return { status: 200, body: JSON.stringify(await listCandidates(db, actor, sweepId, index, q)), etag: null, cacheControl: RUNNING_CACHE_CONTROL };
    etag = storedEtagOf(sweepId, index, stored, q);
  }
  if (matchesTag(ifNoneMatch, etag)) return { status: 304, etag, cacheControl: FINAL_CACHE_CONTROL };
  let body = answers.get(etag);
  if (body === undefined) {
    body = JSON.stringify(await listCandidates(db, actor, sweepId, index, q));
    answers.set(etag, body);
  }
  return { status: 200, body, etag, cacheControl: FINAL_CACHE_CONTROL };
}
