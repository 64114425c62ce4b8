"use client";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { AcceptedDto, InvitationDto } from "@/lib/services/invitations";
import type { InvitationCreateInput, InvitationRegisterInput } from "@/lib/validation/account";
import { apiFetch } from "./fetcher";
import { invalidate } from "./invalidate";
import { invalidations, queryKeys } from "./keys";

const basinInvitationsUrl = (basinId: string) => `/api/basins/${basinId}/invitations`;
const tokenUrl = (token: string) => `/api/invitations/${encodeURIComponent(token)}`;

/** The basin's invitations not yet accepted (leads). */
export const useInvitationsQuery = (basinId: string, enabled = true) =>
  useQuery({
    queryKey: queryKeys.basins.invitations(basinId),
    queryFn: () => apiFetch<InvitationDto[]>(basinInvitationsUrl(basinId)),
    enabled,
  });

export function useInviteMutation(basinId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: InvitationCreateInput) => apiFetch<InvitationDto>(basinInvitationsUrl(basinId), { method: "POST", json: input }),
    onSuccess: () => invalidate(qc, invalidations.invite(basinId)),
  });
}

export function useRevokeInvitationMutation(basinId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (invitationId: string) => apiFetch<void>(`${basinInvitationsUrl(basinId)}/${invitationId}`, { method: "DELETE" }),
    onSuccess: () => invalidate(qc, invalidations.revokeInvitation(basinId)),
  });
}

/** Signed in as the invited address: join the basin the link invites to. */
export function useAcceptInvitationMutation(token: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => apiFetch<AcceptedDto>(`${tokenUrl(token)}/accept`, { method: "POST" }),
    onSuccess: (done) => invalidate(qc, invalidations.acceptInvitation(done.basinId)),
  });
}

/** Signed out: create the invited account (the link confirms the address) and join. */
export function useRegisterByInvitationMutation(token: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: InvitationRegisterInput) => apiFetch<AcceptedDto>(`${tokenUrl(token)}/register`, { method: "POST", json: input }),
    onSuccess: (done) => invalidate(qc, invalidations.acceptInvitation(done.basinId)),
  });
}
