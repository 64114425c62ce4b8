"use client";
import Link from "next/link";
import { useEffect, useRef, useState } from "react";
import { Notice } from "@/components/ui/notice";
import { apiFetch } from "@/lib/queries/fetcher";

type State = { kind: "working" } | { kind: "done"; email: string } | { kind: "failed"; message: string };

/** Confirms the address as soon as the e-mailed link is opened (the token works once). */
export function VerifyEmail({ token }: { token: string }) {
  const [state, setState] = useState<State>({ kind: "working" });
  // a second effect run (development's strict mode) must not spend the token twice
  const sent = useRef(false);
  useEffect(() => {
    if (sent.current) return;
    sent.current = true;
    apiFetch<{ email: string }>("/api/account/verify", { method: "POST", json: { token } })
      .then((res) => setState({ kind: "done", email: res.email }))
      .catch((e: unknown) => setState({ kind: "failed", message: e instanceof Error ? e.message : String(e) }));
  }, [token]);

  if (state.kind === "working") return <p className="text-ink-soft">Confirming your e-mail address…</p>;
  if (state.kind === "failed") {
    return (
      <Notice tone="error" title="The address could not be confirmed">
        {state.message}. If your account is not confirmed yet,{" "}
        <Link href="/forgot-password">choose a new password</Link>: that link confirms the address too.
      </Notice>
    );
  }
  return (
    <div className="space-y-4">
      <Notice tone="success" title="Your e-mail address is confirmed">
        {state.email} can now sign in to Sagline.
      </Notice>
      <Link href="/signin" className="block text-center font-medium">
        Sign in
      </Link>
    </div>
  );
}
