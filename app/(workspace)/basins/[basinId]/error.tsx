"use client";
import { useParams } from "next/navigation";
import { ErrorNotice, retryOf, type ErrorBoundaryProps } from "@/components/layout/error-notice";

/** A basin section that failed: the basin's name and tabs stay, so the other sections are a tap away. */
export default function BasinSectionError(props: ErrorBoundaryProps) {
  const { basinId } = useParams<{ basinId: string }>();
  return (
    <ErrorNotice
      error={props.error}
      onRetry={retryOf(props)}
      title="This part of the basin could not be shown"
      back={{ href: `/basins/${basinId}`, label: "Go to the basin's overview" }}
    />
  );
}
