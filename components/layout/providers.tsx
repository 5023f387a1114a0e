"use client";

import { QueryClient, QueryClientProvider } from "@tanstack/react-query";
import { useState } from "react";
import { z } from "zod";

// The page's Content-Security-Policy forbids eval; without this, zod probes `new Function` once
// (a reported CSP violation, though it then falls back) before its first parse in the browser.
z.config({ jitless: true });

export function Providers({ children }: { children: React.ReactNode }) {
  const [client] = useState(() => new QueryClient({ defaultOptions: { queries: { staleTime: 15_000, retry: 1 } } }));
  return <QueryClientProvider client={client}>{children}</QueryClientProvider>;
}
