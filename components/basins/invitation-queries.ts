"use client";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { apiFetch } from "@/lib/queries/fetcher";
import { queryKeys } from "@/lib/queries/keys";
import type { InvitationDto } from "@/lib/services/invitations";
import type { InvitationCreateInput } from "@/lib/validation/account";

/** Under the basin's key, so invalidating the basin refreshes its invitations too. */
export const invitationKeys = {
  list: (basinId: string) => [...queryKeys.basins.detail(basinId), "invitations"] as const,
};

export const useInvitationsQuery = (basinId: string, enabled = true) =>
  useQuery({
    queryKey: invitationKeys.list(basinId),
    queryFn: () => apiFetch<InvitationDto[]>(`/api/basins/${basinId}/invitations`),
    enabled,
  });

function useInvitationMutation<I, O>(basinId: string, fn: (input: I) => Promise<O>) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: fn, onSuccess: () => qc.invalidateQueries({ queryKey: invitationKeys.list(basinId) }) });
}

export const useInviteMutation = (basinId: string) =>
  useInvitationMutation(basinId, (input: InvitationCreateInput) =>
    apiFetch<InvitationDto>(`/api/basins/${basinId}/invitations`, { method: "POST", json: input }),
  );

export const useRevokeInvitationMutation = (basinId: string) =>
  useInvitationMutation(basinId, (invitationId: string) =>
    apiFetch<void>(`/api/basins/${basinId}/invitations/${invitationId}`, { method: "DELETE" }),
  );
