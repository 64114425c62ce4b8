import type { ReactNode } from "react";

/**
 * Placeholders shown while a page's data is on its way, in the frames the page itself
 * uses (cards, their headings, tables and the map panel), so the page fills in where the
 * reader is already looking instead of jumping. Only the frames are drawn: no numbers
 * or names that might be read as data.
 */

/** A grey bar the height of a line of text. */
export function SkeletonLine({ className = "w-full" }: { className?: string }) {
  return <span aria-hidden="true" className={`block h-3.5 animate-pulse rounded bg-paper-sunk ${className}`} />;
}

/** A card with its real heading (when the page's heading is fixed text) and some lines. */
export function SkeletonCard({ heading, lines = 3, children }: { heading?: string; lines?: number; children?: ReactNode }) {
  return (
    <section className="card space-y-3" aria-hidden="true">
      {heading ? <h2>{heading}</h2> : <SkeletonLine className="h-5 w-1/3" />}
      {children ??
        Array.from({ length: lines }, (_, i) => <SkeletonLine key={i} className={i === lines - 1 ? "w-2/3" : "w-full"} />)}
    </section>
  );
}

/** A table's frame: a header rule and rows of bars. */
export function SkeletonTable({ rows = 5, columns = 4 }: { rows?: number; columns?: number }) {
  return (
    <div className="space-y-0" aria-hidden="true">
      <div className="flex gap-4 border-b-2 border-rule-strong px-3 py-2">
        {Array.from({ length: columns }, (_, c) => (
          <SkeletonLine key={c} className="h-3 flex-1" />
        ))}
      </div>
      {Array.from({ length: rows }, (_, r) => (
        <div key={r} className={`flex gap-4 border-b border-rule px-3 py-2.5 ${r % 2 ? "bg-paper" : ""}`}>
          {Array.from({ length: columns }, (_, c) => (
            <SkeletonLine key={c} className="flex-1" />
          ))}
        </div>
      ))}
    </div>
  );
}

/** The map panel's frame, at the height the maps use. */
export function SkeletonMap({ className = "h-[480px]" }: { className?: string }) {
  return <div aria-hidden="true" className={`w-full animate-pulse rounded-card border border-rule bg-paper-sunk ${className}`} />;
}

/** The wrapper every loading.tsx renders: announced once to screen readers, found by tests. */
export function PageSkeleton({ label, children }: { label: string; children: ReactNode }) {
  return (
    <div className="space-y-6" role="status" aria-live="polite" data-testid="loading-skeleton">
      <span className="sr-only">{label}</span>
      {children}
    </div>
  );
}
