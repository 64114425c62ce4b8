"use client";
import { ErrorNotice, retryOf, type ErrorBoundaryProps } from "@/components/layout/error-notice";

/** A workspace page that failed, under the workspace header. */
export default function WorkspaceError(props: ErrorBoundaryProps) {
  return <ErrorNotice error={props.error} onRetry={retryOf(props)} />;
}
