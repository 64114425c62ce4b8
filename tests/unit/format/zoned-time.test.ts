import { describe, expect, it } from "vitest";
import { formatDay, formatTime, formatWhen, isoToZoned, timeZoneNames, zoneLabel, zonedToIso } from "@/lib/format/zoned-time";

// Offsets from the IANA time zone database's rules: America/Chicago is UTC−6 in
// winter and UTC−5 from the second Sunday of March (02:00 local); Europe/Dublin
// is UTC+0 in winter and UTC+1 in summer; Asia/Kolkata is UTC+5:30 all year.
describe("wall-clock times in a named zone", () => {
  it("turns a local time into the instant, in winter and in summer", () => {
    expect(zonedToIso("2027-01-04T09:00", "America/Chicago")).toBe("2027-01-04T15:00:00.000Z");
    expect(zonedToIso("2027-07-04T09:00", "America/Chicago")).toBe("2027-07-04T14:00:00.000Z");
    expect(zonedToIso("2027-07-04T09:00", "Europe/Dublin")).toBe("2027-07-04T08:00:00.000Z");
    expect(zonedToIso("2027-01-04T09:00", "Asia/Kolkata")).toBe("2027-01-04T03:30:00.000Z");
    expect(zonedToIso("2027-01-04T09:00", "UTC")).toBe("2027-01-04T09:00:00.000Z");
  });

  it("round-trips: the instant shown back in the same zone is the time typed", () => {
    for (const zone of ["America/Chicago", "Europe/Dublin", "Asia/Kolkata", "Pacific/Auckland"]) {
      for (const local of ["2027-01-15T00:00", "2027-06-30T23:59", "2027-11-07T12:30"]) {
        expect(isoToZoned(zonedToIso(local, zone)!, zone)).toBe(local);
      }
    }
  });

  it("refuses a time the clock skips, and text that is not a time", () => {
    // 14 March 2027, 02:30 does not exist in Chicago: clocks go from 02:00 to 03:00
    expect(zonedToIso("2027-03-14T02:30", "America/Chicago")).toBeNull();
    expect(zonedToIso("2027-03-14", "America/Chicago")).toBeNull();
    expect(zonedToIso("yesterday", "UTC")).toBeNull();
  });

  it("lists IANA zone names with UTC first", () => {
    const names = timeZoneNames();
    expect(names[0]).toBe("UTC");
    expect(names).toContain("America/Chicago");
    expect(new Set(names).size).toBe(names.length);
  });
});

describe("dates and times shown with their zone", () => {
  // zone rules as above (IANA database); abbreviations from the CLDR data the runtime carries
  const winter = new Date("2027-01-04T09:00:00Z");
  const summer = new Date("2027-07-04T14:00:00Z");

  it("names the zone by its abbreviation where there is one, else by its UTC offset", () => {
    expect(formatTime(winter, "America/Chicago")).toBe("4 Jan 2027, 03:00 CST");
    expect(formatTime(summer, "America/Chicago")).toBe("4 Jul 2027, 09:00 CDT");
    expect(formatTime(winter, "Asia/Kolkata")).toBe("4 Jan 2027, 14:30 UTC+5:30");
    expect(formatTime(summer, "Europe/Dublin")).toBe("4 Jul 2027, 15:00 UTC+1");
    expect(formatTime(winter, "UTC")).toBe("4 Jan 2027, 09:00 UTC");
    expect(zoneLabel(winter, "America/St_Johns")).toBe("UTC−3:30");
    for (const zone of timeZoneNames()) expect(zoneLabel(summer, zone)).not.toMatch(/GMT/);
  });

  it("gives the full zone name in e-mails and reports, and the day as it falls in the zone", () => {
    expect(formatWhen(winter, "America/Chicago")).toBe("4 Jan 2027, 03:00 CST (America/Chicago)");
    expect(formatWhen(winter, "UTC")).toBe("4 Jan 2027, 09:00 UTC");
    // 03:00 UTC on 5 Jan is still 4 Jan in Chicago
    expect(formatDay(new Date("2027-01-05T03:00:00Z"), "America/Chicago")).toBe("4 Jan 2027");
    expect(formatDay(new Date("2027-01-05T03:00:00Z"), "UTC")).toBe("5 Jan 2027");
  });
});
