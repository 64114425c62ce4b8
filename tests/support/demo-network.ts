import { readFileSync } from "node:fs";
import { fileURLToPath } from "node:url";
import type { Db } from "@/db/client";
import { DEMO_DISCHARGER_MAPPING, DEMO_GIS_FILES, DEMO_REACH_MAPPING } from "@/db/seed/demo-gis";
import type { Actor } from "@/lib/auth/guard";
import { uploadImport } from "@/lib/services/imports";
import { commitNetwork } from "@/lib/services/networks";
import type { NetworkDraft } from "@/lib/validation/network";
import { scoped } from "./scoped";

const ROOT = fileURLToPath(new URL("../..", import.meta.url));

export const demoFile = (key: keyof typeof DEMO_GIS_FILES) => {
  const path = DEMO_GIS_FILES[key];
  return { name: path.split("/").at(-1)!, bytes: readFileSync(ROOT + path) };
};

/** A multipart form with one demo file, as a browser would send it. */
export function demoForm(key: keyof typeof DEMO_GIS_FILES, layer: "reaches" | "dischargers", bytes?: Uint8Array, name?: string) {
  const f = demoFile(key);
  const form = new FormData();
  form.set("layer", layer);
  form.set("file", new File([new Uint8Array(bytes ?? f.bytes)], name ?? f.name));
  return form;
}

/** Upload the demo shapefile and CSV as `actor`; returns a draft ready to validate or commit. */
export async function uploadDemo(db: Db, actor: Actor, basinId: string): Promise<NetworkDraft> {
  const reaches = await scoped(uploadImport)(db, actor, basinId, demoFile("reaches"), { layer: "reaches" });
  const dischargers = await scoped(uploadImport)(db, actor, basinId, demoFile("dischargers"), { layer: "dischargers" });
  return {
    reachImportId: reaches.id,
    reachMapping: DEMO_REACH_MAPPING,
    dischargerImportId: dischargers.id,
    dischargerMapping: DEMO_DISCHARGER_MAPPING,
    options: { toleranceM: 5, maxSnapDistanceM: 500, maxReachLengthKm: 10, allowMultipleOutlets: false },
  };
}

export async function commitDemo(db: Db, actor: Actor, basinId: string) {
  const draft = await uploadDemo(db, actor, basinId);
  return { draft, network: await scoped(commitNetwork)(db, actor, basinId, { draft, note: "", acceptReport: true }) };
}
