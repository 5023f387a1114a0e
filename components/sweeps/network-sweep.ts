/**
 * What the sweep screens need to tell of a sweep of several reactions: that it is one, and what it
 * ranks by. The sweep answer gains `kind` and, for a network, a spec with `objective` and
 * `constraints` (the engine's NetworkDesignSpec); read loosely so either kind of answer fits.
 */
import type { NetworkConstraints, NetworkObjective } from "@/lib/engine";

interface MaybeNetworkSweep {
  kind?: string;
  spec?: unknown;
}

/** True for a sweep of a model of several reactions. */
export function isNetworkSweep(sweep: MaybeNetworkSweep | null | undefined): boolean {
  if (!sweep) return false;
  if (sweep.kind) return sweep.kind === "network";
  const spec = sweep.spec as { reactions?: unknown; reaction?: unknown } | null | undefined;
  return !!spec && Array.isArray(spec.reactions) && spec.reaction === undefined;
}

/** The network sweep's objective (null for a one-reaction sweep or before it loads). */
export function networkObjectiveOf(sweep: MaybeNetworkSweep | null | undefined): NetworkObjective | null {
  if (!isNetworkSweep(sweep)) return null;
  const o = (sweep!.spec as { objective?: NetworkObjective } | undefined)?.objective;
  return o && ("maximise" in o || "minimise" in o) ? o : null;
}

/** The network sweep's limits (empty when none were set). */
export function networkConstraintsOf(sweep: MaybeNetworkSweep | null | undefined): NetworkConstraints {
  if (!isNetworkSweep(sweep)) return {};
  return (sweep!.spec as { constraints?: NetworkConstraints } | undefined)?.constraints ?? {};
}
