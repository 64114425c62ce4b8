import { z } from "zod";

/** Whether the runtime's IANA database knows the zone (e.g. "America/Chicago"). */
export function isKnownTimeZone(tz: string): boolean {
  try {
    new Intl.DateTimeFormat("en", { timeZone: tz });
    return true;
  } catch {
    return false;
  }
}

/** A time zone by its IANA name, as every form and API that takes one checks it. */
export const timeZoneSchema = z
  .string({ message: "Choose a time zone" })
  .trim()
  .min(1, "Choose a time zone")
  .max(64, "Time zone names are at most 64 characters")
  .refine(isKnownTimeZone, "Unknown time zone; use an IANA name such as America/Chicago");
