/**
 * The database schema, one file per subject; everything that queries imports it from here.
 * drizzle.config.ts reads this folder; a change becomes a migration with `npm run db:generate`.
 */
export * from "./identity";
export * from "./teams";
export * from "./projects";
export * from "./audit";
export * from "./datasets";
export * from "./kinetics";
export * from "./sweeps";
export * from "./pins";
export * from "./costs";
export * from "./robustness";
