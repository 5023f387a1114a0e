/**
 * Stops what an `npm start` of this checkout left running when its orchestrator died
 * without its orderly stop. Run by scripts/bootstrap.mjs; `npm start` does the same first.
 */
import path from "node:path";
import { fileURLToPath } from "node:url";
import { stopStaleServices } from "./lib/run-file";

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "..");
await stopStaleServices(root, (m) => console.log(`› ${m}`));
