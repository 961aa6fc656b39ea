"use client";

import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { apiQuery, operationKey } from "@/lib/api/client";
import { getBuild } from "@/lib/api/operations/builds";

export const buildKey = (id: string) => operationKey(getBuild, { params: { id } });

export function useBuild(id: string) {
  return useQuery(apiQuery(getBuild, { params: { id } }));
}

/** A write on the build that refreshes the page's data when it settles. */
export function useBuildMutation<V>(id: string, fn: (v: V) => Promise<unknown>) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: fn, onSettled: () => qc.invalidateQueries({ queryKey: buildKey(id) }) });
}
