import { runMigrations } from "../../db/migrate";

/**
 * Migrates the template database once; each test file then clones it
 * (CREATE DATABASE … TEMPLATE), so files never share rows.
 */
export default async function setup(): Promise<void> {
  const url = process.env.DATABASE_URL;
  if (!url || !process.env.TEST_PG_SERVER_URL) {
    throw new Error("Integration tests need DATABASE_URL (template database) and TEST_PG_SERVER_URL; run them through `npm test`.");
  }
  await runMigrations(url);
}
