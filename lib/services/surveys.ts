import { insertAuditEvent } from "@/db/queries/audit";
import { latestNetworkId, reachLines } from "@/db/queries/networks";
import { findSurvey, insertSurvey, listSurveys as listSurveyRows } from "@/db/queries/surveys";
import type { LngLat } from "@/geo/types";
import type { BasinScope } from "@/lib/auth/scope";
import { importPool } from "@/lib/compute/import-pool";
import { AppError, notFound } from "@/lib/errors";
import type { PlacedSample } from "@/lib/survey/place-stations";
import type { SurveyReadOptions } from "@/lib/survey/read-survey";
import type { SurveyUpload } from "@/lib/validation/surveys";
import { checkRecordFile } from "./field-records";
import { detectFormat, importFailure } from "./imports";

/** The most bytes a survey file may have: a few thousand samples are well under 5 MB in any of its formats. */
export const SURVEY_MAX_BYTES = 5 * 1024 * 1024;
/** How many row problems a refused upload lists one by one (the message gives the count). */
const LISTED_PROBLEMS = 200;

export interface SurveySummaryDto {
  id: string;
  name: string;
  networkId: string;
  networkVersion: number;
  /** The units the file was read in; every value Sagline keeps is in mg/L, °C and m³/s. */
  units: SurveyReadOptions & { maxSnapDistanceM: number };
  fileName: string;
  sizeBytes: number;
  sha256: string;
  firstTime: string | null;
  lastTime: string | null;
  stationCount: number;
  sampleCount: number;
  uploadedAt: string;
  uploadedBy: string | null;
}

export interface SurveyDto extends SurveySummaryDto {
  samples: PlacedSample[];
}

type SummaryRow = Awaited<ReturnType<typeof listSurveyRows>>[number];

function summaryDto(r: SummaryRow): SurveySummaryDto {
  return {
    id: r.id,
    name: r.name,
    networkId: r.network_id,
    networkVersion: r.network_version,
    units: r.units as SurveySummaryDto["units"],
    fileName: r.file_name,
    sizeBytes: r.size_bytes,
    sha256: r.sha256,
    firstTime: r.first_time,
    lastTime: r.last_time,
    stationCount: r.station_count,
    sampleCount: r.sample_count,
    uploadedAt: r.uploaded_at.toISOString(),
    uploadedBy: r.uploaded_by_name,
  };
}


/**
 * A synoptic survey: the file is read (CSV, GeoJSON or zipped shapefile points; columns found by
 * name, units as the planner chose) and every sample placed on the basin's newest network —
 * snapped to the nearest reach by the outfalls' rules, or at the reach and km the file gives —
 * in the import worker thread. Nothing is saved while any row cannot be used: the error lists
 * each one by row and column. Kept with the original file, its SHA-256, who and when.
 */
export async function uploadSurvey(scope: BasinScope, file: { name: string; bytes: Buffer }, fields: SurveyUpload): Promise<SurveyDto> {
  scope.require("network.import");
  const { db, actor, basin } = scope;
  checkRecordFile(file, SURVEY_MAX_BYTES, "a survey");
  const format = detectFormat(file.name, file.bytes);
  const networkId = await latestNetworkId(db, basin.id);
  if (!networkId) throw new AppError("conflict", "The basin has no network yet: import one before a survey, so its stations can be placed on it");
  const reaches = (await reachLines(db, networkId)).map((r) => ({ ...r, coordinates: r.coordinates as LngLat[] }));
  const options: SurveyReadOptions = {
    temperatureUnit: fields.temperatureUnit,
    flowUnit: fields.flowUnit,
    bodKind: fields.bodKind,
    ...(fields.epsg ? { epsg: fields.epsg } : {}),
    ...(fields.columns && Object.keys(fields.columns).length ? { columns: fields.columns } : {}),
  };
  const read = await importPool()
    .survey({ format, bytes: file.bytes, fileName: file.name, options, maxSnapDistanceM: fields.maxSnapDistanceM, reaches })
    .catch((e: unknown) => {
      throw importFailure(e);
    });
  if (!read.ok) {
    const listed = read.problems.slice(0, LISTED_PROBLEMS);
    const more = read.problems.length - listed.length;
    throw new AppError(
      "invalid",
      `${file.name}: ${read.problems.length} ${read.problems.length === 1 ? "row cannot" : "rows cannot"} be used; nothing was saved${more > 0 ? ` (the first ${LISTED_PROBLEMS} are listed)` : ""}`,
      listed.map((p) => ({ path: p.row === null ? `file.${p.field}` : `file.row ${p.row}.${p.field}`, message: p.message })),
    );
  }
  const { samples, sha256 } = read;
  const times = samples.map((s) => s.time).filter((t): t is string => t !== null).sort();
  return db.transaction().execute(async (trx) => {
    const { id } = await insertSurvey(trx, {
      basin_id: basin.id,
      network_id: networkId,
      name: fields.name,
      units: JSON.stringify({ ...options, maxSnapDistanceM: fields.maxSnapDistanceM }),
      file_name: file.name,
      size_bytes: file.bytes.byteLength,
      sha256,
      content: file.bytes,
      first_time: times[0] ?? null,
      last_time: times[times.length - 1] ?? null,
      station_count: new Set(samples.map((s) => s.station)).size,
      sample_count: samples.length,
      samples: JSON.stringify(samples),
      uploaded_by: actor.id,
    });
    await insertAuditEvent(trx, {
      basinId: basin.id,
      actorId: actor.id,
      action: "survey.uploaded",
      targetType: "survey",
      targetId: id,
      details: { name: fields.name, fileName: file.name, sha256, samples: samples.length },
    });
    return surveyDto((await findSurvey(trx, basin.id, id))!);
  });
}

function surveyDto(row: NonNullable<Awaited<ReturnType<typeof findSurvey>>>): SurveyDto {
  const { samples, ...rest } = row;
  return { ...summaryDto(rest), samples: samples as PlacedSample[] };
}

export async function listSurveys(scope: BasinScope): Promise<SurveySummaryDto[]> {
  scope.require("scenario.read");
  return (await listSurveyRows(scope.db, scope.basin.id)).map(summaryDto);
}

export async function getSurvey(scope: BasinScope, surveyId: string): Promise<SurveyDto> {
  scope.require("scenario.read");
  const row = await findSurvey(scope.db, scope.basin.id, surveyId);
  if (!row) throw notFound("Survey");
  return surveyDto(row);
}
