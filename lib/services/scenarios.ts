import type { Db } from "@/db/client";
import { insertAuditEvent } from "@/db/queries/audit";
import { findNetwork, latestNetworkId, networkOutfalls, networkReaches, reachKeys as networkReachKeys } from "@/db/queries/networks";
import {
  countRuns,
  deleteScenario as deleteScenarioRow,
  findRun,
  findScenario,
  findScenarioByName,
  insertScenario,
  listScenarios as listScenarioRows,
  updateScenarioIfVersion,
} from "@/db/queries/scenarios";
import type { BasinScope } from "@/lib/auth/scope";
import { AppError, conflict, notFound } from "@/lib/errors";
import type { NetworkForModel } from "@/lib/scenarios/build-model-file";
import type { RunPayload } from "@/lib/model/run-payload";
import { scenarioInputsSchema, type FittedKineticsSource, type GaugeFlowSource, type TemperatureFromSource, type ScenarioCreate, type ScenarioInputs, type ScenarioUpdate } from "@/lib/validation/scenario";
import { findGaugeRecord } from "@/db/queries/gauges";
import type { LowFlowReport } from "@/lib/hydrology/low-flow";
import { transferByDrainageArea } from "@/lib/hydrology/transfer";
import { designTemperature, type DailyValue } from "@/lib/hydrology/design-temperature";
import { findTemperatureRecord } from "@/db/queries/temperature-records";

export interface ScenarioDto {
  id: string;
  name: string;
  description: string;
  networkId: string;
  networkVersion: number;
  inputs: ScenarioInputs;
  version: number;
  updatedAt: string;
  updatedBy: string | null;
}

type Row = NonNullable<Awaited<ReturnType<typeof findScenario>>>;
const dto = (s: Row): ScenarioDto => ({
  id: s.id,
  name: s.name,
  description: s.description,
  networkId: s.network_id,
  networkVersion: s.network_version,
  inputs: scenarioInputsSchema.parse(s.inputs),
  version: s.version,
  updatedAt: s.updated_at.toISOString(),
  updatedBy: s.updated_by_name,
});

/** A saved network in the shape the model-file builder takes. */
export async function loadNetworkForModel(db: Db, networkId: string): Promise<NetworkForModel> {
  const [reaches, outfalls] = await Promise.all([networkReaches(db, networkId), networkOutfalls(db, networkId)]);
  return {
    reaches: reaches.map((r) => ({ id: r.reach_key, downstreamId: r.downstream_key, lengthKm: r.length_km, attributes: r.attributes })),
    outfalls: outfalls.map((o) => ({ permitId: o.permit_id, reachId: o.reach_key, chainageKm: o.chainage_km, attributes: o.attributes })),
  };
}

const nameTaken = (name: string) => conflict(`A scenario named "${name}" already exists in this basin`, [{ path: "name", message: "Already in use" }]);

export async function listScenarios(scope: BasinScope): Promise<ScenarioDto[]> {
  scope.require("scenario.read");
  const { db, basin } = scope;
  return (await listScenarioRows(db, basin.id)).map(dto);
}

export async function getScenario(scope: BasinScope, scenarioId: string): Promise<ScenarioDto> {
  scope.require("scenario.read");
  const { db, basin } = scope;
  const s = await findScenario(db, basin.id, scenarioId);
  if (!s) throw notFound("Scenario");
  return dto(s);
}

/**
 * Fill in each gauge-based condition's source from the gauge record as it is now (its
 * statistic's value, name, station, reach, checksum, period): what a run, and a plan, will
 * say its design flow came from. 422 naming the condition's field when the record is not
 * this basin's, stands on no reach, or gives no value for the statistic.
 */
