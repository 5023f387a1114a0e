import { getDb } from "@/db/client";
import { databaseReachable } from "@/lib/services/health";

export const dynamic = "force-dynamic";

/** How long the check may wait for the database before calling it unreachable. */
const CHECK_MS = 3_000;

/** 200 once the app reaches its database; 503 (promptly) while it does not, e.g. during a restart. */
export async function GET() {
  let reachable = false;
  try {
    reachable = await databaseReachable(getDb(), CHECK_MS);
  } catch {
    // No handle at all (configuration missing): as unreachable as a stopped server.
  }
  if (reachable) return Response.json({ status: "ok", database: "reachable" });
  return Response.json({ status: "degraded", database: "unreachable" }, { status: 503 });
}
