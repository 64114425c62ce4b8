import { readFileSync } from "node:fs";
import type { Db } from "@/db/client";
import type { Actor } from "@/lib/auth/guard";
import { uploadGaugeRecord } from "@/lib/services/gauges";
import { gaugeUploadSchema } from "@/lib/validation/gauges";
import { scoped } from "./scoped";

/** The demo's invented gauge record (examples/, written by scripts/make-demo-gauge.ts), as uploaded. */
export const DEMO_GAUGE_FILE = "examples/tamsel-quillford-gauge-daily.csv";
export const demoGaugeBytes = () => readFileSync(DEMO_GAUGE_FILE);

/** The multipart body the gauge upload route takes. */
export function gaugeForm(fields: Record<string, string> = {}, bytes: Uint8Array = demoGaugeBytes(), name = "quillford-daily.csv"): FormData {
  const form = new FormData();
  form.set("name", "Quillford gauge");
  for (const [k, v] of Object.entries(fields)) form.set(k, v);
  form.set("file", new File([new Uint8Array(bytes)], name));
  return form;
}

/** Upload the demo gauge record through the service, as `actor`. */
export const uploadDemoGauge = (db: Db, actor: Actor, basinId: string) =>
  scoped(uploadGaugeRecord)(db, actor, basinId, { name: "tamsel-quillford-gauge-daily.csv", bytes: demoGaugeBytes() }, gaugeUploadSchema.parse({ name: "Quillford gauge" }));
