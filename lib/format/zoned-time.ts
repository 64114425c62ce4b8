import { TZDate } from "@date-fns/tz";

/**
 * Wall-clock times in a named time zone, as the review forms take them
 * (`<input type="datetime-local">` gives "YYYY-MM-DDTHH:mm" without a zone).
 * The zone rules come from the runtime's IANA database through @date-fns/tz.
 */
const LOCAL = /^(\d{4})-(\d{2})-(\d{2})T(\d{2}):(\d{2})$/;

/** "2027-01-04T09:00" in America/Chicago → "2027-01-04T15:00:00.000Z"; null when the text is not a wall-clock time. */
export function zonedToIso(local: string, timeZone: string): string | null {
  const m = LOCAL.exec(local);
  if (!m) return null;
  const [y, mo, d, h, mi] = m.slice(1).map(Number);
  const t = new TZDate(y, mo - 1, d, h, mi, timeZone);
  const iso = new Date(t.getTime()).toISOString();
  // a wall-clock time skipped by a clock change comes back moved; refuse it rather than guess
  return isoToZoned(iso, timeZone) === local ? iso : null;
}

/** An instant as wall-clock "YYYY-MM-DDTHH:mm" in `timeZone` (seconds dropped). */
export function isoToZoned(iso: string, timeZone: string): string {
  const t = new TZDate(Date.parse(iso), timeZone);
  const p = (n: number) => String(n).padStart(2, "0");
  return `${t.getFullYear()}-${p(t.getMonth() + 1)}-${p(t.getDate())}T${p(t.getHours())}:${p(t.getMinutes())}`;
}

/** Every time zone the runtime knows (IANA names), for a picker; UTC first. */
export function timeZoneNames(): string[] {
  const names = typeof Intl.supportedValuesOf === "function" ? Intl.supportedValuesOf("timeZone") : [];
  return ["UTC", ...names.filter((n) => n !== "UTC")];
}

/** A date and time in an explicit time zone, e.g. "15 Jan 2027, 17:00 UTC" or "4 Jan 2027, 03:00 GMT-6 (America/Chicago)". */
export function formatWhen(when: Date, timeZone: string): string {
  const text = new Intl.DateTimeFormat("en-GB", {
    timeZone,
    day: "numeric",
    month: "short",
    year: "numeric",
    hour: "2-digit",
    minute: "2-digit",
    timeZoneName: "short",
  }).format(when);
  return timeZone === "UTC" ? text : `${text} (${timeZone})`;
}
