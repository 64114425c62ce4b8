/**
 * The client's network address, for per-address rate limits.
 *
 * Next.js (base-server) writes the socket's remote address into
 * `x-forwarded-for` only when the request carries no such header, and keeps
 * one the client sent. So:
 * - TRUSTED_PROXY unset (Sagline reached directly): the last entry, which is
 *   the socket address unless the client wrote the header itself. A client
 *   can then choose its own address; the per-account and per-e-mail limits
 *   still hold. Serve the public through a proxy for per-address limits that
 *   cannot be dodged.
 * - TRUSTED_PROXY=N (N proxies in front, each appending the address it saw):
 *   the N-th entry from the right; anything further left was written by the
 *   client and is ignored. With fewer entries than N the leftmost one.
 * Null when no address can be read (a request made in-process): per-address
 * limits then do not apply.
 */
export function clientAddress(headers: Headers, env: Record<string, string | undefined> = process.env): string | null {
  const hops = trustedProxyHops(env);
  const entries = (headers.get("x-forwarded-for") ?? "")
    .split(",")
    .map((s) => s.trim())
    .filter(Boolean);
  if (entries.length === 0) return null;
  const at = Math.max(0, entries.length - Math.max(1, hops));
  return normalise(entries[at]);
}

export function trustedProxyHops(env: Record<string, string | undefined> = process.env): number {
  const raw = (env.TRUSTED_PROXY ?? "").trim().toLowerCase();
  if (raw === "" || raw === "0" || raw === "false" || raw === "no") return 0;
  if (raw === "true" || raw === "yes") return 1;
  const n = Number(raw);
  if (!Number.isInteger(n) || n < 0 || n > 10) throw new Error(`TRUSTED_PROXY must be the number of proxies in front of Sagline (0–10); got "${env.TRUSTED_PROXY}"`);
  return n;
}

/** "::ffff:10.0.0.1" and "10.0.0.1" are one client; ports are dropped. */
function normalise(address: string): string {
  let a = address.toLowerCase();
  if (a.startsWith("[")) a = a.slice(1, a.indexOf("]") > 0 ? a.indexOf("]") : undefined);
  else if (/^\d+\.\d+\.\d+\.\d+:\d+$/.test(a)) a = a.slice(0, a.lastIndexOf(":"));
  if (a.startsWith("::ffff:") && a.includes(".")) a = a.slice(7);
  return a.slice(0, 100);
}

/** The address of a next-auth `authorize` request (its headers come as a plain object). */
export function clientAddressFromRecord(headers: Record<string, string | string[] | undefined> | undefined): string | null {
  const h = new Headers();
  for (const [k, v] of Object.entries(headers ?? {})) if (v !== undefined) h.set(k, Array.isArray(v) ? v.join(", ") : v);
  return clientAddress(h);
}
