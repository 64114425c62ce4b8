import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { Denied } from "@/components/ui/denied";
import { currentActor } from "@/lib/auth/session";
import { mailDir, readMailbox } from "@/lib/email/mailbox";

export const metadata: Metadata = { title: "Kept mail (development)" };
export const dynamic = "force-dynamic";

/** Development pages exist outside production, or when SAGLINE_DEV_PAGES=1 (the start command and the browser tests set it). */
function devPagesEnabled(): boolean {
  return process.env.NODE_ENV !== "production" || process.env.SAGLINE_DEV_PAGES === "1";
}

/**
 * The messages the local fake SMTP server (scripts/fake-smtp.ts) has kept,
 * newest first. Bodies are shown as plain text; the HTML part is not rendered.
 */
export default async function DevMailPage() {
  if (!devPagesEnabled()) notFound();
  const actor = await currentActor();
  if (!actor?.isAdmin) return <Denied message="Only site administrators read the development mailbox." />;
  const messages = await readMailbox(mailDir(), 200);
  return (
    <div>
      <h1 className="mb-1">Kept mail</h1>
      <p className="mb-6 text-sm text-ink-soft">
        Development only: every message the local fake SMTP server received, newest first ({messages.length} shown).
        Nothing here reached a real mailbox.
      </p>
      {messages.length === 0 ? (
        <p className="text-ink-soft" data-testid="mail-empty">
          No messages yet.
        </p>
      ) : (
        <ul className="space-y-4" data-testid="mail-list">
          {messages.map((m) => (
            <li key={m.file} className="card" data-testid="mail-item">
              <div className="mb-2 flex flex-wrap items-baseline gap-x-4 gap-y-1 text-sm">
                <span>
                  <span className="text-ink-soft">To </span>
                  <span data-testid="mail-to">{m.to.join(", ")}</span>
                </span>
                <time className="text-ink-faint" dateTime={m.receivedAt}>
                  {new Date(m.receivedAt).toISOString().replace("T", " ").slice(0, 19)} UTC
                </time>
              </div>
              <h2 className="mb-2 text-base font-semibold" data-testid="mail-subject">
                {m.subject}
              </h2>
              <pre className="whitespace-pre-wrap break-words font-sans text-sm" data-testid="mail-body">
                {m.text}
              </pre>
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
