"use client";

import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { apiQuery, operationKey } from "@/lib/api/client";
import { getBuild, getBuildGate } from "@/lib/api/endpoints";

export const buildKey = (id: string) => operationKey(getBuild, { params: { id } });
export const buildGateKey = (id: string) => operationKey(getBuildGate, { params: { id } });

export function useBuild(id: string) {
  return useQuery(apiQuery(getBuild, { params: { id } }));
}

/** The next stage's checklist for the signed-in user, as the server judges it. */
export function useBuildGate(id: string) {
  return useQuery(apiQuery(getBuildGate, { params: { id } }));
}

/** A write on the build that refreshes the page's data and its checklist when it settles. */
export function useBuildMutation<V>(id: string, fn: (v: V) => Promise<unknown>) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: fn,
    onSettled: () => Promise.all([qc.invalidateQueries({ queryKey: buildKey(id) }), qc.invalidateQueries({ queryKey: buildGateKey(id) })]),
  });
}
