/** Sagline's names for a survey file's columns (lib/survey/read-survey.ts SURVEY_COLUMNS gives the names recognised for each). */
export const SURVEY_COLUMN_KEYS = ["station", "time", "date", "clock", "reach", "km", "do", "temperature", "bod5", "cbodu", "bod", "nh3n", "flow", "velocity", "depth", "weight"] as const;
export type SurveyColumnKey = (typeof SURVEY_COLUMN_KEYS)[number];
/** Columns a planner may map by hand: Sagline's, and a CSV's latitude and longitude. */
export const SURVEY_MAPPABLE_COLUMNS = [...SURVEY_COLUMN_KEYS, "latitude", "longitude"] as const;
