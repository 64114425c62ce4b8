import { insertAuditEvent } from "@/db/queries/audit";
import { findTemperatureRecordSummary, insertTemperatureRecord, listTemperatureRecords as listRows } from "@/db/queries/temperature-records";
import type { BasinScope } from "@/lib/auth/scope";
import { importPool } from "@/lib/compute/import-pool";
import type { DesignTemperature } from "@/lib/hydrology/design-temperature";
import type { TemperatureRecordUpload } from "@/lib/validation/temperature-records";
import { checkReachOnNewestNetwork, checkRecordFile, fileProblem } from "./field-records";
import { importFailure } from "./imports";

/** The most bytes a daily temperature record may have: two centuries of daily CSV are under 5 MB. */
export const TEMPERATURE_RECORD_MAX_BYTES = 5 * 1024 * 1024;

export interface TemperatureRecordDto {
  id: string;
  name: string;
  stationCode: string | null;
  reachId: string | null;
  unit: "C" | "F";
  fileName: string;
  sizeBytes: number;
  sha256: string;
  firstDay: string;
  lastDay: string;
  dayCount: number;
  missingDays: number;
  uploadedAt: string;
  uploadedBy: string | null;
  /** The design temperature by the default rule (90th percentile of June–September daily means), null when those months have no values. */
  summer: DesignTemperature | null;
}

type Row = Awaited<ReturnType<typeof listRows>>[number];

function dto(r: Row): TemperatureRecordDto {
  return {
    id: r.id,
    name: r.name,
    stationCode: r.station_code,
    reachId: r.reach_key,
    unit: r.unit,
    fileName: r.file_name,
    sizeBytes: r.size_bytes,
    sha256: r.sha256,
    firstDay: r.first_day,
    lastDay: r.last_day,
    dayCount: r.day_count,
    missingDays: r.missing_days,
    uploadedAt: r.uploaded_at.toISOString(),
    uploadedBy: r.uploaded_by_name,
    summer: (r.summer as DesignTemperature | null) ?? null,
  };
}


/**
 * A daily water-temperature record (CSV date,temperature or rdb text, in °C or °F), read in the
 * import worker thread and kept with its daily means in °C, who uploaded it, when, and the
 * file's SHA-256. Nothing is saved when the file cannot be read; the error names the line.
 */
export async function uploadTemperatureRecord(scope: BasinScope, file: { name: string; bytes: Buffer }, fields: TemperatureRecordUpload): Promise<TemperatureRecordDto> {
  scope.require("network.import");
  const { db, actor, basin } = scope;
  checkRecordFile(file, TEMPERATURE_RECORD_MAX_BYTES, "a daily record");
  const read = await importPool()
    .temperature({ bytes: file.bytes, fileName: file.name, unit: fields.unit })
    .catch((e: unknown) => {
      throw importFailure(e);
    });
  if (!read.ok) throw fileProblem(read.message);
  if (fields.reachId !== undefined) await checkReachOnNewestNetwork(db, basin.id, fields.reachId);
  return db.transaction().execute(async (trx) => {
    const { id } = await insertTemperatureRecord(trx, {
      basin_id: basin.id,
      name: fields.name,
      station_code: fields.stationCode ?? null,
      reach_key: fields.reachId ?? null,
      unit: fields.unit,
      file_name: file.name,
      size_bytes: file.bytes.byteLength,
      sha256: read.sha256,
      content: file.bytes,
      first_day: read.firstDay,
      last_day: read.lastDay,
      day_count: read.dayCount,
      missing_days: read.missingDays,
      days: read.daysJson,
      summer: read.summer ? JSON.stringify(read.summer) : null,
      uploaded_by: actor.id,
    });
    await insertAuditEvent(trx, {
      basinId: basin.id,
      actorId: actor.id,
      action: "temperature_record.uploaded",
      targetType: "temperature_record",
      targetId: id,
      details: { name: fields.name, fileName: file.name, sha256: read.sha256, days: read.dayCount },
    });
    return dto((await findTemperatureRecordSummary(trx, basin.id, id))!);
  });
}

/** The basin's temperature records with the default rule's design temperature of each. */
export async function listTemperatureRecords(scope: BasinScope): Promise<TemperatureRecordDto[]> {
  scope.require("scenario.read");
  return (await listRows(scope.db, scope.basin.id)).map(dto);
}
