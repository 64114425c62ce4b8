"use client";
import { useQuery } from "@tanstack/react-query";
import { apiFetch } from "./fetcher";
import { queryKeys } from "./keys";

export type SignedIn = { signedIn: true; name: string } | { signedIn: false };

/** Who is signed in (GET /api/me/session), for pages that are the same for every reader. */
export function useSignedIn() {
  return useQuery({ queryKey: queryKeys.signedIn(), queryFn: () => apiFetch<SignedIn>("/api/me/session", { cache: "no-store" }) });
}
