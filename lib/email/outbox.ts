import type { Db } from "@/db/client";
import type { EmailKind } from "@/db/schema";
import { insertOutboxRow } from "@/db/queries/email";
import type { RenderedEmail } from "./templates";

export interface QueueEmailInput extends RenderedEmail {
  to: string;
  kind: EmailKind;
  /**
   * Names the event and the recipient, e.g. `review_opened:<periodId>:<userId>`.
   * Queueing the same key again is a no-op, so an event retried or handled
   * twice still sends one message.
   */
  dedupeKey: string;
  basinId?: string | null;
}

const EMAIL = /^[^\s@<>]+@[^\s@<>]+$/;

/**
 * Writes one outbox row inside the caller's transaction (pass the `trx` of
 * `db.transaction()`): the e-mail exists if and only if its event commits.
 * Returns true when a row was added, false when the dedupe key was already queued.
 */
export async function queueEmail(trx: Db, input: QueueEmailInput): Promise<boolean> {
  const to = input.to.trim();
  if (!EMAIL.test(to)) throw new Error(`queueEmail: "to" is not an e-mail address: ${JSON.stringify(input.to)}`);
  if (!input.dedupeKey.trim()) throw new Error("queueEmail: dedupeKey is empty");
  if (!input.subject.trim()) throw new Error("queueEmail: subject is empty");
  return insertOutboxRow(trx, {
    basin_id: input.basinId ?? null,
    to_address: to,
    subject: input.subject,
    text_body: input.text,
    html_body: input.html ?? null,
    kind: input.kind,
    dedupe_key: input.dedupeKey,
  });
}
