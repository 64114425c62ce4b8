import type { SurveyColumnKey } from "@/lib/domain/surveys";

/*
 * How a survey file's columns are found (pure and small, so the upload form can show the
 * same guess the server makes before the file is sent).
 */

/** Sagline's name for each column and the names it recognises in a file (compared without case, spaces, dots or underscores). */
export const SURVEY_COLUMNS = {
  station: ["station", "stationid", "site", "siteid", "id", "name"],
  time: ["datetime", "sampledat", "timestamp", "sampled", "time"],
  date: ["date", "sampledate"],
  clock: ["clock", "sampletime", "timeofday"],
  reach: ["reach", "reachid"],
  km: ["km", "chainagekm", "chainage", "riverkm", "kmfromhead"],
  do: ["do", "domgl", "dissolvedoxygen", "oxygen"],
  temperature: ["temperature", "temp", "watertemperature", "tempc", "tempf", "wtemp"],
  bod5: ["bod5", "bod5mgl"],
  cbodu: ["cbodu", "cbodumgl", "ultimatecbod"],
  bod: ["bod", "bodmgl"],
  nh3n: ["nh3n", "nh3", "ammonia", "ammonian", "nh3nmgl"],
  flow: ["flow", "discharge", "q", "flowrate"],
  velocity: ["velocity", "velocityms", "velocityfts", "meanvelocity", "vel"],
  depth: ["depth", "depthm", "depthft", "meandepth"],
  weight: ["weight"],
} as const satisfies Record<SurveyColumnKey, readonly string[]>;
export type SurveyColumn = keyof typeof SURVEY_COLUMNS;

const squash = (name: string) => name.toLowerCase().replace(/[\s._\-/()]/g, "");

/**
 * Which of the file's columns holds each of Sagline's: the planner's mapping first, then the
 * first recognised name (in SURVEY_COLUMNS order) among the columns not yet taken.
 */
export function findSurveyColumns(columns: readonly string[], mapped: Partial<Record<string, string>> = {}): Partial<Record<SurveyColumn, string>> {
  const found: Partial<Record<SurveyColumn, string>> = {};
  const taken = new Set<string>();
  for (const key of Object.keys(SURVEY_COLUMNS) as SurveyColumn[]) {
    const own = mapped[key];
    if (own && columns.includes(own)) {
      found[key] = own;
      taken.add(own);
    }
  }
  for (const own of [mapped.latitude, mapped.longitude]) if (own) taken.add(own);
  for (const [key, names] of Object.entries(SURVEY_COLUMNS) as [SurveyColumn, readonly string[]][]) {
    if (found[key]) continue;
    for (const n of names) {
      const hit = columns.find((c) => !taken.has(c) && squash(c) === n);
      if (hit) {
        found[key] = hit;
        taken.add(hit);
        break;
      }
    }
  }
  return found;
}

