"use client";
import { ErrorNotice, retryOf, type ErrorBoundaryProps } from "@/components/layout/error-notice";

/** A public page that failed, under the public header. */
export default function PublicError(props: ErrorBoundaryProps) {
  return (
    <main className="mx-auto max-w-6xl px-4 py-8 sm:px-6">
      <ErrorNotice error={props.error} onRetry={retryOf(props)} back={{ href: "/published", label: "Go to the published plans" }} />
    </main>
  );
}
