"use client";

import { usePathname, useRouter, useSearchParams } from "next/navigation";
import { useCallback, useMemo } from "react";
import { parseViewState, serialiseViewState, type SweepViewState } from "./view-query";

// Re-exported by name: a client module's exports must be listed, not star-exported.
export { candidateQuery, candidatesKey, chartsRideAlong, NETWORK_COLUMNS, OPTIONAL_COLUMNS, PAGE_SIZES, parseViewState, serialiseViewState, SINGLE_COLUMNS } from "./view-query";
export type { OptionalColumn, SweepViewState } from "./view-query";

/** The view state held in the URL, and a setter that replaces the URL (no new history entry per click). */
export function useViewState() {
  const params = useSearchParams();
  const router = useRouter();
  const pathname = usePathname();
  const state = useMemo(() => parseViewState(new URLSearchParams(params.toString())), [params]);
  const update = useCallback(
    (patch: Partial<SweepViewState>) => {
      // Any change but paging itself starts again at page 1.
      const next = { ...state, ...("page" in patch ? {} : { page: 1 }), ...patch };
      const qs = serialiseViewState(next);
      router.replace(qs ? `${pathname}?${qs}` : pathname, { scroll: false });
    },
    [state, router, pathname],
  );
  return [state, update] as const;
}
