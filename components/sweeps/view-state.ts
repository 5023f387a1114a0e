"use client";

import { usePathname, useSearchParams } from "next/navigation";
import { useCallback, useMemo } from "react";
import { applyViewPatch, parseViewState, serialiseViewState, type SweepViewState } from "./view-query";

// Re-exported by name: a client module's exports must be listed, not star-exported.
export { applyViewPatch, candidateQuery, candidatesKey, chartsRideAlong, NETWORK_COLUMNS, OPTIONAL_COLUMNS, PAGE_SIZES, parseViewState, serialiseViewState, SINGLE_COLUMNS } from "./view-query";
export type { OptionalColumn, SweepViewState } from "./view-query";

/**
 * The view state held in the URL, and a setter that replaces the URL (no new history entry per click).
 * The setter keeps its identity across changes (it reads the URL as it is when called), so the parts
 * of the page handed it do not redraw on every sort or page change.
 */
export function useViewState() {
  const params = useSearchParams();
  const pathname = usePathname();
  const state = useMemo(() => parseViewState(new URLSearchParams(params.toString())), [params]);
  const update = useCallback(
    (patch: Partial<SweepViewState>): SweepViewState => {
      const next = applyViewPatch(parseViewState(new URLSearchParams(window.location.search)), patch);
      const qs = serialiseViewState(next);
      // The browser's own history call, which Next.js folds into useSearchParams: the URL changes
      // without asking the server to render the page again, so a sort or a page change waits for
      // one request (its rows), not for a server render and then the rows. Its state must be null:
      // Next.js copies its own history state over, and skips the update for a state it made itself.
      window.history.replaceState(null, "", qs ? `${pathname}?${qs}` : pathname);
      return next;
    },
    [pathname],
  );
  return [state, update] as const;
}
