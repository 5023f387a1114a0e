/**
 * The candidate page's server-side read: the candidate (title, stages, Levenspiel plot data) and its
 * sweep (target, thermal mode), read through the same services the API answers from, so the page
 * arrives with its content instead of fetching it after it loads. Each answer goes through JSON as
 * the API's does, so the client cache holds the same shape whether it was seeded here or fetched.
 */
import type { Database } from "@/db/client";
import type { Actor } from "@/lib/authz/policy";
import { getCandidate } from "@/lib/services/candidate-detail";
import { getSweep } from "@/lib/services/sweeps";
import type { CandidateAnswer, Jsonify, SweepView } from "@/lib/services/views";
import type { CandidateInitial } from "@/components/candidates/candidate-view";

const asJson = <T>(value: T): Jsonify<T> => JSON.parse(JSON.stringify(value)) as Jsonify<T>;

/**
 * Null when the candidate cannot be read (not found, another team, a role that may not read
 * sweeps): the client then asks the API and shows the API's own message, exactly as before.
 */
export async function loadCandidateFirstPaint(db: Database, actor: Actor, sweepId: string, candidateId: string): Promise<CandidateInitial | null> {
  // Both at once: the sweep named in the URL is nearly always the candidate's own.
  const [candidate, sweep] = await Promise.all([getCandidate(db, actor, candidateId).catch(() => null), getSweep(db, actor, sweepId).catch(() => null)]);
  if (!candidate) return null;
  const shown = asJson(candidate) as CandidateAnswer;
  // The sweep only when it is the candidate's own: the client's sweep query is keyed by that id.
  return { candidate: shown, ...(sweep && sweep.id === candidate.sweep.id ? { sweep: asJson(sweep) as SweepView } : {}) };
}
