"use client";
import { errorReference, type ErrorBoundaryProps } from "@/components/layout/error-notice";
import "./globals.css";

/**
 * When the root layout itself fails, this replaces the whole document, so it brings its
 * own <html> and the app's styles. It says what happened in a sentence, offers to try
 * again and names the error's reference; never its message or stack.
 */
export default function GlobalError(props: ErrorBoundaryProps) {
  const reference = errorReference(props.error);
  const retry = props.retry ?? props.reset;
  return (
    <html lang="en">
      <body>
        <title>Sagline could not start this page</title>
        <main className="mx-auto max-w-xl px-4 py-24">
          <section className="card space-y-3" role="alert" data-testid="error-notice">
            <h1>Sagline could not show this page</h1>
            <p className="text-ink-soft">Something went wrong on our side. Trying again often helps; if it keeps happening, tell the site&apos;s administrator.</p>
            {reference && (
              <p className="text-sm text-ink-soft">
                Reference: <code className="break-all">{reference}</code>
              </p>
            )}
            <p className="flex flex-wrap gap-4">
              <button type="button" className="rounded-md bg-tarn-600 px-4 py-2 text-sm font-medium text-white" onClick={() => retry?.()}>
                Try again
              </button>
              {/* a plain link: the app's router is what failed */}
              {/* eslint-disable-next-line @next/next/no-html-link-for-pages */}
              <a href="/">Go to Sagline&apos;s home page</a>
            </p>
          </section>
        </main>
      </body>
    </html>
  );
}
