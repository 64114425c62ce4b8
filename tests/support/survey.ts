import { readFileSync } from "node:fs";
import { fileURLToPath } from "node:url";
import type { Db } from "@/db/client";
import type { Actor } from "@/lib/auth/guard";
import { DEMO_SURVEY } from "@/lib/services/demo";
import { uploadSurvey } from "@/lib/services/surveys";
import { surveyUploadSchema } from "@/lib/validation/surveys";
import { scoped } from "./scoped";

const ROOT = fileURLToPath(new URL("../..", import.meta.url));
export const DEMO_SURVEY_FILE = DEMO_SURVEY.file;
export const demoSurveyBytes = () => readFileSync(ROOT + DEMO_SURVEY_FILE);

/** The demo survey's upload form, as the browser sends it. */
export function surveyForm(bytes: Uint8Array = demoSurveyBytes(), fileName = "tamsel-survey-2026-08.csv", fields: Record<string, string> = {}) {
  const form = new FormData();
  form.set("name", DEMO_SURVEY.fields.name);
  for (const [k, v] of Object.entries(fields)) form.set(k, v);
  form.set("file", new File([new Uint8Array(bytes)], fileName));
  return form;
}

/** Upload the demo survey as `actor` (the basin needs a network). */
export async function uploadDemoSurvey(db: Db, actor: Actor, basinId: string) {
  return scoped(uploadSurvey)(db, actor, basinId, { name: "tamsel-survey-2026-08.csv", bytes: demoSurveyBytes() }, surveyUploadSchema.parse(DEMO_SURVEY.fields));
}
