import { mkdir, readdir, readFile, rename, writeFile } from "node:fs/promises";
import path from "node:path";
import { simpleParser, type AddressObject } from "mailparser";
import { SMTPServer } from "smtp-server";

/**
 * The local fake SMTP server (npm smtp-server) and its mailbox: every message
 * it accepts is kept in memory and, when a folder is given, written there as
 * `<time>-<n>.eml` (the raw message) plus `<time>-<n>.json` (parsed: to,
 * subject, time, bodies) for the development mail page and the tests.
 */
export interface KeptMessage {
  file: string;
  receivedAt: string;
  from: string;
  /** The envelope recipients (RCPT TO). */
  to: string[];
  subject: string;
  text: string;
  html: string | null;
  messageId: string | null;
  /** The X-Sagline-Outbox header: which outbox row this is. */
  outboxId: string | null;
}

/** Where the fake SMTP server keeps messages: SAGLINE_MAIL_DIR or .data/mail. */
export function mailDir(): string {
  return process.env.SAGLINE_MAIL_DIR || path.join(process.cwd(), ".data", "mail");
}

export interface MailServer {
  port: number;
  received: KeptMessage[];
  close(): Promise<void>;
}

function addressText(a: AddressObject | AddressObject[] | undefined): string {
  if (!a) return "";
  return (Array.isArray(a) ? a : [a]).map((x) => x.text).join(", ");
}

/** Starts the fake SMTP server on `host:port` (port 0: a free one). No TLS, no authentication: loopback only. */
export async function startMailServer(options: { host?: string; port?: number; dir?: string | null } = {}): Promise<MailServer> {
  const host = options.host ?? "127.0.0.1";
  const dir = options.dir ?? null;
  if (dir) await mkdir(dir, { recursive: true });
  const received: KeptMessage[] = [];
  let seq = 0;
  const server = new SMTPServer({
    disabledCommands: ["STARTTLS", "AUTH"],
    authOptional: true,
    logger: false,
    banner: "Sagline fake SMTP",
    size: 10 * 1024 * 1024,
    onData(stream, session, callback) {
      const chunks: Buffer[] = [];
      stream.on("data", (c: Buffer) => chunks.push(c));
      stream.on("error", callback);
      stream.on("end", () => {
        const raw = Buffer.concat(chunks);
        const keep = async () => {
          const parsed = await simpleParser(raw);
          const now = new Date();
          const base = `${now.getTime()}-${String(++seq).padStart(4, "0")}`;
          const outbox = parsed.headers.get("x-sagline-outbox");
          const message: KeptMessage = {
            file: base,
            receivedAt: now.toISOString(),
            from: session.envelope.mailFrom ? session.envelope.mailFrom.address : addressText(parsed.from),
            to: session.envelope.rcptTo.map((r) => r.address),
            subject: parsed.subject ?? "",
            text: parsed.text ?? "",
            html: typeof parsed.html === "string" ? parsed.html : null,
            messageId: parsed.messageId ?? null,
            outboxId: typeof outbox === "string" ? outbox : null,
          };
          if (dir) {
            await writeFile(path.join(dir, `${base}.eml`), raw);
            const tmp = path.join(dir, `.${base}.json.tmp`);
            await writeFile(tmp, JSON.stringify(message, null, 2));
            await rename(tmp, path.join(dir, `${base}.json`));
          }
          received.push(message);
        };
        keep().then(
          () => callback(),
          (e: unknown) => callback(e instanceof Error ? e : new Error(String(e))),
        );
      });
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once("error", reject);
    server.listen(options.port ?? 2525, host, () => {
      server.off("error", reject);
      resolve();
    });
  });
  server.on("error", (e) => console.error("[fake-smtp]", e.message));
  const address = server.server.address();
  const port = typeof address === "object" && address ? address.port : (options.port ?? 2525);
  return {
    port,
    received,
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}

/** The kept messages in `dir`, newest first. */
export async function readMailbox(dir: string = mailDir(), limit = 200): Promise<KeptMessage[]> {
  let names: string[];
  try {
    // the folder is chosen at run time (SAGLINE_MAIL_DIR): nothing for the build to trace
    names = await readdir(/* turbopackIgnore: true */ dir);
  } catch {
    return [];
  }
  const files = names.filter((n) => n.endsWith(".json") && !n.startsWith(".")).sort().reverse().slice(0, limit);
  const messages: KeptMessage[] = [];
  for (const name of files) {
    try {
      messages.push(JSON.parse(await readFile(/* turbopackIgnore: true */ path.join(/* turbopackIgnore: true */ dir, name), "utf8")) as KeptMessage);
    } catch {
      // a file being written or not ours: skip it
    }
  }
  return messages;
}
