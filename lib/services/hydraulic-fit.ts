import type { BasinScope } from "@/lib/auth/scope";
import { findNetwork, findReach } from "@/db/queries/networks";
import { AppError, notFound } from "@/lib/errors";
import { fitHydraulicGeometry, type PowerLawFit } from "@/lib/model/hydraulics";
import { setReachHydraulicGeometry } from "./network-edits";
import { getSurvey } from "./surveys";

export interface HydraulicFitDto {
  reachId: string;
  geometry: { a: number; b: number; c: number; f: number };
  velocity: PowerLawFit;
  depth: PowerLawFit;
  measurements: { survey: string; station: string; flowM3s: number; velocityMps: number; depthM: number }[];
}

/**
 * Hydraulic-geometry coefficients for one reach, U = a·Q^b and H = c·Q^f, fitted by least
 * squares on log–log axes (lib/model/hydraulics.ts) to the surveys' samples on that reach that
 * measured flow, velocity and depth together; written on the reach of the newest network with
 * the surveys they came from, so its velocity and depth follow each condition's flow.
 * Fewer than two distinct flows is a 422 naming the surveys.
 */
export async function fitReachHydraulicGeometry(scope: BasinScope, networkId: string, reachId: string, surveyIds: string[]): Promise<HydraulicFitDto> {
  scope.require("network.import");
  // the reach first: an id of another basin's network, or no such reach, is a 404 before anything is read
  const network = await findNetwork(scope.db, scope.basin.id, networkId);
  if (!network) throw notFound("Network");
  if (!(await findReach(scope.db, network.id, reachId))) throw notFound(`Reach ${reachId}`);
  const surveys = await Promise.all(
    surveyIds.map((id, i) =>
      getSurvey(scope, id).catch((e: unknown) => {
        if (e instanceof AppError && e.code === "not_found") throw new AppError("invalid", "There is no such survey in this basin", [{ path: `surveyIds.${i}`, message: "Unknown survey" }]);
        throw e;
      }),
    ),
  );
  const measurements = surveys.flatMap((s) =>
    s.samples
      .filter((x) => x.reach === reachId && x.flow_m3s !== null && (x.velocity_m_s ?? null) !== null && (x.depth_m ?? null) !== null)
      .map((x) => ({ survey: s.name, station: x.station, flowM3s: x.flow_m3s!, velocityMps: x.velocity_m_s!, depthM: x.depth_m! })),
  );
  let fit;
  try {
    fit = fitHydraulicGeometry(measurements.map((m) => ({ flow_m3_s: m.flowM3s, velocity_m_s: m.velocityMps, depth_m: m.depthM })));
  } catch (e) {
    if (!(e instanceof RangeError)) throw e;
    throw new AppError(
      "invalid",
      `Reach ${reachId}: the surveys hold ${measurements.length} sample(s) with flow, velocity and depth measured together; a fit needs at least two at different flows`,
      [{ path: "surveyIds", message: e.message }],
    );
  }
  await setReachHydraulicGeometry(scope, networkId, reachId, fit.geometry, {
    surveys: surveys.map((s) => ({ id: s.id, name: s.name, sha256: s.sha256 })),
    measurements: measurements.length,
    r2Velocity: fit.velocity.r2,
    r2Depth: fit.depth.r2,
    fittedAt: new Date().toISOString(),
  });
  return { reachId, geometry: fit.geometry, velocity: fit.velocity, depth: fit.depth, measurements };
}
