import { readMailbox, type KeptMessage } from "@/lib/email/mailbox";

/**
 * Waits until the fake SMTP server has kept a message to `address` that
 * `match` accepts (the worker delivers the outbox every second in the browser tests).
 */
export async function waitForMail(mailDir: string, address: string, match: (m: KeptMessage) => boolean = () => true, timeoutMs = 30_000): Promise<KeptMessage> {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    const found = (await readMailbox(mailDir, 1000)).find((m) => m.to.includes(address) && match(m));
    if (found) return found;
    await new Promise((r) => setTimeout(r, 500));
  }
  throw new Error(`no matching e-mail reached ${address} within ${timeoutMs} ms`);
}

/** The first link in a message's plain text that contains `path`. */
export function linkIn(m: KeptMessage, path: string): string {
  const link = m.text.match(/https?:\/\/\S+/g)?.find((u) => u.includes(path));
  if (!link) throw new Error(`no link to ${path} in "${m.subject}"`);
  return link;
}
