"use client";
import { QueryClient, QueryClientProvider } from "@tanstack/react-query";
import { useState, type ReactNode } from "react";
import { z } from "zod";
import { ApiError } from "@/lib/queries/fetcher";

// In the browser zod would probe for eval, which the Content-Security-Policy forbids
// (a reported violation); its plain parsers are fast enough for forms.
if (typeof window !== "undefined") z.config({ jitless: true });

export function Providers({ children }: { children: ReactNode }) {
  const [client] = useState(
    () =>
      new QueryClient({
        defaultOptions: {
          queries: {
            staleTime: 30_000,
            // 4xx answers will not change on retry.
            retry: (count, error) => !(error instanceof ApiError && error.status < 500) && count < 2,
          },
        },
      }),
  );
  return <QueryClientProvider client={client}>{children}</QueryClientProvider>;
}
