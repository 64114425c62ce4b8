"use client";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { FollowDto } from "@/lib/services/follows";
import { apiFetch } from "./fetcher";
import { queryKeys } from "./keys";

const followUrl = (basinId: string) => `/api/basins/${basinId}/follow`;

/** Whether the signed-in person follows the basin; starts from what the page read. */
export const useFollowQuery = (basinId: string, followed: boolean) =>
  useQuery({
    queryKey: queryKeys.basins.follow(basinId),
    queryFn: () => apiFetch<FollowDto>(followUrl(basinId)),
    initialData: { basinId, followed },
  });

/** Follow (true) or unfollow (false); the answer is the new state, so nothing is refetched. */
export function useFollowMutation(basinId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (follow: boolean) => apiFetch<FollowDto>(followUrl(basinId), { method: follow ? "PUT" : "DELETE" }),
    onSuccess: (state) => qc.setQueryData(queryKeys.basins.follow(basinId), state),
  });
}
