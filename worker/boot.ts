import PgBoss from "pg-boss";
import { registerSystemPing } from "./jobs/system-ping";

/** Starts pg-boss on the given database and registers every queue handler. */
export async function startWorker(databaseUrl: string, log: (msg: string, extra?: unknown) => void = console.log): Promise<PgBoss> {
  const boss = new PgBoss({ connectionString: databaseUrl, application_name: "seriatim-worker" });
  boss.on("error", (err) => log("pg-boss error", err));
  await boss.start();
  await registerSystemPing(boss);
  return boss;
}
