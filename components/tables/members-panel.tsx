"use client";
import { useCallback, useState } from "react";
import { AddFacilityForm } from "@/components/forms/add-facility-form";
import { PendingInvitations } from "@/components/basins/pending-invitations";
import { AddMemberForm } from "@/components/forms/add-member-form";
import { InviteMemberForm } from "@/components/forms/invite-member-form";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import type { BasinRole } from "@/lib/domain";
import type { MemberDto } from "@/lib/services/dto";
import {
  useChangeRoleMutation,
  useFacilitiesQuery,
  useLinkFacilityMutation,
  useMembersQuery,
  useRemoveMemberMutation,
  useUnlinkFacilityMutation,
} from "@/lib/queries/members";
import { MembersTable } from "./members-table";

export function MembersPanel({
  basinId,
  canManage,
  canManageFacilities,
  me,
}: {
  basinId: string;
  canManage: boolean;
  canManageFacilities: boolean;
  me: string;
}) {
  const members = useMembersQuery(basinId);
  const facilities = useFacilitiesQuery(basinId);
  const changeRole = useChangeRoleMutation(basinId);
  const remove = useRemoveMemberMutation(basinId);
  const link = useLinkFacilityMutation(basinId);
  const unlink = useUnlinkFacilityMutation(basinId);
  const [failure, setFailure] = useState<string | null>(null);
  const [linkChoice, setLinkChoice] = useState<Record<string, string>>({});

  const report = useCallback((e: unknown) => setFailure(e instanceof Error ? e.message : String(e)), []);
  const onRoleChange = useCallback(
    (userId: string, role: BasinRole) => {
      setFailure(null);
      changeRole.mutate({ userId, role }, { onError: report });
    },
    [changeRole, report],
  );
  const onRemove = useCallback(
    (m: MemberDto) => {
      if (!window.confirm(`Remove ${m.name} from this basin? They lose access at once.`)) return;
      setFailure(null);
      remove.mutate(m.userId, { onError: report });
    },
    [remove, report],
  );

  const dischargers = (members.data ?? []).filter((m) => m.role === "discharger");

  return (
    <div className="space-y-8">
      {failure && <Notice tone="error">{failure}</Notice>}
      <section className="card">
        <h2 className="mb-3">Members</h2>
        {members.isPending && <p className="text-ink-faint">Loading…</p>}
        {members.error && <Notice tone="error">{members.error.message}</Notice>}
        {members.data && (
          <MembersTable members={members.data} canManage={canManage} me={me} onRoleChange={onRoleChange} onRemove={onRemove} />
        )}
        {canManage && (
          <div className="mt-6 border-t border-rule pt-4">
            <AddMemberForm basinId={basinId} />
          </div>
        )}
      </section>

      {canManage && (
        <section className="card">
          <h2 className="mb-1">Invitations</h2>
          <p className="mb-3 text-sm text-ink-soft">
            Invite anyone by e-mail, with or without a Sagline account. The link works once, for 14 days; a discharger
            invitation links the person to the facility you choose.
          </p>
          <InviteMemberForm basinId={basinId} facilities={facilities.data ?? []} />
          <div className="mt-6 border-t border-rule pt-4">
            <h3 className="mb-2 text-sm font-semibold">Open invitations</h3>
            <PendingInvitations basinId={basinId} />
          </div>
        </section>
      )}

      <section className="card">
        <h2 className="mb-1">Facilities and their discharger contacts</h2>
        <p className="mb-3 text-sm text-ink-soft">
          A facility keeps its identity (by permit id) across network versions. Linked discharger members see its
          allocation.
        </p>
        {facilities.error && <Notice tone="error">{facilities.error.message}</Notice>}
        {facilities.data && facilities.data.length === 0 && <p className="text-sm text-ink-soft">No facilities yet.</p>}
        {facilities.data && facilities.data.length > 0 && (
          <div className="overflow-x-auto">
          <table className="data-table" data-testid="facilities-table">
            <thead>
              <tr>
                <th>Facility</th>
                <th>Permit id</th>
                <th>Linked dischargers</th>
                {canManage && <th>Link a discharger</th>}
              </tr>
            </thead>
            <tbody>
              {facilities.data.map((f) => {
                const candidates = dischargers.filter((d) => !f.users.some((u) => u.id === d.userId));
                return (
                  <tr key={f.id}>
                    <td className="font-medium">{f.name}</td>
                    <td className="whitespace-nowrap font-mono text-xs">{f.permitId}</td>
                    <td>
                      {f.users.length === 0 && <span className="text-ink-faint">none</span>}
                      <ul>
                        {f.users.map((u) => (
                          <li key={u.id} className="flex items-center gap-2">
                            {u.name}
                            {canManage && (
                              <button
                                type="button"
                                className="text-xs text-clay-700 underline"
                                onClick={() => unlink.mutate({ facilityId: f.id, userId: u.id }, { onError: report })}
                              >
                                unlink
                              </button>
                            )}
                          </li>
                        ))}
                      </ul>
                    </td>
                    {canManage && (
                      <td>
                        {candidates.length === 0 ? (
                          <span className="text-xs text-ink-faint">No other discharger members</span>
                        ) : (
                          <div className="flex gap-2">
                            <select
                              aria-label={`Discharger to link to ${f.name}`}
                              className="rounded border border-rule-strong bg-paper-raised px-2 py-1 text-sm"
                              value={linkChoice[f.id] ?? ""}
                              onChange={(e) => setLinkChoice((c) => ({ ...c, [f.id]: e.target.value }))}
                            >
                              <option value="">Choose…</option>
                              {candidates.map((d) => (
                                <option key={d.userId} value={d.userId}>
                                  {d.name}
                                </option>
                              ))}
                            </select>
                            <Button
                              variant="secondary"
                              className="px-2 py-1"
                              disabled={!linkChoice[f.id]}
                              onClick={() =>
                                link.mutate({ facilityId: f.id, userId: linkChoice[f.id] }, { onError: report })
                              }
                            >
                              Link
                            </Button>
                          </div>
                        )}
                      </td>
                    )}
                  </tr>
                );
              })}
            </tbody>
          </table>
          </div>
        )}
        {canManageFacilities && (
          <div className="mt-6 border-t border-rule pt-4">
            <AddFacilityForm basinId={basinId} />
          </div>
        )}
      </section>
    </div>
  );
}
