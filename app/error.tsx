"use client";
import { ErrorNotice, retryOf, type ErrorBoundaryProps } from "@/components/layout/error-notice";

/** Any page outside the route groups that failed (their own boundaries keep their headers). */
export default function RootError(props: ErrorBoundaryProps) {
  return (
    <main className="mx-auto max-w-6xl px-4 py-16 sm:px-6">
      <ErrorNotice error={props.error} onRetry={retryOf(props)} back={{ href: "/", label: "Go to Sagline's home page" }} />
    </main>
  );
}
