"use client";
import { useState } from "react";
import { Notice } from "@/components/ui/notice";
import { RoleBadge } from "@/components/ui/role-badge";
import { useInvitationsQuery, useRevokeInvitationMutation } from "@/lib/queries/invitations";

const when = (iso: string) => new Date(iso).toLocaleDateString("en-GB", { day: "numeric", month: "short", year: "numeric" });

/** Invitations not yet accepted, with revoke (leads only). */
export function PendingInvitations({ basinId }: { basinId: string }) {
  const invitations = useInvitationsQuery(basinId);
  const revoke = useRevokeInvitationMutation(basinId);
  const [failure, setFailure] = useState<string | null>(null);
  if (invitations.isPending) return <p className="text-ink-faint">Loading invitations…</p>;
  if (invitations.error) return <Notice tone="error">{invitations.error.message}</Notice>;
  if (invitations.data.length === 0) return <p className="text-sm text-ink-soft">No open invitations.</p>;
  return (
    <div className="space-y-2">
      {failure && <Notice tone="error">{failure}</Notice>}
      <div className="overflow-x-auto">
      <table className="data-table" data-testid="invitations-table">
        <thead>
          <tr>
            <th>E-mail</th>
            <th>Role</th>
            <th>Facility</th>
            <th>Invited by</th>
            <th>Works until</th>
            <th />
          </tr>
        </thead>
        <tbody>
          {invitations.data.map((i) => (
            <tr key={i.id}>
              <td>{i.email}</td>
              <td>
                <RoleBadge role={i.role} />
              </td>
              <td>{i.facilityName ?? "—"}</td>
              <td>{i.invitedBy ?? "—"}</td>
              <td className="whitespace-nowrap">{i.status === "expired" ? <span className="text-clay-700">expired</span> : when(i.expiresAt)}</td>
              <td>
                <button
                  type="button"
                  className="text-xs text-clay-700 underline"
                  onClick={() => {
                    if (!window.confirm(`Revoke the invitation of ${i.email}? Its link stops working at once.`)) return;
                    setFailure(null);
                    revoke.mutate(i.id, { onError: (e) => setFailure(e.message) });
                  }}
                >
                  revoke
                </button>
              </td>
            </tr>
          ))}
        </tbody>
      </table>
      </div>
    </div>
  );
}
