import { insertAuditEvent } from "@/db/queries/audit";
import { findGaugeRecord, insertGaugeRecord, listGaugeRecords as listGaugeRows } from "@/db/queries/gauges";
import { latestNetworkId, reachKeys } from "@/db/queries/networks";
import type { BasinScope } from "@/lib/auth/scope";
import { notFound } from "@/lib/errors";
import { importPool } from "@/lib/compute/import-pool";
import type { DesignFlowResult, LowFlowReport } from "@/lib/hydrology/low-flow";
import type { GaugeUpload } from "@/lib/validation/gauges";
import { checkReachOnNewestNetwork, checkRecordFile, fileProblem } from "./field-records";
import { importFailure } from "./imports";

/** The most bytes a daily record may have: 200 years of daily rdb text is under 10 MB. */
export const GAUGE_RECORD_MAX_BYTES = 10 * 1024 * 1024;

export interface GaugeSummaryDto {
  id: string;
  name: string;
  stationCode: string | null;
  reachId: string | null;
  /** The unit the file was read in; every flow Sagline reports from it is in m³/s. */
  unit: "m3/s" | "cfs";
  climaticYearStart: string;
  fileName: string;
  sizeBytes: number;
  sha256: string;
  firstDay: string;
  lastDay: string;
  dayCount: number;
  missingDays: number;
  uploadedAt: string;
  uploadedBy: string | null;
  designFlows: DesignFlowResult[];
}

export interface GaugeDto extends GaugeSummaryDto {
  /** Everything the statistics were computed from and with (lib/hydrology/low-flow.ts). */
  statistics: LowFlowReport;
}

type SummaryRow = Awaited<ReturnType<typeof listGaugeRows>>[number];

function summaryDto(r: Omit<SummaryRow, "design_flows">, designFlows: DesignFlowResult[]): GaugeSummaryDto {
  return {
    id: r.id,
    name: r.name,
    stationCode: r.station_code,
    reachId: r.reach_key,
    unit: r.unit,
    climaticYearStart: r.climatic_year_start,
    fileName: r.file_name,
    sizeBytes: r.size_bytes,
    sha256: r.sha256,
    firstDay: r.first_day,
    lastDay: r.last_day,
    dayCount: r.day_count,
    missingDays: r.missing_days,
    uploadedAt: r.uploaded_at.toISOString(),
    uploadedBy: r.uploaded_by_name,
    designFlows,
  };
}


/**
 * A gauge's daily flow record: the file is read (CSV `date,flow` or rdb text, in the unit the
 * planner chose), its low-flow statistics computed (n-day minima by climatic year, log-Pearson
 * Type III) and both kept with who uploaded it, when, and the file's SHA-256. Nothing is saved
 * when the file cannot be read; the error names the line at fault.
 */
export async function uploadGaugeRecord(scope: BasinScope, file: { name: string; bytes: Buffer }, fields: GaugeUpload): Promise<GaugeDto> {
  scope.require("network.import");
  const { db, actor, basin } = scope;
  checkRecordFile(file, GAUGE_RECORD_MAX_BYTES, "a daily record");
  // reading and the statistics run in the import worker thread: a century of daily rdb text takes a second
  const read = await importPool()
    .gauge({ bytes: file.bytes, fileName: file.name, unit: fields.unit, climaticYearStart: fields.climaticYearStart })
    .catch((e: unknown) => {
      throw importFailure(e);
    });
  if (!read.ok) throw fileProblem(read.message);
  const { report, sha256 } = read;
  if (fields.reachId !== undefined) await checkReachOnNewestNetwork(db, basin.id, fields.reachId);
  return db.transaction().execute(async (trx) => {
    const { id } = await insertGaugeRecord(trx, {
      basin_id: basin.id,
      name: fields.name,
      station_code: fields.stationCode ?? null,
      reach_key: fields.reachId ?? null,
      unit: fields.unit,
      climatic_year_start: fields.climaticYearStart,
      file_name: file.name,
      size_bytes: file.bytes.byteLength,
      sha256,
      content: file.bytes,
      first_day: read.firstDay,
      last_day: read.lastDay,
      day_count: read.dayCount,
      missing_days: read.missingDays,
      statistics: JSON.stringify(report),
      uploaded_by: actor.id,
    });
    await insertAuditEvent(trx, {
      basinId: basin.id,
      actorId: actor.id,
      action: "gauge.uploaded",
      targetType: "gauge",
      targetId: id,
      details: { name: fields.name, fileName: file.name, sha256, yearsUsed: report.years_used },
    });
    const row = await findGaugeRecord(trx, basin.id, id);
    const { statistics, ...rest } = row!;
    return { ...summaryDto(rest, report.statistics), statistics: statistics as LowFlowReport };
  });
}

export async function listGaugeRecords(scope: BasinScope): Promise<GaugeSummaryDto[]> {
  scope.require("scenario.read");
  return (await listGaugeRows(scope.db, scope.basin.id)).map(({ design_flows, ...r }) => summaryDto(r, design_flows as DesignFlowResult[]));
}

export async function getGaugeRecord(scope: BasinScope, gaugeId: string): Promise<GaugeDto> {
  scope.require("scenario.read");
  const row = await findGaugeRecord(scope.db, scope.basin.id, gaugeId);
  if (!row) throw notFound("Gauge record");
  const { statistics, ...rest } = row;
  const report = statistics as LowFlowReport;
  return { ...summaryDto(rest, report.statistics), statistics: report };
}

/** The reaches a new record may be placed on: the newest network version's. */
export async function gaugeReachChoices(scope: BasinScope): Promise<string[]> {
  scope.require("network.import");
  const networkId = await latestNetworkId(scope.db, scope.basin.id);
  return networkId ? reachKeys(scope.db, networkId) : [];
}
