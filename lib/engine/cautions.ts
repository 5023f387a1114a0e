/** Shown with every result: what the idealised models leave out. */
export const CAUTIONS: readonly string[] = [
  "Ideal stages only: perfect mixing in each CSTR, plug flow without dispersion in each PFR, one reaction, steady state.",
  "Rates, heats of reaction and physical properties are taken as given; the results are only as good as they are.",
  "Heat removal, thermal runaway, start-up and pressure relief need separate studies.",
  "Sizing here is preliminary: follow local codes and have a licensed engineer review any design before it is built.",
];
