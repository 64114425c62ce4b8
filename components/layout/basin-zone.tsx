"use client";
import { createContext, useContext, type ReactNode } from "react";
import { formatDay, formatTime } from "@/lib/format/zoned-time";

/** The basin's time zone, for every date and time shown on its pages (UTC outside a basin or before one is set). */
const BasinZone = createContext<string>("UTC");

export function BasinZoneProvider({ zone, children }: { zone: string | null; children: ReactNode }) {
  return <BasinZone.Provider value={zone ?? "UTC"}>{children}</BasinZone.Provider>;
}

export function useBasinZone(): string {
  return useContext(BasinZone);
}

/**
 * An instant as the basin's pages show it: "4 Jan 2027, 03:00 CST" (or the day only),
 * in the basin's zone unless `zone` names another, in a <time> element carrying the
 * instant itself.
 */
export function When({ at, day = false, zone }: { at: string | Date; day?: boolean; zone?: string }) {
  const basinZone = useBasinZone();
  const z = zone ?? basinZone;
  const when = typeof at === "string" ? new Date(at) : at;
  return (
    <time dateTime={when.toISOString()} title={z}>
      {day ? formatDay(when, z) : formatTime(when, z)}
    </time>
  );
}
