"use client";
import { ErrorNotice, retryOf, type ErrorBoundaryProps } from "@/components/layout/error-notice";

/** A sign-in, registration or password page that failed. */
export default function AuthError(props: ErrorBoundaryProps) {
  return <ErrorNotice error={props.error} onRetry={retryOf(props)} back={{ href: "/", label: "Go to Sagline's home page" }} />;
}
