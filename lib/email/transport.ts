import nodemailer from "nodemailer";

export const DEFAULT_SMTP_URL = "smtp://127.0.0.1:2525";

/** Where Sagline sends mail: SMTP_URL, or the local fake SMTP server (scripts/fake-smtp.ts). */
export function smtpUrl(): string {
  return process.env.SMTP_URL || DEFAULT_SMTP_URL;
}

/** The sender address on every notice: SAGLINE_MAIL_FROM, or a local default. */
export function mailFrom(): string {
  return process.env.SAGLINE_MAIL_FROM || "Sagline <no-reply@sagline.local>";
}

export interface OutgoingMessage {
  to: string;
  subject: string;
  text: string;
  html?: string | null;
  /** Stable per outbox row, so a receiver can recognise a repeated delivery. */
  messageId: string;
  headers?: Record<string, string>;
}

export interface Mailer {
  /** Sends one message; resolves with the Message-ID the server accepted, rejects on any failure. */
  send(message: OutgoingMessage): Promise<string>;
  close(): void;
}

/**
 * A nodemailer SMTP transport over `url`. Short timeouts, so an unreachable
 * server fails the attempt quickly and the outbox schedules a retry.
 */
export function createMailer(url: string = smtpUrl()): Mailer {
  const transport = nodemailer.createTransport(url, {
    connectionTimeout: 5_000,
    greetingTimeout: 5_000,
    socketTimeout: 15_000,
  });
  return {
    async send(m) {
      const info = await transport.sendMail({
        from: mailFrom(),
        to: m.to,
        subject: m.subject,
        text: m.text,
        html: m.html ?? undefined,
        messageId: m.messageId,
        headers: m.headers,
      });
      if (info.rejected.length > 0) throw new Error(`the SMTP server rejected ${info.rejected.join(", ")}`);
      return info.messageId;
    },
    close() {
      transport.close();
    },
  };
}
