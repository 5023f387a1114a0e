import { z } from "zod";

/*
 * Runs in the browser before any of the app's own modules. The pages' Content-Security-Policy
 * forbids eval, and zod probes `new Function` when it first builds an object schema unless it is
 * told not to: the probe is caught, but the browser still reports a policy violation. Schemas are
 * built as modules load (lib/schemas, form state), in whatever order the chunks arrive, so the
 * setting must come before all of them.
 */
z.config({ jitless: true });
