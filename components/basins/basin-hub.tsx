import Link from "next/link";
import { When } from "@/components/layout/basin-zone";
import { RunOutcomeCell } from "@/components/scenarios/run-outcome-cell";
import { AuditTable } from "@/components/tables/audit-table";
import type { UnitSystem } from "@/lib/domain";
import { formatIn, unitLabel } from "@/lib/format/quantities";
import type { BasinOverviewDto, PlanOverviewDto } from "@/lib/services/basin-overview";

function PlanDates({ plan }: { plan: PlanOverviewDto }) {
  if (plan.publishedAt) {
    return (
      <>
        published <When at={plan.publishedAt} day />
      </>
    );
  }
  if (plan.review) {
    return (
      <>
        review <When at={plan.review.startsAt} day /> – <When at={plan.review.endsAt} day />
      </>
    );
  }
  return (
    <>
      proposed <When at={plan.createdAt} day />
      {plan.createdBy ? ` by ${plan.createdBy}` : ""}
    </>
  );
}

/**
 * The basin's hub: its current network, scenarios with what their latest run came to,
 * plans with their state and dates, and recent activity — each part only when the
 * reader may read it (the service leaves the others out).
 */
export function BasinHub({
  basinId,
  basinName,
  overview,
  unitSystem,
}: {
  basinId: string;
  basinName: string;
  overview: BasinOverviewDto;
  unitSystem: UnitSystem;
}) {
  const { network, scenarios, plans, activity } = overview;
  const base = `/basins/${basinId}`;
  return (
    <>
      {scenarios !== null && (
        <section className="card" data-testid="hub-network">
          <h2 className="mb-2">Network</h2>
          {network ? (
            <>
              <p className="text-lg font-semibold">Version {network.version}</p>
              <p className="text-sm text-ink-soft">
                {network.reachCount} reaches · {network.outfallCount} outfalls · {formatIn("length", network.totalLengthKm, unitSystem)}{" "}
                {unitLabel("length", unitSystem)}
              </p>
              <p className="mt-1 text-xs text-ink-faint">
                Saved <When at={network.createdAt} />
                {network.createdBy ? ` by ${network.createdBy}` : ""}
              </p>
              {network.note && <p className="mt-1 text-sm text-ink-soft">{network.note}</p>}
              <Link href={`${base}/network`} className="mt-3 inline-block text-sm">
                Open the network
              </Link>
            </>
          ) : (
            <p className="text-sm text-ink-soft">
              No network yet. <Link href={`${base}/network`}>Import reaches and dischargers</Link> to begin.
            </p>
          )}
        </section>
      )}

      {scenarios !== null && (
        <section className="card lg:col-span-2" data-testid="hub-scenarios">
          <div className="mb-3 flex flex-wrap items-baseline justify-between gap-2">
            <h2>Scenarios</h2>
            <Link href={`${base}/scenarios`} className="text-sm">
              All scenarios and runs
            </Link>
          </div>
          {scenarios.length === 0 ? (
            <p className="text-sm text-ink-soft">No scenarios yet.</p>
          ) : (
            <div className="overflow-x-auto">
              <table className="data-table">
                <thead>
                  <tr>
                    <th>Scenario</th>
                    <th>Network</th>
                    <th>Latest finished run</th>
                  </tr>
                </thead>
                <tbody>
                  {scenarios.map((s) => (
                    <tr key={s.id}>
                      <td>
                        <Link href={`${base}/scenarios/${s.id}`} className="font-medium">
                          {s.name}
                        </Link>
                      </td>
                      <td className="text-sm">
                        v{s.networkVersion}
                        {s.newerNetwork && <span className="block text-xs text-ochre-700">a newer version exists</span>}
                      </td>
                      <td className="text-sm">
                        {s.latestRun ? (
                          <Link href={`${base}/runs/${s.latestRun.id}`} className="no-underline">
                            <span className="block text-xs text-ink-faint">{s.latestRun.kind === "allocation" ? "Allocation" : "Model"} run</span>
                            <RunOutcomeCell outcome={s.latestRun.outcome} />
                          </Link>
                        ) : (
                          <span className="text-ink-faint">not run yet</span>
                        )}
                      </td>
                    </tr>
                  ))}
                </tbody>
              </table>
            </div>
          )}
        </section>
      )}

      <section className="card lg:col-span-3" data-testid="hub-plans">
        <div className="mb-3 flex flex-wrap items-baseline justify-between gap-2">
          <h2>Plans</h2>
          <Link href={`${base}/plans`} className="text-sm">
            All plans
          </Link>
        </div>
        {plans.length === 0 ? (
          <p className="text-sm text-ink-soft">{scenarios !== null ? "No plans proposed yet." : "No plan is under review or published yet."}</p>
        ) : (
          <ul className="divide-y divide-rule">
            {plans.map((p) => (
              <li key={p.id} className="flex flex-wrap items-baseline justify-between gap-x-4 gap-y-1 py-2">
                <Link href={`${base}/plans/${p.id}`} className="font-medium">
                  {p.title} <span className="text-xs text-ink-faint">v{p.version}</span>
                </Link>
                <span className="text-sm">
                  <span className="font-medium">{p.stageText}</span>
                  <span className="text-ink-soft">
                    {" · "}
                    <PlanDates plan={p} />
                  </span>
                </span>
              </li>
            ))}
          </ul>
        )}
      </section>

      {activity !== null && (
        <section className="card min-w-0 lg:col-span-3" data-testid="hub-activity">
          <div className="mb-3 flex flex-wrap items-baseline justify-between gap-2">
            <h2>Recent activity</h2>
            <Link href={`${base}/audit`} className="text-sm">
              Whole audit trail
            </Link>
          </div>
          <div className="overflow-x-auto">
            <AuditTable basinId={basinId} basinName={basinName} events={activity} />
          </div>
        </section>
      )}
    </>
  );
}