async function withGaugeSources(db: Db, basinId: string, networkId: string, inputs: ScenarioInputs): Promise<ScenarioInputs> {
  if (!inputs.conditions.some((c) => c.gaugeFlow)) return inputs;
  const conditions = await Promise.all(
    inputs.conditions.map(async (c, i) => {
      if (!c.gaugeFlow) return c;
      const path = `inputs.conditions.${i}.gaugeFlow`;
      const refuse = (field: string, message: string) => new AppError("invalid", `Condition "${c.name}": ${message}`, [{ path: `${path}.${field}`, message }]);
      const g = await findGaugeRecord(db, basinId, c.gaugeFlow.gaugeId);
      if (!g) throw refuse("gaugeId", "no such gauge record in this basin");
      if (!g.reach_key) throw refuse("gaugeId", `the gauge record "${g.name}" is not placed on a reach; upload it again naming the reach it stands on`);
      const report = g.statistics as LowFlowReport;
      const value = report.statistics.find((s) => s.name === c.gaugeFlow!.statistic)?.value ?? null;
      if (value === null || !(value > 0)) throw refuse("statistic", `the record "${g.name}" gives no ${c.gaugeFlow.statistic} above zero (too few years to fit, or a zero low flow)`);
      const source: GaugeFlowSource = {
        valueM3s: value,
        gaugeName: g.name,
        stationCode: g.station_code,
        reachId: g.reach_key,
        sha256: g.sha256,
        firstDay: g.first_day,
        lastDay: g.last_day,
        yearsUsed: report.years_used,
      };
      if (c.gaugeFlow.headwaters === "drainage-area") {
        const reaches = await networkReaches(db, networkId);
        const area = (r: (typeof reaches)[number] | undefined) => {
          const a = (r?.attributes as Record<string, unknown> | undefined)?.drainageAreaKm2;
          return typeof a === "number" && a > 0 ? a : undefined;
        };
        const gaugeArea = area(reaches.find((r) => r.reach_key === g.reach_key));
        if (gaugeArea === undefined) throw refuse("headwaters", `the gauge's reach ${g.reach_key} has no drainage area; enter it in the network table, or scale every reach instead`);
        const fed = new Set(reaches.map((r) => r.downstream_key).filter(Boolean));
        const heads = reaches.filter((r) => !fed.has(r.reach_key));
        const withArea = heads.filter((r) => area(r) !== undefined && c.reachFlowsM3s[r.reach_key] === undefined);
        source.transfers = {
          gaugeAreaKm2: gaugeArea,
          exponent: c.gaugeFlow.areaExponent,
          headwaters: withArea.map((r) => {
            const t = transferByDrainageArea(value, gaugeArea, area(r)!, c.gaugeFlow!.areaExponent, g.name);
            return { reach: r.reach_key, areaKm2: area(r)!, ratio: t.ratio, flowM3s: t.flow, rule: t.rule };
          }),
          scaled: heads.filter((r) => !withArea.includes(r)).map((r) => r.reach_key),
        };
      }
      return { ...c, gaugeFlow: { ...c.gaugeFlow, source } };
    }),
  );
  return { ...inputs, conditions };
}

/**
 * The scenario's fitted coefficients with their source read from the calibration run as it is
 * now (what a client sent as the source is replaced): the run must be a finished calibration
 * of this basin, fitted over reaches the scenario's network has.
 */
async function withFittedKinetics(db: Db, basinId: string, networkId: string, inputs: ScenarioInputs): Promise<ScenarioInputs> {
  if (!inputs.fittedKinetics) return inputs;
  const path = "inputs.fittedKinetics.runId";
  const refuse = (message: string) => new AppError("invalid", message, [{ path, message }]);
  const run = await findRun(db, basinId, inputs.fittedKinetics.runId, true);
  if (!run || run.kind !== "calibration") throw refuse("There is no such calibration in this basin");
  const calibration = ((run as { result?: unknown }).result as RunPayload | null)?.calibration;
  if (run.status !== "done" || !calibration || !run.finished_at) throw refuse("The calibration has not finished: use it once it has");
  const have = new Set(await networkReachKeys(db, networkId));
  const missing = calibration.parameters.flatMap((p) => p.reaches).find((id) => !have.has(id));
  if (missing) throw refuse(`The calibration fitted reach ${missing}, which this scenario's network does not have`);
  const source: FittedKineticsSource = {
    name: calibration.name ?? null,
    surveyName: calibration.survey.name,
    surveySha256: calibration.survey.sha256,
    surveyFirstTime: calibration.survey.firstTime,
    condition: calibration.condition,
    finishedAt: run.finished_at.toISOString(),
    rmseMgL: calibration.rmse_mg_l,
    biasMgL: calibration.bias_mg_l,
    nse: calibration.nse,
    samples: calibration.residuals.length,
    parameters: calibration.parameters.map((p) => ({ parameter: p.parameter, reaches: p.reaches, value: p.value, stdError: p.std_error })),
    validation: calibration.validation
      ? {
          surveyName: calibration.validation.survey.name,
          rmseMgL: calibration.validation.rmse_mg_l,
          biasMgL: calibration.validation.bias_mg_l,
          nse: calibration.validation.nse,
          samples: calibration.validation.residuals.length,
        }
      : null,
  };
  return { ...inputs, fittedKinetics: { runId: run.id, source } };
}

/**
 * Each condition's design temperature worked out from its temperature record by its rule (the
 * record as it is now; what a client sent as the value or the source is replaced).
 */
