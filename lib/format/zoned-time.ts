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

/**
 * The zone's short name at that instant: the abbreviation where one is in common use
 * (CST, CDT, EST, PST, UTC…, from the runtime's CLDR data), otherwise the offset written
 * "UTC+1", "UTC−3:30" — never "GMT-6", so every screen, e-mail and report names a zone
 * the same way.
 */
export function zoneLabel(when: Date, timeZone: string): string {
  const part = (locale: string, timeZoneName: "short" | "shortOffset") =>
    new Intl.DateTimeFormat(locale, { timeZone, timeZoneName }).formatToParts(when).find((p) => p.type === "timeZoneName")?.value ?? "";
  const abbreviation = part("en-US", "short");
  if (/^[A-Z]{2,5}$/.test(abbreviation) && abbreviation !== "GMT") return abbreviation;
  const offset = part("en-US", "shortOffset"); // "GMT", "GMT+1", "GMT-3:30"
  return offset === "GMT" || offset === "" ? "UTC" : offset.replace(/^GMT/, "UTC").replace("-", "−");
}

const dayParts = { day: "numeric", month: "short", year: "numeric" } as const;

/** A date as it falls in `timeZone`, e.g. "4 Jan 2027". */
export function formatDay(when: Date, timeZone: string): string {
  return new Intl.DateTimeFormat("en-GB", { timeZone, ...dayParts }).format(when);
}

/** A date and time with its zone's short name, for screens: "4 Jan 2027, 03:00 CST". */
export function formatTime(when: Date, timeZone: string): string {
  const text = new Intl.DateTimeFormat("en-GB", { timeZone, ...dayParts, hour: "2-digit", minute: "2-digit", hourCycle: "h23" }).format(when);
  return `${text} ${zoneLabel(when, timeZone)}`;
}

/**
 * A date and time that names its zone in full, for e-mails and reports read away from the
 * basin's pages: "15 Jan 2027, 17:00 UTC" or "4 Jan 2027, 03:00 CST (America/Chicago)".
 */
export function formatWhen(when: Date, timeZone: string): string {
  const text = formatTime(when, timeZone);
  return timeZone === "UTC" || timeZone === "Etc/UTC" ? text : `${text} (${timeZone})`;
}
