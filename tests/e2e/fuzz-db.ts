import pg from "pg";

/** The e2e database, for counting rows around refused requests. */
export function e2ePool(): pg.Pool {
  const url = process.env.DATABASE_URL;
  if (!url) throw new Error("DATABASE_URL is not set; run e2e tests through `npm test -- e2e`");
  return new pg.Pool({ connectionString: url, max: 2 });
}

/** Row count of every table in the public schema. */
export async function rowCounts(pool: pg.Pool): Promise<Map<string, number>> {
  const { rows: tables } = await pool.query<{ name: string }>(
    "select table_name as name from information_schema.tables where table_schema = 'public' and table_type = 'BASE TABLE' order by 1",
  );
  const sql = tables.map((t) => `select ${pg.escapeLiteral(t.name)} as name, count(*)::int as n from ${pg.escapeIdentifier(t.name)}`).join(" union all ");
  const { rows } = await pool.query<{ name: string; n: number }>(sql);
  return new Map(rows.map((r) => [r.name, r.n]));
}

/** Tables that hold more rows in `after` than in `before`, as "table +n". */
export function tablesGrown(before: Map<string, number>, after: Map<string, number>): string[] {
  return [...after].filter(([t, n]) => n > (before.get(t) ?? 0)).map(([t, n]) => `${t} +${n - (before.get(t) ?? 0)}`);
}

/**
 * Waits until the worker has nothing queued or running and the row counts hold still, so
 * counts taken around a request change only because of that request.
 */
export async function waitQuiet(pool: pg.Pool, timeoutMs = 120_000): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  let last = "";
  while (Date.now() < deadline) {
    const { rows } = await pool.query<{ n: number }>("select count(*)::int as n from pgboss.job where state in ('created', 'retry', 'active') and start_after <= now()");
    const counts = JSON.stringify([...(await rowCounts(pool))]);
    if (rows[0].n === 0 && counts === last) return;
    last = counts;
    await new Promise((r) => setTimeout(r, 500));
  }
  throw new Error(`the worker was still busy after ${timeoutMs / 1000} s`);
}

/** A real id of the team's records for each path parameter name the API uses. */
export async function teamIds(pool: pg.Pool, teamId: string, ownerEmail: string): Promise<Record<string, string>> {
  const one = async (sql: string) => (await pool.query<{ id: string }>(sql, [teamId])).rows[0]?.id;
  const ids: Record<string, string | undefined> = {
    modelId: await one("select id::text from kinetics_models where team_id = $1 order by created_at limit 1"),
    kineticsVersionId: await one("select v.id::text from kinetics_versions v join kinetics_models m on m.id = v.model_id where m.team_id = $1 order by v.created_at limit 1"),
    datasetId: await one("select id::text from rate_datasets where team_id = $1 limit 1"),
    versionId: await one("select v.id::text from rate_dataset_versions v join rate_datasets d on d.id = v.dataset_id where d.team_id = $1 limit 1"),
    sweepId: await one("select s.id::text from sweeps s where s.team_id = $1 and exists (select 1 from candidates c where c.sweep_id = s.id) limit 1"),
    candidateId: await one("select c.id::text from candidates c join sweeps s on s.id = c.sweep_id where s.team_id = $1 limit 1"),
    pinId: await one("select id::text from pinned_designs where team_id = $1 limit 1"),
    runId: await one("select id::text from robustness_runs where team_id = $1 limit 1"),
    vesselId: await one("select id::text from inventory_vessels where team_id = $1 limit 1"),
    inventoryVesselId: await one("select id::text from inventory_vessels where team_id = $1 limit 1"),
    tokenId: await one("select id::text from api_tokens where team_id = $1 limit 1"),
    invitationId: await one("select id::text from invitations where team_id = $1 limit 1"),
    teamId,
  };
  ids.userId = (await pool.query<{ id: string }>("select m.user_id as id from memberships m join users u on u.id = m.user_id where m.team_id = $1 and u.email <> $2 limit 1", [teamId, ownerEmail])).rows[0]?.id;
  return Object.fromEntries(Object.entries(ids).filter((e): e is [string, string] => typeof e[1] === "string"));
}
