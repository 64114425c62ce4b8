"use client";
import { forwardRef, useId, useMemo, type InputHTMLAttributes } from "react";
import { timeZoneNames, zoneLabel } from "@/lib/format/zoned-time";
import { isKnownTimeZone } from "@/lib/validation/time-zone";

/** Every IANA zone the runtime knows, as suggestions the browser filters while one types (a searchable picker). */
export function TimeZoneOptions({ id }: { id: string }) {
  const zones = useMemo(() => timeZoneNames(), []);
  return (
    <datalist id={id}>
      {zones.map((z) => (
        <option key={z} value={z} />
      ))}
    </datalist>
  );
}

/** "CST, UTC−6 now" beside a zone, or nothing while the text names no zone. */
export function ZoneNow({ zone }: { zone: string }) {
  if (!isKnownTimeZone(zone) || zone.trim() === "") return null;
  const now = new Date();
  const label = zoneLabel(now, zone);
  return (
    <span className="text-xs text-ink-faint" suppressHydrationWarning>
      now {label}
    </span>
  );
}

/**
 * A time-zone input: type part of a name ("chic", "Paris") and pick from the suggestions.
 * Works with react-hook-form's register (uncontrolled) or as a controlled input.
 */
export const TimeZoneInput = forwardRef<HTMLInputElement, InputHTMLAttributes<HTMLInputElement>>(function TimeZoneInput(props, ref) {
  const listId = useId();
  return (
    <>
      <input ref={ref} list={listId} autoComplete="off" spellCheck={false} placeholder="e.g. America/Chicago" className="field-input" {...props} />
      <TimeZoneOptions id={listId} />
    </>
  );
});