async function withTemperatureSources(db: Db, basinId: string, inputs: ScenarioInputs): Promise<ScenarioInputs> {
  if (!inputs.conditions.some((c) => c.temperatureFrom)) return inputs;
  const conditions = await Promise.all(
    inputs.conditions.map(async (c, i) => {
      if (!c.temperatureFrom) return c;
      const path = `inputs.conditions.${i}.temperatureFrom`;
      const refuse = (field: string, message: string) => new AppError("invalid", `Condition "${c.name}": ${message}`, [{ path: `${path}.${field}`, message }]);
      const record = await findTemperatureRecord(db, basinId, c.temperatureFrom.recordId);
      if (!record) throw refuse("recordId", "no such temperature record in this basin");
      let t;
      try {
        t = designTemperature(record.days as DailyValue[], { months: c.temperatureFrom.months, percentile: c.temperatureFrom.percentile });
      } catch (e) {
        if (e instanceof RangeError) throw refuse("months", `the record "${record.name}": ${e.message}`);
        throw e;
      }
      const valueC = Math.round(t.value_c * 100) / 100;
      const source: TemperatureFromSource = {
        valueC,
        recordName: record.name,
        stationCode: record.station_code,
        sha256: record.sha256,
        rule: t.rule,
        daysUsed: t.days_used,
        daysMissing: t.days_missing,
      };
      return { ...c, temperatureC: valueC, temperatureFrom: { recordId: record.id, percentile: c.temperatureFrom.percentile, months: c.temperatureFrom.months, source } };
    }),
  );
  return { ...inputs, conditions };
}

/** What a scenario's inputs carry from outside themselves (gauge statistics, temperature records, fitted coefficients), resolved as they are now. */
const resolveSources = async (db: Db, basinId: string, networkId: string, inputs: ScenarioInputs) =>
  withFittedKinetics(db, basinId, networkId, await withTemperatureSources(db, basinId, await withGaugeSources(db, basinId, networkId, inputs)));

export async function createScenario(scope: BasinScope, input: ScenarioCreate): Promise<ScenarioDto> {
  scope.require("scenario.edit");
  const { db, actor, basin } = scope;
  return db.transaction().execute(async (trx) => {
    const networkId = input.networkId ?? (await latestNetworkId(trx, basin.id));
    if (!networkId || !(await findNetwork(trx, basin.id, networkId))) {
      throw new AppError("invalid", "Import a network into this basin before creating scenarios", [
        { path: "networkId", message: "No such network in this basin" },
      ]);
    }
    if (await findScenarioByName(trx, basin.id, input.name)) throw nameTaken(input.name);
    const { id } = await insertScenario(trx, {
      basinId: basin.id,
      networkId,
      name: input.name,
      description: input.description,
      inputs: await resolveSources(trx, basin.id, networkId, input.inputs),
      userId: actor.id,
    });
    await insertAuditEvent(trx, { basinId: basin.id, actorId: actor.id, action: "scenario.created", targetType: "scenario", targetId: id, details: { name: input.name } });
    return dto((await findScenario(trx, basin.id, id))!);
  });
}

/** Save an edit made from `version`; a stale version gets 409 and nothing is written. */
export async function updateScenario(scope: BasinScope,
  scenarioId: string,
  input: ScenarioUpdate,
): Promise<ScenarioDto> {
  scope.require("scenario.edit");
  const { db, actor, basin } = scope;
  return db.transaction().execute(async (trx) => {
    const current = await findScenario(trx, basin.id, scenarioId);
    if (!current) throw notFound("Scenario");
    if (input.name && input.name !== current.name && (await findScenarioByName(trx, basin.id, input.name))) throw nameTaken(input.name);
    const patch = input.inputs ? { ...input, inputs: await resolveSources(trx, basin.id, current.network_id, input.inputs) } : input;
    const ok = await updateScenarioIfVersion(trx, current.id, input.version, patch, actor.id);
    if (!ok) {
      throw conflict(
        `Someone saved this scenario after you opened it (now version ${current.version}${current.updated_by_name ? `, by ${current.updated_by_name}` : ""}); reload it and apply your change again`,
        [{ path: "version", message: `Stale: current version is ${current.version}` }],
      );
    }
    await insertAuditEvent(trx, {
      basinId: basin.id,
      actorId: actor.id,
      action: "scenario.updated",
      targetType: "scenario",
      targetId: current.id,
      details: { fromVersion: input.version },
    });
    return dto((await findScenario(trx, basin.id, current.id))!);
  });
}

export async function duplicateScenario(scope: BasinScope, scenarioId: string, name: string): Promise<ScenarioDto> {
  const source = await getScenario(scope, scenarioId);
  return createScenario(scope, {
    name,
    description: source.description,
    networkId: source.networkId,
    inputs: source.inputs,
  });
}

/** Delete a scenario that has never been run (runs keep their scenario for traceability). */
export async function deleteScenario(scope: BasinScope, scenarioId: string): Promise<void> {
  scope.require("scenario.edit");
  const { db, actor, basin } = scope;
  await db.transaction().execute(async (trx) => {
    const s = await findScenario(trx, basin.id, scenarioId);
    if (!s) throw notFound("Scenario");
    const runs = await countRuns(trx, s.id);
    if (runs > 0) throw conflict(`"${s.name}" has ${runs} run(s) and is kept so they stay traceable; duplicate it to start afresh`);
    await deleteScenarioRow(trx, s.id);
    await insertAuditEvent(trx, { basinId: basin.id, actorId: actor.id, action: "scenario.deleted", targetType: "scenario", targetId: s.id, details: { name: s.name } });
  });
}
