import type { Db } from "@/db/client";
import { claimDueEmails, markEmailFailed, markEmailRetry, markEmailSent } from "@/db/queries/email";
import { createMailer, type Mailer } from "./transport";

export interface SendPendingOptions {
  /** The clock (tests pass a later time to step past the back-off). Default: now. */
  now?: Date;
  /** Default: a nodemailer transport over SMTP_URL, closed afterwards. */
  mailer?: Mailer;
  /** Rows claimed per round. Default 20. */
  batchSize?: number;
  /** Attempts before a row is marked failed. Default 8. */
  maxAttempts?: number;
  /** First retry delay; doubles per attempt. Default 30 s. */
  baseDelayMs?: number;
  /** Cap on the retry delay. Default 1 h. */
  maxDelayMs?: number;
  /** How long a claim lasts before another sender may take the row again. Default 5 min. */
  claimMs?: number;
}

export interface SendReport {
  sent: number;
  retried: number;
  failed: number;
}

export const DEFAULT_MAX_ATTEMPTS = 8;

/** Exponential back-off after `attempts` failed attempts (1, 2, ...), capped. */
export function retryDelayMs(attempts: number, baseDelayMs = 30_000, maxDelayMs = 3_600_000): number {
  return Math.min(maxDelayMs, baseDelayMs * 2 ** Math.max(0, attempts - 1));
}

/** The Message-ID of an outbox row: the same on every attempt. */
export function outboxMessageId(id: string): string {
  return `<sagline-outbox-${id}@sagline.local>`;
}

function describe(error: unknown): string {
  const text = error instanceof Error ? error.message : String(error);
  return text.slice(0, 1000) || "unknown error";
}

/**
 * Delivers the due outbox rows. Each row is claimed (status sending) before it
 * is sent and marked sent only after the SMTP server accepted it; a failure
 * puts it back to pending with an exponential back-off, and after
 * `maxAttempts` attempts it is marked failed with its last error. Rows are
 * never deleted. A sender that dies between the server's acceptance and the
 * mark leaves the row sending; when its claim lapses it is sent again with the
 * same Message-ID (SMTP cannot do better than at-least-once).
 */
export async function sendPending(db: Db, options: SendPendingOptions = {}): Promise<SendReport> {
  const now = options.now ?? new Date();
  const batchSize = options.batchSize ?? 20;
  const maxAttempts = options.maxAttempts ?? DEFAULT_MAX_ATTEMPTS;
  const claimUntil = new Date(now.getTime() + (options.claimMs ?? 5 * 60_000));
  const mailer = options.mailer ?? createMailer();
  const report: SendReport = { sent: 0, retried: 0, failed: 0 };
  try {
    // rounds until a short batch: retried rows move past `now`, so none is taken twice in one call
    for (let round = 0; round < 50; round++) {
      const batch = await claimDueEmails(db, now, claimUntil, batchSize);
      for (const row of batch) {
        let messageId: string;
        try {
          messageId = await mailer.send({
            to: row.to_address,
            subject: row.subject,
            text: row.text_body,
            html: row.html_body,
            messageId: outboxMessageId(row.id),
            headers: { "X-Sagline-Outbox": row.id, "X-Sagline-Kind": row.kind },
          });
        } catch (error) {
          const message = describe(error);
          if (row.attempts >= maxAttempts) {
            await markEmailFailed(db, row.id, message);
            report.failed++;
          } else {
            const next = new Date(now.getTime() + retryDelayMs(row.attempts, options.baseDelayMs, options.maxDelayMs));
            await markEmailRetry(db, row.id, message, next);
            report.retried++;
          }
          continue;
        }
        // outside the catch: a database error here must not turn a delivered message into a retry
        await markEmailSent(db, row.id, messageId, new Date(Math.max(Date.now(), now.getTime())));
        report.sent++;
      }
      if (batch.length < batchSize) break;
    }
  } finally {
    if (!options.mailer) mailer.close();
  }
  return report;
}
