/**
 * The two ideal stage types as a run-time list, for zod enums, selects and loops over both.
 * The type itself is the engine's (StageType); this module has no dependencies so screens,
 * schemas and the seed can all take the list from here instead of spelling it again.
 */
import type { StageType } from "@/lib/engine";

/** In the order screens list them. tests/unit/sweeps/shared-lists.test.ts checks it covers StageType. */
export const STAGE_TYPES = ["CSTR", "PFR"] as const satisfies readonly StageType[];
