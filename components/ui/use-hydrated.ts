"use client";

import { useSyncExternalStore } from "react";

const subscribe = () => () => {};

/**
 * False in the server's HTML and until React has taken the page over in the browser, then true.
 * Buttons whose work is done in the browser stay disabled until then: a click before that
 * would do nothing, and a form would be sent the browser's own way (a password in the address).
 */
export function useHydrated(): boolean {
  return useSyncExternalStore(
    subscribe,
    () => true,
    () => false,
  );
}
