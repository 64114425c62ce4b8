import { mailDir, startMailServer } from "@/lib/email/mailbox";

/**
 * Sagline's local fake SMTP server for development and tests: listens on
 * 127.0.0.1:$SAGLINE_SMTP_PORT (default 2525) and keeps every message under
 * $SAGLINE_MAIL_DIR (default .data/mail, git-ignored) as .eml plus a parsed
 * .json. The development page /dev/mail lists them.
 */
const port = Number(process.env.SAGLINE_SMTP_PORT ?? 2525);
const dir = mailDir();
const server = await startMailServer({ host: "127.0.0.1", port, dir });
console.log(`Sagline fake SMTP on smtp://127.0.0.1:${server.port}, keeping messages in ${dir} (pid ${process.pid})`);

const shutdown = async () => {
  await server.close();
  process.exit(0);
};
process.on("SIGTERM", shutdown);
process.on("SIGINT", shutdown);
