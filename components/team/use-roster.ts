"use client";
// The roster as TanStack Query state, and the coach's actions on it; each action refreshes the roster.
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { apiFetch } from "@/lib/client/api";
import { invitationChangedSchema, inviteResultSchema, rosterSchema, type RosterView } from "@/lib/client/responses";
import type { InviteInput } from "@/lib/validation/invitation";

export const rosterKey = (teamId: string) => ["roster", teamId] as const;

export function useRoster(initial: RosterView) {
  const teamId = initial.team.id;
  return useQuery({
    queryKey: rosterKey(teamId),
    queryFn: () => apiFetch(`/api/teams/${teamId}/roster`, { schema: rosterSchema }),
    initialData: initial,
  });
}

export function useRosterActions(teamId: string) {
  const queryClient = useQueryClient();
  const refresh = () => queryClient.invalidateQueries({ queryKey: rosterKey(teamId) });
  const base = `/api/teams/${teamId}`;
  return {
    invite: useMutation({
      mutationFn: (input: InviteInput) => apiFetch(`${base}/invitations`, { method: "POST", body: input, schema: inviteResultSchema }),
      onSettled: refresh,
    }),
    resend: useMutation({
      mutationFn: (invitationId: string) =>
        apiFetch(`${base}/invitations/${invitationId}/resend`, { method: "POST", schema: invitationChangedSchema }),
      onSettled: refresh,
    }),
    revoke: useMutation({
      mutationFn: (invitationId: string) =>
        apiFetch(`${base}/invitations/${invitationId}`, { method: "DELETE", schema: invitationChangedSchema }),
      onSettled: refresh,
    }),
    remove: useMutation({
      mutationFn: (userId: string) => apiFetch(`${base}/members/${userId}`, { method: "DELETE" }),
      onSettled: refresh,
    }),
  };
}

export type RosterActions = ReturnType<typeof useRosterActions>;
