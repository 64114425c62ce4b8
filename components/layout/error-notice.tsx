"use client";
import Link from "next/link";
import { Button } from "@/components/ui/button";

/** The reference Next gives an error thrown on the server (it matches the server's log line); nothing else of the error is shown. */
export function errorReference(error: unknown): string | null {
  if (error && typeof error === "object" && "digest" in error && typeof error.digest === "string" && error.digest) return error.digest;
  return null;
}

/**
 * What a reader sees when a page fails: a plain sentence, a button that tries the page
 * again, a way back, and the error's reference to quote when reporting it. Never the
 * error's message or stack: a server error's text may hold details meant for the log.
 */
export function ErrorNotice({
  error,
  onRetry,
  title = "This page could not be shown",
  back = { href: "/basins", label: "Go to your basins" },
}: {
  error: unknown;
  onRetry: () => void;
  title?: string;
  back?: { href: string; label: string };
}) {
  const reference = errorReference(error);
  return (
    <section className="card mx-auto max-w-xl space-y-3" role="alert" data-testid="error-notice">
      <h2>{title}</h2>
      <p className="text-sm text-ink-soft">
        Something went wrong on our side while preparing it. Trying again often helps; if it keeps happening, tell the
        site&apos;s administrator{reference ? " and quote the reference below" : ""}.
      </p>
      {reference && (
        <p className="text-sm text-ink-soft">
          Reference: <code className="break-all rounded bg-paper-sunk px-1.5 py-0.5 text-ink" data-testid="error-reference">{reference}</code>
        </p>
      )}
      <div className="flex flex-wrap items-center gap-4 pt-1">
        <Button onClick={onRetry}>Try again</Button>
        <Link href={back.href} className="text-sm">
          {back.label}
        </Link>
      </div>
    </section>
  );
}

/** The props Next passes an error.tsx: `retry` re-fetches the segment from the server, `reset` only re-renders it. */
export interface ErrorBoundaryProps {
  error: unknown;
  retry?: () => void;
  reset?: () => void;
}

/** Try the segment again: fetched afresh from the server when Next offers it, else re-rendered. */
export function retryOf({ retry, reset }: ErrorBoundaryProps): () => void {
  return () => (retry ?? reset)?.();
}
