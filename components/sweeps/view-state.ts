"use client";

import { usePathname, useSearchParams } from "next/navigation";
import { useCallback, useMemo } from "react";
import { parseViewState, serialiseViewState, type SweepViewState } from "./view-query";

// Re-exported by name: a client module's exports must be listed, not star-exported.
export { candidateQuery, candidatesKey, chartsRideAlong, NETWORK_COLUMNS, OPTIONAL_COLUMNS, PAGE_SIZES, parseViewState, serialiseViewState, SINGLE_COLUMNS } from "./view-query";
export type { OptionalColumn, SweepViewState } from "./view-query";

/** The view state held in the URL, and a setter that replaces the URL (no new history entry per click). */
export function useViewState() {
  const params = useSearchParams();
  const pathname = usePathname();
  const state = useMemo(() => parseViewState(new URLSearchParams(params.toString())), [params]);
  const update = useCallback(
    (patch: Partial<SweepViewState>) => {
      // Any change but paging itself starts again at page 1.
      const next = { ...state, ...("page" in patch ? {} : { page: 1 }), ...patch };
      const qs = serialiseViewState(next);
      // The browser's own history call, which Next.js folds into useSearchParams: the URL changes
      // without asking the server to render the page again, so a sort or a page change waits for
      // one request (its rows), not for a server render and then the rows. Its state must be null:
      // Next.js copies its own history state over, and skips the update for a state it made itself.
      window.history.replaceState(null, "", qs ? `${pathname}?${qs}` : pathname);
    },
    [state, pathname],
  );
  return [state, update] as const;
}
