import { basinPageAccess } from "@/lib/auth/page-access";
import { getDb } from "@/db/client";
import { listFacilities } from "@/lib/services/facilities";
import { Notice } from "@/components/ui/notice";
import { FollowButton } from "@/components/basins/follow-button";
import { followState } from "@/lib/services/follows";
import { BasinHub } from "@/components/basins/basin-hub";
import { basinOverview } from "@/lib/services/basin-overview";

const ROLE_HELP = {
  lead: "You lead this basin: you manage its members and settings, open review periods and publish final plans.",
  planner: "You plan in this basin: you import networks, run scenarios and propose plans.",
  discharger: "You represent a discharger: you will see your facility's proposed allocation and can comment during review.",
  stakeholder: "You follow this basin: you can read plans under review and comment while a review period is open.",
} as const;

export default async function BasinOverviewPage({ params }: { params: Promise<{ basinId: string }> }) {
  const { basinId } = await params;
  const access = await basinPageAccess(basinId, "basin.read");
  if (!access.ok) return null; // the layout already shows why
  const { basin, role, actor } = access;
  const db = getDb();
  const [facilities, follow, overview] = await Promise.all([
    access.can("facilities.read") ? listFacilities(access.scope) : null,
    followState(db, actor, basin.id),
    basinOverview(access.scope),
  ]);
  const us = basin.unitSystem === "US";
  return (
    <div className="grid gap-6 lg:grid-cols-3">
      <section className="card lg:col-span-2">
        <h2 className="mb-2">About this basin</h2>
        <p className="mb-4 whitespace-pre-line text-ink-soft">{basin.description || "No description yet."}</p>
        <dl className="grid grid-cols-2 gap-4 text-sm">
          <div>
            <dt className="text-ink-faint">DO criterion</dt>
            <dd className="text-lg font-semibold" data-testid="do-criterion">
              {basin.doCriterionMgL.toFixed(1)} mg/L
            </dd>
          </div>
          <div>
            <dt className="text-ink-faint">Units</dt>
            <dd className="text-lg font-semibold">{us ? "US customary (mi, cfs, lb/d)" : "SI (km, m³/s, kg/d)"}</dd>
          </div>
        </dl>
      </section>
      <section className="card">
        <h2 className="mb-2">Your part</h2>
        <p className="text-sm text-ink-soft">
          {role ? ROLE_HELP[role] : "You are a site administrator: you look after this basin's settings and members."}
        </p>
        <div className="mt-4 border-t border-rule pt-4">
          <FollowButton basinId={basin.id} followed={follow.followed} />
        </div>
      </section>
      <BasinHub basinId={basin.id} basinName={basin.name} overview={overview} unitSystem={basin.unitSystem} />
      {facilities && (
        <section className="card lg:col-span-3">
          <h2 className="mb-3">{role === "discharger" ? "Your facilities" : "Facilities"}</h2>
          {facilities.length === 0 ? (
            <p className="text-sm text-ink-soft">No facilities yet.</p>
          ) : (
            <table className="data-table">
              <thead>
                <tr>
                  <th>Facility</th>
                  <th>Permit id</th>
                  <th>Discharger contacts</th>
                </tr>
              </thead>
              <tbody>
                {facilities.map((f) => (
                  <tr key={f.id}>
                    <td>{f.name}</td>
                    <td className="whitespace-nowrap font-mono text-xs">{f.permitId}</td>
                    <td>{f.users.map((u) => u.name).join(", ") || "—"}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          )}
        </section>
      )}
      <div className="lg:col-span-3">
        <Notice tone="info">
          Allocations are planning estimates to be confirmed with a calibrated model and by a qualified engineer; the
          jurisdiction&apos;s standards and permitting rules take precedence.
        </Notice>
      </div>
    </div>
  );
}
