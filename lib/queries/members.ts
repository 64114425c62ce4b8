"use client";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { BasinRole } from "@/db/schema";
import type { FacilityDto, MemberDto, UserDto } from "@/lib/services/dto";
import type { FacilityCreateInput, MemberAddInput } from "@/lib/validation/member";
import type { UserCreateInput } from "@/lib/validation/user";
import { apiFetch } from "./fetcher";
import { queryKeys } from "./keys";

export const useMembersQuery = (basinId: string) =>
  useQuery({
    queryKey: queryKeys.basins.members(basinId),
    queryFn: () => apiFetch<MemberDto[]>(`/api/basins/${basinId}/members`),
  });

export const useFacilitiesQuery = (basinId: string) =>
  useQuery({
    queryKey: queryKeys.basins.facilities(basinId),
    queryFn: () => apiFetch<FacilityDto[]>(`/api/basins/${basinId}/facilities`),
  });

/** Every member mutation refreshes the member and facility lists of the basin. */
function useBasinMutation<I, O>(basinId: string, fn: (input: I) => Promise<O>) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: fn,
    onSuccess: () =>
      Promise.all([
        qc.invalidateQueries({ queryKey: queryKeys.basins.members(basinId) }),
        qc.invalidateQueries({ queryKey: queryKeys.basins.facilities(basinId) }),
      ]),
  });
}

export const useAddMemberMutation = (basinId: string) =>
  useBasinMutation(basinId, (input: MemberAddInput) =>
    apiFetch<MemberDto>(`/api/basins/${basinId}/members`, { method: "POST", json: input }),
  );

export const useChangeRoleMutation = (basinId: string) =>
  useBasinMutation(basinId, ({ userId, role }: { userId: string; role: BasinRole }) =>
    apiFetch<MemberDto>(`/api/basins/${basinId}/members/${userId}`, { method: "PATCH", json: { role } }),
  );

export const useRemoveMemberMutation = (basinId: string) =>
  useBasinMutation(basinId, (userId: string) =>
    apiFetch<void>(`/api/basins/${basinId}/members/${userId}`, { method: "DELETE" }),
  );

export const useCreateFacilityMutation = (basinId: string) =>
  useBasinMutation(basinId, (input: FacilityCreateInput) =>
    apiFetch<FacilityDto>(`/api/basins/${basinId}/facilities`, { method: "POST", json: input }),
  );

export const useLinkFacilityMutation = (basinId: string) =>
  useBasinMutation(basinId, ({ facilityId, userId }: { facilityId: string; userId: string }) =>
    apiFetch<FacilityDto>(`/api/basins/${basinId}/facilities/${facilityId}/users`, { method: "POST", json: { userId } }),
  );

export const useUnlinkFacilityMutation = (basinId: string) =>
  useBasinMutation(basinId, ({ facilityId, userId }: { facilityId: string; userId: string }) =>
    apiFetch<void>(`/api/basins/${basinId}/facilities/${facilityId}/users/${userId}`, { method: "DELETE" }),
  );

export const useUsersQuery = () =>
  useQuery({ queryKey: queryKeys.users(), queryFn: () => apiFetch<UserDto[]>("/api/users") });

export function useCreateUserMutation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: UserCreateInput) => apiFetch<UserDto>("/api/users", { method: "POST", json: input }),
    onSuccess: () => qc.invalidateQueries({ queryKey: queryKeys.users() }),
  });
}
