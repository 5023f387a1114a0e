import { getDb } from "@/db/client";
import { pingDatabase } from "@/lib/services/health";

export const dynamic = "force-dynamic";

/** How long the check may wait for the database before calling it unreachable. */
const CHECK_MS = 3_000;

/** 200 once the app reaches its database; 503 (promptly) while it does not, e.g. during a restart. */
export async function GET() {
  let timer: NodeJS.Timeout | undefined;
  const timeout = new Promise<never>((_, reject) => {
    timer = setTimeout(() => reject(new Error("database check timed out")), CHECK_MS);
  });
  try {
    await Promise.race([pingDatabase(getDb()), timeout]);
    return Response.json({ status: "ok", database: "reachable" });
  } catch {
    return Response.json({ status: "degraded", database: "unreachable" }, { status: 503 });
  } finally {
    clearTimeout(timer);
  }
}
